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
}
