using System.Text.Json;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>`process` skips the work when inputs, rig file and tool version match the manifest, and says so.</summary>
public sealed class IncrementalTests
{
    private static readonly DateTime LongAgo = new(2001, 1, 1, 0, 0, 0, DateTimeKind.Utc);

    [Fact]
    public void Second_run_is_up_to_date_and_touches_no_file_while_force_rewrites_them()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var before = SampleDay.Snapshot(outDir);
        foreach (var file in Directory.EnumerateFiles(outDir, "*", SearchOption.AllDirectories))
        {
            File.SetLastWriteTimeUtc(file, LongAgo);
        }

        var again = CliRunner.Run(SampleDay.ProcessArgs(outDir));

        Assert.Equal(0, again.ExitCode);
        Assert.Equal("", again.Out);
        Assert.Contains("up to date", again.Error, StringComparison.Ordinal);
        Assert.All(Directory.EnumerateFiles(outDir, "*", SearchOption.AllDirectories), f => Assert.Equal(LongAgo, File.GetLastWriteTimeUtc(f)));
        Assert.Equal(before, SampleDay.Snapshot(outDir));

        var forced = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--force"));

        Assert.Equal(0, forced.ExitCode);
        Assert.DoesNotContain("up to date", forced.Error, StringComparison.Ordinal);
        Assert.All(Directory.EnumerateFiles(outDir, "*", SearchOption.AllDirectories), f => Assert.True(File.GetLastWriteTimeUtc(f) > LongAgo, f));
        Assert.Equal(before, SampleDay.Snapshot(outDir));
    }

    [Fact]
    public void Changing_one_byte_of_a_log_recomputes()
    {
        using var temp = new TempFolder();
        var morning = temp.File("am.csv");
        File.Copy(SampleDay.Morning, morning);
        var outDir = temp.File("out");
        string[] args = ["process", SampleDay.Rig, morning, SampleDay.Afternoon, "--out", outDir];
        Assert.Equal(0, CliRunner.Run(args).ExitCode);
        var hashBefore = LogHash(outDir, morning);
        var bytes = File.ReadAllBytes(morning);
        var last = bytes.Length - 2;
        Assert.InRange(bytes[last], (byte)'0', (byte)'8');
        bytes[last]++;
        File.WriteAllBytes(morning, bytes);

        var rerun = CliRunner.Run(args);

        Assert.Equal(0, rerun.ExitCode);
        Assert.DoesNotContain("up to date", rerun.Error, StringComparison.Ordinal);
        Assert.Equal(SampleDay.Sha256(bytes), LogHash(outDir, morning));
        Assert.NotEqual(hashBefore, LogHash(outDir, morning));
    }

    [Fact]
    public void An_output_table_edited_by_hand_is_not_up_to_date_and_is_rewritten()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        var wall = Path.Combine(outDir, "points", "OP2", "wall.csv");
        var original = File.ReadAllBytes(wall);
        File.AppendAllText(wall, "1.5,400\n");

        var rerun = CliRunner.Run(SampleDay.ProcessArgs(outDir));

        Assert.Equal(0, rerun.ExitCode);
        Assert.DoesNotContain("up to date", rerun.Error, StringComparison.Ordinal);
        Assert.Equal(original, File.ReadAllBytes(wall));
    }

    private static string LogHash(string outDir, string log)
    {
        using var manifest = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(outDir, "manifest.json")));
        return manifest.RootElement.GetProperty("logs").EnumerateArray().Single(l => l.GetProperty("file").GetString() == log).GetProperty("sha256").GetString()!;
    }
}
