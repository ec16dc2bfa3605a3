using System.Globalization;

namespace BcPrep.Tests.Report;

/// <summary>
/// Every table of the sample day's report fits the page in a 1280 px wide browser window (headless Chromium): it
/// wraps rather than running past the page's column or making the window scroll sideways.
/// </summary>
public sealed class BrowserTableFitTests
{
    private const int WindowWidthPx = 1280;

    // Added to a copy of the page only. After layout it writes, per table, its right edge and the right edge of the
    // body's content box, and the page's scroll width against the window's inner width, into a <pre>.
    private const string Probe = """
        <script>
        window.addEventListener('load', function () {
          var body = document.body, style = getComputedStyle(body);
          var limit = body.getBoundingClientRect().right - parseFloat(style.paddingRight);
          var lines = ['window ' + window.innerWidth + ' ' + document.documentElement.scrollWidth];
          document.querySelectorAll('table').forEach(function (table, i) {
            var wide = table.scrollWidth > table.clientWidth + 1;
            lines.push('table ' + i + ' ' + table.getBoundingClientRect().right.toFixed(1) + ' ' + limit.toFixed(1) + ' ' + (wide ? 'scrolls' : 'whole') +
                       ' ' + (table.querySelector('th') ? table.querySelector('th').textContent : ''));
          });
          var pre = document.createElement('pre');
          pre.id = 'table-check';
          pre.textContent = lines.join('\n');
          body.appendChild(pre);
        });
        </script>
        """;

    [SkippableFact]
    public void Every_table_of_the_sample_report_fits_a_1280_px_window()
    {
        var (_, lines) = ProbedSampleReport.Open(Probe, "table-check", WindowWidthPx);
        var window = lines[0].Split(' ');
        Assert.Equal(WindowWidthPx, int.Parse(window[1], CultureInfo.InvariantCulture));
        var tables = lines.Skip(1).Select(l => l.Split(' ', 5)).ToList();
        // The sample report has the operating points, the steady windows and, per point, checks and conditioning.
        Assert.True(tables.Count >= 2 + (2 * SampleDays.Day.Points.Count), $"only {tables.Count} tables found");
        var overflowing = tables
            .Where(t => double.Parse(t[2], CultureInfo.InvariantCulture) > double.Parse(t[3], CultureInfo.InvariantCulture) + 0.5 || t[4].StartsWith("scrolls", StringComparison.Ordinal))
            .Select(t => $"table {t[1]} (first header '{t[4][(t[4].IndexOf(' ', StringComparison.Ordinal) + 1)..]}') ends at {t[2]} px, the page's column at {t[3]} px")
            .ToList();
        Assert.True(overflowing.Count == 0, string.Join("; ", overflowing));
        Assert.True(int.Parse(window[2], CultureInfo.InvariantCulture) <= WindowWidthPx, $"the page is {window[2]} px wide in a {WindowWidthPx} px window");
    }
}
