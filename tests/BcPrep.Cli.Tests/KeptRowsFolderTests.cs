using System.Diagnostics;
using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// The rows kept back during the read of a single-logger day go to temporary files in the system's temporary folder
/// (TMPDIR). When that folder cannot take them, the run stops with one clear line and exit 5, and leaves the output
/// folder as it was.
/// </summary>
public sealed class KeptRowsFolderTests
{
    private static (int Code, string Out, string Error) RunWithTmpdir(string tmpdir, params string[] args)
    {
        var info = BuiltBinary.StartInfo(args);
        info.Environment["TMPDIR"] = tmpdir;
        using var process = Process.Start(info)!;
        process.StandardInput.Close();
        var error = process.StandardError.ReadToEndAsync();
        var output = process.StandardOutput.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(3)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail("bcprep did not finish within 3 minutes");
        }
        return (process.ExitCode, output.Result, error.Result);
    }

    [Fact]
    public void A_temporary_folder_that_does_not_exist_exits_5_naming_it_and_leaves_the_outputs_as_they_were()
    {
        using var temp = new TempFolder();
        var rig = temp.File("detecting-rig.toml");
        File.WriteAllText(rig, SampleDay.RigWithoutPinnedPoints());
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run("process", rig, SampleDay.Morning, SampleDay.Afternoon, "--out", outDir).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        var missing = temp.File("no-such-folder");

        var run = RunWithTmpdir(missing, "process", rig, SampleDay.Morning, SampleDay.Afternoon, "--out", outDir, "--force");
        var fresh = RunWithTmpdir(missing, "process", rig, SampleDay.Morning, SampleDay.Afternoon, "--out", temp.File("new-out"));

        Assert.Equal(ExitCodes.OutputFailure, run.Code);
        Assert.Equal("", run.Out);
        var line = Assert.Single(run.Error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith("error: " + missing, line, StringComparison.Ordinal);
        Assert.Contains("TMPDIR", line, StringComparison.Ordinal);
        Assert.Equal(before, SampleDay.Snapshot(outDir));
        Assert.Equal(ExitCodes.OutputFailure, fresh.Code);
        Assert.False(Directory.Exists(temp.File("new-out")));
    }
}
