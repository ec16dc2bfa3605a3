using System.Diagnostics;
using System.Globalization;
using System.Text;
using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;
using Xunit.Abstractions;

namespace BcPrep.Tests.Cli;

/// <summary>
/// Outputs are committed in two phases (OutputFileSet): an interrupted or failed run leaves the previous outputs
/// intact, or, if it dies during the final renames, a folder without manifest; temporaries of a dead run are never
/// outputs and the next run removes them. The kill tests run the built binary as a real process.
/// </summary>
public sealed class CrashSafetyTests(ITestOutputHelper output)
{
    [Fact]
    public async Task Killing_a_run_while_it_reads_a_large_day_leaves_the_previous_outputs_intact()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        var large = LargeDay(temp, copies: 40);

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
    public void Killing_a_run_while_it_writes_never_leaves_a_manifest_beside_files_it_does_not_describe()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        var previousKey = RunKey(outDir);
        var large = LargeDay(temp, copies: 4);

        // The commit takes milliseconds, so polling may miss it: a run that finished unseen is undone and tried again.
        var sawPartial = false;
        for (var attempt = 0; attempt < 6 && !sawPartial; attempt++)
        {
            using var process = Process.Start(BuiltBinary.StartInfo(["process", SampleDay.Rig, .. large, "--out", outDir]))!;
            var watch = Stopwatch.StartNew();
            while (!process.HasExited && watch.Elapsed < TimeSpan.FromMinutes(3))
            {
                if (Directory.EnumerateFiles(outDir, "*.partial-*", SearchOption.AllDirectories).Any())
                {
                    process.Kill(entireProcessTree: true);
                    sawPartial = true;
                    break;
                }
            }
            process.WaitForExit();
            if (!sawPartial)
            {
                Directory.Delete(outDir, recursive: true);
                Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
                Assert.Equal(before, SampleDay.Snapshot(outDir));
            }
        }

        Assert.True(sawPartial, "the run ended before its commit was seen; the kill did not happen mid-write");
        var manifest = Path.Combine(outDir, "manifest.json");
        if (File.Exists(manifest))
        {
            // A manifest always describes the files beside it (hashes checked), whichever run wrote it.
            var key = RunKey(outDir);
            Assert.True(ExistingOutputs.IsUpToDate(outDir, key), "the manifest does not describe the files beside it");
            if (key == previousKey)
            {
                // Killed before the renames (nearly always): the previous outputs, byte for byte.
                var after = SampleDay.Snapshot(outDir);
                Assert.All(before, b => Assert.Equal(b.Value, after[b.Key]));
            }
            output.WriteLine(key == previousKey ? "killed before the renames: previous outputs intact" : "killed after the commit: new outputs complete");
        }
        else
        {
            output.WriteLine("killed during the renames: no manifest, folder marked incomplete");
        }
        var leftovers = Directory.EnumerateFiles(outDir, "*.partial-*", SearchOption.AllDirectories).ToList();
        Assert.All(leftovers, f => Assert.True(BcPrep.Writing.OutputFileSet.IsPartialFileName(Path.GetFileName(f)), f));

        var next = CliRunner.Run(SampleDay.ProcessArgs(outDir));

        Assert.Equal(0, next.ExitCode);
        Assert.Empty(Directory.EnumerateFiles(outDir, "*.partial-*", SearchOption.AllDirectories));
        Assert.Equal(before, SampleDay.Snapshot(outDir));
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
        File.WriteAllText(Path.Combine(outDir, "notes.partial-draft"), "the user's own file");

        var upToDate = CliRunner.Run(SampleDay.ProcessArgs(outDir));

        Assert.Contains("up to date", upToDate.Error, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(outDir, "summary.csv.partial-999999")));
        Assert.False(File.Exists(Path.Combine(outDir, "points", "OP1", "wall.csv.partial-12")));

        File.WriteAllText(Path.Combine(outDir, "points", "OP3", "budget.csv.partial-77"), "half a tab");
        var forced = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--force"));

        Assert.Equal(0, forced.ExitCode);
        Assert.False(File.Exists(Path.Combine(outDir, "points", "OP3", "budget.csv.partial-77")));
        Assert.Equal("the user's own file", File.ReadAllText(Path.Combine(outDir, "notes.partial-draft")));
        File.Delete(Path.Combine(outDir, "notes.partial-draft"));
        Assert.Equal(before, SampleDay.Snapshot(outDir));
    }

    [Fact]
    public void A_commit_that_fails_while_writing_exits_5_and_leaves_the_previous_outputs_and_no_temporaries()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        // A fourth point whose folder cannot be created because a regular file holds its name.
        var rig = temp.File("rig.toml");
        File.WriteAllText(rig, File.ReadAllText(SampleDay.Rig) + "\n[[point]]\nid = \"OP4\"\nstart = \"120 min\"\nend = \"130 min\"\n");
        File.WriteAllText(Path.Combine(outDir, "points", "OP4"), "blocker");

        var run = CliRunner.Run("process", rig, SampleDay.Morning, SampleDay.Afternoon, "--out", outDir);

        Assert.Equal(5, run.ExitCode);
        Assert.Contains("cannot write the outputs", run.Error, StringComparison.Ordinal);
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
