using System.Text.Json;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>`process --report` commits the report with the tables: listed and hashed in the manifest, and part of the run key.</summary>
public sealed class ReportOptionTests
{
    [Fact]
    public void Report_files_are_listed_and_hashed_in_the_manifest()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");

        var run = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--report"));

        Assert.Equal(0, run.ExitCode);
        Assert.Equal("", run.Out);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        var listed = manifest.RootElement.GetProperty("files").EnumerateArray().Select(f => f.GetString()!).ToList();
        var onDisk = SampleDay.Snapshot(outDir);
        var reportFiles = onDisk.Keys.Where(k => k.StartsWith("report/", StringComparison.Ordinal)).ToList();
        Assert.Contains("report/index.html", reportFiles);
        // Three key channels over the day, and per point (three) the velocity profile and five budgets.
        Assert.Equal(3 + (3 * 6), reportFiles.Count(f => f.EndsWith(".png", StringComparison.Ordinal)));
        var hashes = manifest.RootElement.GetProperty("file_sha256");
        foreach (var file in reportFiles)
        {
            Assert.Contains(file, listed);
            Assert.Equal(SampleDay.Sha256(onDisk[file]), hashes.GetProperty(file).GetString());
        }
    }

    [Fact]
    public void Without_the_option_no_report_is_written_and_asking_for_it_later_recomputes()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);
        Assert.False(Directory.Exists(Path.Combine(outDir, "report")));

        var withReport = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--report"));

        Assert.Equal(0, withReport.ExitCode);
        Assert.DoesNotContain("up to date", withReport.Error, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(outDir, "report", "index.html")));
        var again = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--report"));
        Assert.Contains("up to date", again.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_run_without_the_option_removes_the_earlier_report_so_the_folder_holds_what_its_manifest_lists()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir, "--report")).ExitCode);

        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(outDir)).ExitCode);

        // The result is replaced as a whole, so the report folder goes with the earlier result.
        Assert.False(Directory.Exists(Path.Combine(outDir, "report")));
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        Assert.DoesNotContain(manifest.RootElement.GetProperty("files").EnumerateArray(), f => f.GetString()!.StartsWith("report/", StringComparison.Ordinal));
    }
}
