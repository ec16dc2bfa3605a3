using System.Text.RegularExpressions;
using BcPrep.Report;
using BcPrep.Writing;

namespace BcPrep.Tests.Report;

/// <summary>The page references every figure by relative path, fetches nothing, runs no script, escapes every text.</summary>
public sealed partial class ReportPageTests
{
    private static readonly Lazy<DayReportFiles> Report = new(() => DayReport.Build(SampleDays.Day));

    [GeneratedRegex("<img src=\"([^\"]+)\"")]
    private static partial Regex ImageSource();

    [Fact]
    public void Page_shows_every_figure_once_and_nothing_else()
    {
        var sources = ImageSource().Matches(Report.Value.Html).Select(m => m.Groups[1].Value).ToList();

        Assert.Equal(Report.Value.Figures.Select(f => f.RelativePath).Order(StringComparer.Ordinal), sources.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Page_is_offline_with_no_script_and_carries_the_cautions_checks_and_conditioning()
    {
        var html = Report.Value.Html;

        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("http://", html, StringComparison.Ordinal);
        Assert.DoesNotContain("https://", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("@import", html, StringComparison.Ordinal);
        foreach (var caution in Cautions.All)
        {
            Assert.Contains(System.Net.WebUtility.HtmlEncode(caution), html, StringComparison.Ordinal);
        }
        foreach (var point in SampleDays.Day.Points)
        {
            Assert.Contains($"<h2>Operating point {point.Id}</h2>", html, StringComparison.Ordinal);
            foreach (var check in point.Checks)
            {
                Assert.Contains($"<td>{System.Net.WebUtility.HtmlEncode(check.Name)}</td><td>{(check.Passed ? "pass" : "WARN")}</td>", html, StringComparison.Ordinal);
            }
        }
        Assert.Contains("<h3>Conditioning actions</h3>", html, StringComparison.Ordinal);
        Assert.Contains("<th>spikes replaced</th>", html, StringComparison.Ordinal);
        // The sample day's detection rejects the warm-up stretch: its reason appears in the steady-window table.
        Assert.Contains("<td>rejected</td>", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Text_from_the_rig_file_is_escaped()
    {
        var day = SampleDays.Day;
        var hostile = day with { Rig = day.Rig with { Name = "<img src=x onerror=alert(1)> & \"rig\"" } };

        var html = ReportPage.Build(hostile, [], new Dictionary<string, IReadOnlyList<ReportFigure>>());

        Assert.Contains("&lt;img src=x onerror=alert(1)&gt; &amp; &quot;rig&quot;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<img src=x", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Operating_points_are_shown_rounded_to_their_uncertainty_and_no_number_is_in_e_notation()
    {
        var html = Report.Value.Html;
        var point = SampleDays.Day.Points[0];
        var flow = point.Output("mass_flow")!;

        // JCGM 100 7.2.6 through the one shared formatter: U to two significant digits, the value to its place.
        var cell = MeasurementText.WithUncertainty(flow.Estimate, flow.ExpandedUncertainty).Replace(" ± ", " ±\u00A0", StringComparison.Ordinal);
        Assert.Matches(@"^0\.0\d+ ±\u00A00\.000\d\d$", cell);
        Assert.Contains($"<td>{System.Net.WebUtility.HtmlEncode(cell)}</td>", html, StringComparison.Ordinal);
        // The page's text (tags and the style sheet aside) has no 4E+02 or 7.18E-05.
        var text = Regex.Replace(html, "<style>.*?</style>|<[^>]+>", " ", RegexOptions.Singleline);
        Assert.DoesNotMatch(@"\d[eE][+-]?\d", text);
    }

    [Fact]
    public void Files_put_the_figures_and_the_page_under_the_report_folder()
    {
        var files = Report.Value.Files(DayReport.Folder).ToList();

        Assert.Equal(Report.Value.Figures.Count + 1, files.Count);
        Assert.All(files, f => Assert.StartsWith("report/", f.RelativePath, StringComparison.Ordinal));
        Assert.Equal("report/index.html", files[^1].RelativePath);
    }
}
