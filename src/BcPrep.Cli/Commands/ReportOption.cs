using System.CommandLine;
using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Report;

namespace BcPrep.Cli.Commands;

/// <summary>
/// <c>process --report</c>: also write the test-day report (figures and one offline HTML page) under
/// <c>report/</c>, in the same commit as the tables, so the manifest lists and hashes it.
/// </summary>
public static class ReportOption
{
    public static Option<bool> Create() => new("--report")
    {
        Description = "Also write a report for a person: PNG figures and report/index.html (offline, no network), listed in the manifest.",
    };

    /// <summary>The choice recorded in the run key: a run with the report is not up to date for one without, and back.</summary>
    public static IEnumerable<string> Choices(bool report) => report ? ["report"] : [];

    /// <summary>The report's files under report/, or none when the option is off.</summary>
    public static IEnumerable<(string RelativePath, byte[] Content)> Files(bool report, DayResult day, Diagnostics diagnostics)
    {
        if (!report)
        {
            return [];
        }
        var files = DayReport.Build(day);
        diagnostics.Detail(string.Create(CultureInfo.InvariantCulture, $"report: {files.Figures.Count} figures and {DayReport.Folder}{DayReport.PageName}"));
        return files.Files(DayReport.Folder).ToList();
    }

    /// <summary>
    /// Report files the previous manifest in <paramref name="outputDirectory"/> listed and the new run does not write
    /// (a report no longer asked for, a point that is gone). Read before the commit, which replaces that manifest.
    /// </summary>
    public static IReadOnlyList<string> Superseded(string outputDirectory, IEnumerable<string> newFiles)
    {
        var keep = newFiles.ToHashSet(StringComparer.Ordinal);
        return ExistingOutputs.ListedFiles(outputDirectory)
            .Where(f => f.StartsWith(DayReport.Folder, StringComparison.Ordinal) && !keep.Contains(f))
            .ToList();
    }

    /// <summary>
    /// Deletes superseded report files after the commit, so that the folder holds the files its manifest lists.
    /// Only paths inside <c>report/</c> are touched; a file already gone is fine.
    /// </summary>
    public static void RemoveSuperseded(string outputDirectory, IReadOnlyList<string> superseded)
    {
        var reportRoot = Path.GetFullPath(Path.Combine(outputDirectory, DayReport.Folder));
        foreach (var relative in superseded)
        {
            var path = Path.GetFullPath(Path.Combine(outputDirectory, relative));
            if (!path.StartsWith(reportRoot, StringComparison.Ordinal))
            {
                continue;
            }
            try
            {
                File.Delete(path);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw new BcPrepFailure(FailureKind.Output, new SourceLocation(outputDirectory), $"cannot remove the superseded report file {relative}: {e.Message}");
            }
        }
    }
}
