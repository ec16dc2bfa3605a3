using System.Diagnostics;
using System.Globalization;
using System.Text;
using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// An interrupted or failed run leaves the previous outputs intact; temporaries of a dead run are never outputs and
/// the next run removes them. The kill test runs the built binary as a real process; ResultFolderTests kills the
/// commit at each of its steps.
/// </summary>
public sealed class CrashSafetyTests
{
    [Fact]
    public async Task Killing_a_run_while_it_reads_a_large_day_leaves_the_previous_outputs_intact()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        var large = LargeDay(temp, copies: 25);

        using var process = Process.Start(BuiltBinary.StartInfo(["process", SampleDay.Rig, .. large, "--out", outDir, "--verbose"]))!;
        var started = await process.StandardError.ReadLineAsync().WaitAsync(TimeSpan.FromSeconds(60));
        Assert.Contains("reading", started, StringComparison.Ordinal);
        await Task.Delay(50);
        Assert.False(process.HasExited, "the run finished before it could be interrupted; make the day larger");
        process.Kill(entireProcessTree: true);
        process.WaitForExit();

        Assert.Equal(before, SampleDay.Snapshot(outDir));
        var again = CliRunner.Run(SampleDay.ProcessArgs(outDir));
        Assert.Contains("up to date", again.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Stale_temporary_files_are_never_outputs_and_the_next_run_removes_them()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        File.WriteAllText(Path.Combine(outDir, "summary.csv.partial-999999"), "half a tab");
        File.WriteAllText(Path.Combine(outDir, "points", "OP1", "wall.csv.partial-12"), "half a tab");

        var upToDate = CliRunner.Run(SampleDay.ProcessArgs(outDir));

        Assert.Contains("up to date", upToDate.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(outDir, "summary.csv.partial-999999")));
        Assert.False(File.Exists(Path.Combine(outDir, "points", "OP1", "wall.csv.partial-12")));

        File.WriteAllText(Path.Combine(outDir, "points", "OP3", "budget.csv.partial-77"), "half a tab");
        var forced = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--force"));

        Assert.Equal(0, forced.ExitCode);
        Assert.False(File.Exists(Path.Combine(outDir, "points", "OP3", "budget.csv.partial-77")));
        Assert.Equal(before, SampleDay.Snapshot(outDir));
    }

    [Fact]
    public void A_folder_holding_a_file_its_manifest_does_not_list_exits_5_and_is_left_untouched()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        // A fourth point whose folder name a regular file holds: not part of the earlier result, so the folder is not ours.
        var rig = temp.File("rig.toml");
        File.WriteAllText(rig, File.ReadAllText(SampleDay.Rig) + "\n[[point]]\nid = \"OP4\"\nstart = \"120 min\"\nend = \"130 min\"\n");
        File.WriteAllText(Path.Combine(outDir, "points", "OP4"), "blocker");

        var run = CliRunner.Run("process", rig, SampleDay.Morning, SampleDay.Afternoon, "--out", outDir);

        Assert.Equal(5, run.ExitCode);
        Assert.Contains("cannot write the outputs: it holds 'points/OP4', which the earlier result's manifest.json does not list", run.Error, StringComparison.Ordinal);
        Assert.Equal("blocker", File.ReadAllText(Path.Combine(outDir, "points", "OP4")));
        File.Delete(Path.Combine(outDir, "points", "OP4"));
        Assert.Equal(before, SampleDay.Snapshot(outDir));
    }

    [Theory]
    [InlineData("summary.csv.partial-4711", true)]
    [InlineData("manifest.json.partial-1", true)]
    [InlineData("summary.csv", false)]
    [InlineData("notes.partial-draft", false)]
    [InlineData("summary.csv.partial-", false)]
    [InlineData(".partial-12", false)]
    public void Temporary_names_are_recognised_exactly(string name, bool expected) =>
        Assert.Equal(expected, BcPrep.Writing.OutputFileSet.IsPartialFileName(name));

    /// <summary>
    /// The sample morning, then the sample afternoon followed by <paramref name="copies"/> further copies of it shifted
    /// on in time (one logger, several files): the pinned points stay where they are, the day just gets longer.
    /// </summary>
    private static string[] LargeDay(TempFolder temp, int copies)
    {
        var afternoon = File.ReadAllLines(SampleDay.Afternoon);
        var first = DateTime.Parse(afternoon[1].Split(',')[0], CultureInfo.InvariantCulture);
        var last = DateTime.Parse(afternoon[^1].Split(',')[0], CultureInfo.InvariantCulture);
        var span = last - first + TimeSpan.FromSeconds(0.5);
        var files = new List<string> { SampleDay.Morning, SampleDay.Afternoon };
        for (var k = 1; k <= copies; k++)
        {
            var text = new StringBuilder(afternoon[0]).Append('\n');
            foreach (var line in afternoon.Skip(1))
            {
                var comma = line.IndexOf(',', StringComparison.Ordinal);
                var time = DateTime.Parse(line[..comma], CultureInfo.InvariantCulture) + (k * span);
                text.Append(time.ToString("yyyy-MM-dd'T'HH:mm:ss.fff", CultureInfo.InvariantCulture)).Append(line.AsSpan(comma)).Append('\n');
            }
            var path = temp.File($"extra-{k:D2}.csv");
            File.WriteAllText(path, text.ToString());
            files.Add(path);
        }
        return [.. files];
    }

    private static string RunKey(string outDir)
    {
        using var manifest = System.Text.Json.JsonDocument.Parse(File.ReadAllBytes(Path.Combine(outDir, "manifest.json")));
        return manifest.RootElement.GetProperty("run_key").GetString()!;
    }
}
