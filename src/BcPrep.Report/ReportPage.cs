using System.Globalization;
using System.Text;
using BcPrep.Pipeline;
using BcPrep.Writing;
using BcPrep.Values;

namespace BcPrep.Report;

/// <summary>
/// The report's one HTML page: self-contained (inline style, no script, nothing fetched from a network), figures
/// referenced by relative path, every text escaped. Order: cautions first, then the day, then each point.
/// </summary>
public static class ReportPage
{
    /// <summary>Quantities in the points table: entries of the one quantity table, which gives each its name and unit.</summary>
    public static readonly IReadOnlyList<ScalarOutput> SummaryQuantities =
    [
        PointOutputs.MassFlow, PointOutputs.InletBulkVelocity, PointOutputs.Reynolds, PointOutputs.InletTemperature, PointOutputs.OutletTemperature,
        PointOutputs.OutletStaticPressure, PointOutputs.HeaterPower, PointOutputs.WallHeatFlux,
    ];

    /// <summary>
    /// The page. <paramref name="dayFigures"/> and <paramref name="pointFigures"/> (by point id) carry paths relative
    /// to the page's folder.
    /// </summary>
    public static string Build(DayResult day, IReadOnlyList<ReportFigure> dayFigures, IReadOnlyDictionary<string, IReadOnlyList<ReportFigure>> pointFigures)
    {
        var html = new StringBuilder();
        var title = "Test-day report: " + day.Rig.Name;
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
            .Append("<title>").Append(HtmlText.Escape(title)).Append("</title>\n<style>\n").Append(Style).Append("</style>\n</head>\n<body>\n");
        html.Append("<h1>").Append(HtmlText.Escape(title)).Append("</h1>\n<p>").Append(HtmlText.Escape(DayLine(day))).Append("</p>\n");
        html.Append("<section class=\"cautions\"><h2>Cautions</h2>\n");
        HtmlText.List(html, Cautions.All);
        html.Append("</section>\n<h2>Warnings of the day</h2>\n");
        HtmlText.List(html, day.Warnings.Concat(day.Calibration?.Warnings ?? []).Concat(day.Matrix?.Warnings ?? []), "warnings");
        html.Append("<h2>Operating points</h2>\n");
        PointsTable(html, day);
        if (day.FailedPoints.Count > 0)
        {
            html.Append("<h3>Points that failed</h3>\n");
            HtmlText.List(html, day.FailedPoints.Select(f => $"{f.Id}: {f.Reason}"), "warnings");
        }
        html.Append("<h2>The day</h2>\n");
        foreach (var figure in dayFigures)
        {
            HtmlText.Figure(html, figure, figure.RelativePath);
        }
        html.Append("<h3>Steady windows</h3>\n");
        DetectionTable(html, day);
        foreach (var point in day.Points)
        {
            PointSection(html, day, point, pointFigures.TryGetValue(point.Id, out var figures) ? figures : []);
        }
        html.Append("</body>\n</html>\n");
        return html.ToString();
    }

    private static string DayLine(DayResult day)
    {
        var start = day.Rig.Log.TimeFormat == Rig.TimeFormat.Iso8601
            ? "first sample " + DateTimeOffset.FromUnixTimeMilliseconds((long)Math.Round(day.Start.FirstSample.Value * 1000.0)).ToString("yyyy-MM-dd HH:mm:ss 'UTC'", CultureInfo.InvariantCulture) + "; "
            : "";
        var spanMin = day.Blocks.TimesS.Length == 0 ? 0.0 : day.Start.Since(new LoggerSeconds(day.Blocks.TimesS[^1])).Value / 60.0;
        return string.Create(CultureInfo.InvariantCulture,
            $"{start}{spanMin:0.#} min of logs; {day.Points.Count} operating point(s); times in minutes since the first sample; values SI, ± U = expanded uncertainty at p = {day.Rig.CoverageProbability}.");
    }

    private static void PointsTable(StringBuilder html, DayResult day)
    {
        var present = SummaryQuantities.Where(q => day.Points.Any(p => p.Output(q) is not null)).ToList();
        var header = new List<string> { "point", "window [min]", "origin" };
        header.AddRange(present.Select(q => $"{q.Name} [{q.Unit}]"));
        header.Add("checks");
        var rows = day.Points.Select(p =>
        {
            var row = new List<string> { p.Id, WindowText(day, p.Window), p.Origin == WindowOrigin.RigFile ? "rig file" : "detected" };
            // A no-break space after '±': a narrow cell wraps before "± U", never between the sign and U.
            row.AddRange(present.Select(q => p.Output(q) is { } o ? MeasurementText.WithUncertainty(o.Estimate, o.ExpandedUncertainty).Replace(" ± ", " ±\u00A0", StringComparison.Ordinal) : "–"));
            // Each check is listed in the point's section; here only the count, to keep rows short.
            row.Add(string.Create(CultureInfo.InvariantCulture, $"{p.Checks.Count(c => c.Passed)} pass, {p.Checks.Count(c => !c.Passed)} warn"));
            return (IReadOnlyList<string>)row;
        });
        HtmlText.Table(html, header, rows, "numbers");
    }

    private static void DetectionTable(StringBuilder html, DayResult day)
    {
        if (day.Detection is not { } detection)
        {
            html.Append("<p>Steady detection was off: every window is pinned in the rig file.</p>\n");
            return;
        }
        var rows = new List<(double StartS, IReadOnlyList<string> Cells)>();
        foreach (var window in detection.Accepted)
        {
            var ids = day.Points.Where(p => day.Start.Since(p.Window.Start).Value < window.StretchEndS && day.Start.Since(p.Window.End).Value > window.StretchStartS).Select(p => p.Id);
            rows.Add((window.StretchStartS, [
                "accepted", string.Join(", ", ids), Minutes(window.StretchStartS) + "–" + Minutes(window.StretchEndS),
                Minutes(window.StartS) + "–" + Minutes(window.EndS), ChoiceSpelling.Names(window.AcceptedBy), "",
            ]));
        }
        foreach (var rejected in detection.Rejected)
        {
            rows.Add((rejected.StartS, [
                "rejected", "", Minutes(rejected.StartS) + "–" + Minutes(rejected.EndS),
                Minutes(rejected.EvaluatedStartS) + "–" + Minutes(rejected.EvaluatedEndS), "", rejected.Reason,
            ]));
        }
        HtmlText.Table(html, ["status", "point", "stretch [min]", "averaging / closest window [min]", "accepted by", "reason"],
            rows.OrderBy(r => r.StartS).Select(r => r.Cells));
    }

    private static void PointSection(StringBuilder html, DayResult day, PointResult point, IReadOnlyList<ReportFigure> figures)
    {
        html.Append("<section class=\"point\" id=\"point-").Append(HtmlText.Escape(point.Id)).Append("\">\n<h2>Operating point ")
            .Append(HtmlText.Escape(point.Id)).Append("</h2>\n<p>")
            .Append(HtmlText.Escape($"averaging window {WindowText(day, point.Window)} min ({(point.Origin == WindowOrigin.RigFile ? "pinned in the rig file" : "detected")})"))
            .Append("</p>\n");
        foreach (var figure in figures)
        {
            HtmlText.Figure(html, figure, figure.RelativePath);
        }
        html.Append("<h3>Consistency checks</h3>\n");
        HtmlText.Table(html, ["check", "verdict", "value", "limit", "unit", "basis"],
            point.Checks.Select(c => (IReadOnlyList<string>)[c.Name, c.Passed ? "pass" : "WARN", HtmlText.Number(c.Value), HtmlText.Number(c.Limit), c.Unit, c.Basis]));
        html.Append("<h3>Conditioning actions</h3>\n");
        HtmlText.Table(html, ["channel", "samples", "missing cells", "bridged samples", "gaps left open", "spikes replaced", "sensor faults"],
            point.Channels.Values.OrderBy(s => s.Channel, StringComparer.Ordinal).Select(s => (IReadOnlyList<string>)[
                s.Channel, Count(s.SampleCount), Count(s.MissingCount), Count(s.BridgedSamples), OpenGaps(s), Count(s.SpikesReplaced),
                s.Faults.Count == 0 ? "none" : string.Join("; ", s.Faults.Select(f => $"{ChoiceSpelling.Name(f.Kind)}: {f.Evidence}")),
            ]), "numbers");
        html.Append("<h3>Warnings</h3>\n");
        HtmlText.List(html, point.Warnings, "warnings");
        html.Append("</section>\n");
    }

    private static string WindowText(DayResult day, TimeWindow window) => Minutes(day.Start.Since(window.Start).Value) + "–" + Minutes(day.Start.Since(window.End).Value);

    private static string Minutes(double seconds) => (seconds / 60.0).ToString("0.0", CultureInfo.InvariantCulture);

    private static string Count(int n) => n.ToString(CultureInfo.InvariantCulture);

    // Our own look: black on white, one grey for rules; readable printed in greyscale. No web fonts, no network.
    private const string Style = """
        body { font-family: "DejaVu Sans", Verdana, sans-serif; color: #111; background: #fff; margin: 2em auto; max-width: 1250px; padding: 0 1em; line-height: 1.4; }
        h1 { border-bottom: 3px solid #111; padding-bottom: .2em; }
        h2 { border-bottom: 1px solid #888; margin-top: 2em; }
        .cautions { border: 2px solid #111; padding: .2em 1em; background: #f2f2f2; }
        .cautions h2 { border: none; margin-top: .5em; }
        .warnings li { list-style: square; }
        table { border-collapse: collapse; margin: .5em 0 1.5em; font-size: 90%; max-width: 100%; }
        th, td { border: 1px solid #999; padding: .25em .5em; text-align: left; vertical-align: top; overflow-wrap: break-word; }
        th { background: #e6e6e6; }
        table.numbers td { font-variant-numeric: tabular-nums; }
        figure { margin: 1em 0; }
        figure img { max-width: 100%; height: auto; border: 1px solid #ccc; }
        figcaption { font-size: 90%; color: #333; }

        """;

    /// <summary>Gaps too long to bridge left open inside the window: "none", or count and seconds with each span.</summary>
    private static string OpenGaps(Pipeline.ChannelWindowStats stats)
    {
        var gaps = stats.Conditioning?.UnbridgedGaps ?? [];
        return gaps.Count == 0 ? "none" : string.Join("; ", gaps.Select(g => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{g.DurationS:F1} s")));
    }

}
