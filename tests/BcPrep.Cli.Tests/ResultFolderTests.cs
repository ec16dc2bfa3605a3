using System.Diagnostics;
using System.Security.Cryptography;
using System.Text.Json;
using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;
using BcPrep.Writing;
using Xunit.Abstractions;

namespace BcPrep.Tests.Cli;

/// <summary>
/// The output folder belongs to BcPrep and always holds one complete result: the previous one or the new one, never
/// a mix, never old points beside new ones, never a second run's files interleaved (ResultFolder). The crash
/// window is tested by killing the real process outright at every step of the commit.
/// </summary>
public sealed class ResultFolderTests(ITestOutputHelper output)
{
    [Fact]
    public void A_day_with_fewer_points_into_the_same_folder_leaves_exactly_its_own_points()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        var fourPoints = FourPointRig(temp);
        Assert.Equal(0, CliRunner.Run("process", fourPoints, SampleDay.Morning, SampleDay.Afternoon, "--out", outDir).ExitCode);
        Assert.True(Directory.Exists(Path.Combine(outDir, "points", "OP4")));

        var run = CliRunner.Run(SampleDay.ProcessArgs(outDir));

        Assert.Equal(0, run.ExitCode);
        Assert.Equal(["OP1", "OP2", "OP3"], Directory.GetDirectories(Path.Combine(outDir, "points")).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        AssertExactlyTheManifestsFiles(outDir);
        Assert.Empty(Directory.GetFileSystemEntries(temp.Path, ".out.bcprep-*"));
    }

    [Fact]
    public async Task A_second_run_into_a_folder_in_use_is_refused_naming_the_first_runs_process_and_the_first_completes()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        var info = BuiltBinary.StartInfo(SampleDay.ProcessArgs(outDir, "--force"));
        info.Environment[CommitHook.WaitVariable] = "1";
        using var first = Process.Start(info)!;
        var stdout = first.StandardOutput.ReadToEndAsync();
        var announced = await first.StandardError.ReadLineAsync().WaitAsync(TimeSpan.FromMinutes(3));
        Assert.Contains("waiting until standard input closes", announced, StringComparison.Ordinal);

        var second = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--force"));

        first.StandardInput.Close();
        Assert.True(first.WaitForExit(TimeSpan.FromMinutes(2)));
        output.WriteLine(second.Error);
        Assert.Equal(5, second.ExitCode);
        Assert.Contains($"the folder is in use by process {first.Id} (another bcprep run", second.Error, StringComparison.Ordinal);
        Assert.Equal(0, first.ExitCode);
        Assert.Equal("", await stdout);
        Assert.Equal(before, SampleDay.Snapshot(outDir));
        Assert.False(File.Exists(Path.Combine(outDir, ResultFolder.LockFileName)));
    }

    /// <summary>
    /// The previous result has four points, the new one three: at whichever step the run dies, the folder is one
    /// complete result (every file its manifest lists, with its hash, and nothing else), and the next run leaves no
    /// trace of the dead one. With <c>BCPREP_NO_EXCHANGE=1</c> the two-rename fallback is tested; a death between its
    /// renames leaves the old result aside, and the next run puts it back before anything else.
    /// </summary>
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public async Task Killing_the_run_at_every_step_of_the_commit_leaves_one_complete_result_old_or_new(bool fallback)
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        var fourPoints = FourPointRig(temp);
        string[] oldArgs = ["process", fourPoints, SampleDay.Morning, SampleDay.Afternoon, "--out", outDir, "--force"];
        Assert.Equal(0, CliRunner.Run(oldArgs).ExitCode);
        var oldResult = SampleDay.Snapshot(outDir);
        var newDir = temp.File("expected-new");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(newDir)).ExitCode);
        var newResult = SampleDay.Snapshot(newDir);
        Directory.Delete(newDir, recursive: true);

        var step = 1;
        for (; step < 40; step++)
        {
            var info = BuiltBinary.StartInfo(SampleDay.ProcessArgs(outDir, "--force"));
            info.Environment[CommitHook.KillVariable] = step.ToString(System.Globalization.CultureInfo.InvariantCulture);
            if (fallback)
            {
                info.Environment["BCPREP_NO_EXCHANGE"] = "1";
            }
            using var process = Process.Start(info)!;
            process.StandardInput.Close();
            var error = process.StandardError.ReadToEndAsync();
            _ = process.StandardOutput.ReadToEndAsync();
            Assert.True(process.WaitForExit(TimeSpan.FromMinutes(3)));
            if (process.ExitCode == 0)
            {
                break;
            }
            Assert.True(process.ExitCode == 137, $"step {step}: exit {process.ExitCode}: {await error}");

            var state = Directory.Exists(outDir) ? SampleDay.Snapshot(outDir) : null;
            var which = state is null ? "aside" : Same(state, oldResult) ? "old" : Same(state, newResult) ? "new" : "MIXED";
            output.WriteLine($"killed at commit step {step}: the folder holds the {which} result");
            if (state is null)
            {
                Assert.True(fallback, $"step {step}: the folder is gone");
                var aside = Directory.GetDirectories(temp.Path, ".out.bcprep-old-*").Single();
                Assert.True(Same(SampleDay.Snapshot(aside), oldResult), $"step {step}: the result set aside is not the complete old one");
            }
            else
            {
                Assert.True(which is "old" or "new", $"step {step}: the folder holds neither complete result");
            }

            // The next run takes over the folder (recovering a result set aside), and leaves no trace of the dead one.
            var next = CliRunner.Run(oldArgs);
            Assert.True(next.ExitCode == 0, next.Error);
            Assert.True(Same(SampleDay.Snapshot(outDir), oldResult), $"step {step}: the next run did not restore the old result");
            Assert.Empty(Directory.GetFileSystemEntries(temp.Path, ".out.bcprep-*"));
            Assert.False(File.Exists(Path.Combine(outDir, ResultFolder.LockFileName)));
        }

        output.WriteLine($"the commit has {step - 1} steps");
        Assert.True(step - 1 >= 6, $"only {step - 1} commit steps were interrupted");
        Assert.True(Same(SampleDay.Snapshot(outDir), newResult));
        Assert.Empty(Directory.GetFileSystemEntries(temp.Path, ".out.bcprep-*"));
    }

    private static bool Same(SortedDictionary<string, byte[]> a, SortedDictionary<string, byte[]> b) =>
        a.Keys.SequenceEqual(b.Keys, StringComparer.Ordinal) && a.All(kv => kv.Value.AsSpan().SequenceEqual(b[kv.Key]));

    private static string FourPointRig(TempFolder temp)
    {
        var rig = temp.File("rig-four-points.toml");
        File.WriteAllText(rig, File.ReadAllText(SampleDay.Rig) + "\n[[point]]\nid = \"OP4\"\nstart = \"120 min\"\nend = \"130 min\"\n");
        return rig;
    }

    /// <summary>Every file under the folder is listed in its manifest with the hash it records, and every listed file is there.</summary>
    private static void AssertExactlyTheManifestsFiles(string outDir)
    {
        using var manifest = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(outDir, "manifest.json")));
        var listed = manifest.RootElement.GetProperty("files").EnumerateArray().Select(f => f.GetString()!).Order(StringComparer.Ordinal).ToList();
        var present = Directory.GetFiles(outDir, "*", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(outDir, f).Replace('\\', '/')).Order(StringComparer.Ordinal).ToList();
        Assert.Equal(listed, present);
        var hashes = manifest.RootElement.GetProperty("file_sha256");
        foreach (var file in listed.Where(f => f != "manifest.json"))
        {
            Assert.Equal(hashes.GetProperty(file).GetString(), Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(Path.Combine(outDir, file)))));
        }
    }
}
