using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Rig;
using ScottPlot;
using BcPrep.Values;

namespace BcPrep.Report;

/// <summary>
/// One channel over the whole day: its block means against minutes since the day's first sample, every operating
/// point's averaging window shaded dark with its id above it, the steady stretch it came from shaded light, and every
/// rejected candidate stretch hatched with a dashed border and labelled "rejected".
/// </summary>
public static class DayChannelFigure
{
    /// <summary>
    /// The channels drawn over the day: the steady-detection keys of the rig file, in their order; without keys, the
    /// mass-flow and inlet bulk-temperature channels, so that a day with pinned points still gets a picture.
    /// </summary>
    public static IReadOnlyList<string> Channels(DayResult day)
    {
        var keys = day.Rig.Steady.Keys.Select(k => k.Channel).Where(day.Blocks.Means.ContainsKey).Distinct(StringComparer.Ordinal).ToList();
        if (keys.Count > 0)
        {
            return keys;
        }
        return day.Rig.Channels
            .Where(c => c.Role == ChannelRole.MassFlow || (c.Role == ChannelRole.BulkTemperature && c.Plane == "inlet" && c.RadiusM is null))
            .Select(c => c.Id).Where(day.Blocks.Means.ContainsKey).ToList();
    }

    /// <summary>The figure of <paramref name="channel"/>; throws <see cref="ArgumentException"/> for a channel with no block means.</summary>
    public static ReportFigure Render(DayResult day, string channel, string relativePath)
    {
        if (!day.Blocks.Means.TryGetValue(channel, out var means))
        {
            throw new ArgumentException($"channel '{channel}' has no block means", nameof(channel));
        }
        var spec = day.Rig.Channel(channel);
        var unit = spec is null ? "" : UnitText.SiSymbol(spec.Dimension);
        var plot = FigureRendering.NewPlot();
        ShadeStretches(plot, day);
        AddTrace(plot, day, means);
        LabelPoints(plot, day, means);
        var title = $"{channel} over the day" + (spec is null ? "" : $" ({Words(spec.Role)})");
        plot.Title(title);
        plot.XLabel("time since the first sample [min]");
        plot.YLabel(unit.Length == 0 ? channel : $"{channel} [{unit}]");
        var caption = $"{channel}: {day.Rig.Steady.BlockS.ToString("0.###", CultureInfo.InvariantCulture)} s block means over the day; dark shading = averaging window of an operating point, light shading = its steady stretch, hatched = rejected candidate stretch.";
        var (png, area) = FigureRendering.PngWithArea(plot, ReportStyle.DayWidthPx, ReportStyle.DayHeightPx);
        return new ReportFigure(relativePath, caption, ReportStyle.DayWidthPx, ReportStyle.DayHeightPx, png) { Area = area };
    }

    private static void AddTrace(Plot plot, DayResult day, double[] means)
    {
        var times = day.Blocks.TimesS;
        if (times.Length == 0)
        {
            return;
        }
        // Block means lie on a uniform grid, the case Signal draws fastest. A block without samples has a NaN mean, and
        // one NaN in a Signal makes the library drop the whole line, so each finite run is a Signal of its own: the
        // trace breaks at a missing block and goes on after it. A run of one block is drawn as a dot.
        var periodMin = times.Length > 1 ? (times[1] - times[0]) / 60.0 : day.Rig.Steady.BlockS / 60.0;
        var originMin = day.Start.Since(new LoggerSeconds(times[0])).Value / 60.0;
        foreach (var (start, length) in TraceRuns.Finite(means))
        {
            if (length == 1)
            {
                var dot = plot.Add.Marker(originMin + (start * periodMin), means[start]);
                dot.Color = ReportStyle.Ink;
                dot.Size = 3;
                continue;
            }
            var signal = plot.Add.Signal(means[start..(start + length)], periodMin);
            signal.Data.XOffset = originMin + (start * periodMin);
            signal.Color = ReportStyle.Ink;
            signal.LineWidth = 1.5f;
        }
    }

    private static void ShadeStretches(Plot plot, DayResult day)
    {
        foreach (var window in day.Detection?.Accepted ?? [])
        {
            var stretch = plot.Add.HorizontalSpan(window.StretchStartS / 60.0, window.StretchEndS / 60.0);
            stretch.FillColor = ReportStyle.SteadyStretch;
            stretch.LineColor = Colors.Transparent;
        }
        foreach (var rejected in day.Detection?.Rejected ?? [])
        {
            var span = plot.Add.HorizontalSpan(rejected.StartS / 60.0, rejected.EndS / 60.0);
            // A fully transparent fill switches the hatch off too, so the fill is a faint white.
            span.FillStyle.Color = Colors.White.WithAlpha(0.25);
            span.FillStyle.Hatch = new ScottPlot.Hatches.Striped();
            span.FillStyle.HatchColor = ReportStyle.Rejected.WithAlpha(0.55);
            span.LineStyle.Color = ReportStyle.Rejected;
            span.LineStyle.Width = 1;
            span.LineStyle.Pattern = LinePattern.Dashed;
        }
        foreach (var point in day.Points)
        {
            var window = plot.Add.HorizontalSpan(day.Start.Since(point.Window.Start).Value / 60.0, day.Start.Since(point.Window.End).Value / 60.0);
            window.FillColor = ReportStyle.AveragingWindow;
            window.LineColor = ReportStyle.Secondary;
            window.LineWidth = 1;
        }
    }

    private static void LabelPoints(Plot plot, DayResult day, double[] means)
    {
        var finite = means.Where(double.IsFinite).ToArray();
        if (finite.Length == 0)
        {
            return;
        }
        var top = finite.Max();
        var bottom = finite.Min();
        var height = top > bottom ? top - bottom : Math.Max(Math.Abs(top), 1.0);
        var labelY = top + 0.08 * height;
        foreach (var point in day.Points)
        {
            var middle = day.Start.Since(new LoggerSeconds((point.Window.StartS + point.Window.EndS) / 2.0)).Value / 60.0;
            var text = plot.Add.Text(point.Id, middle, labelY);
            text.LabelFontSize = 13;
            text.LabelBold = true;
            text.LabelFontColor = ReportStyle.Ink;
            text.LabelAlignment = Alignment.LowerCenter;
        }
        foreach (var rejected in day.Detection?.Rejected ?? [])
        {
            var text = plot.Add.Text("rejected", (rejected.StartS + rejected.EndS) / 120.0, labelY);
            text.LabelFontSize = 11;
            text.LabelFontColor = ReportStyle.Secondary;
            text.LabelAlignment = Alignment.LowerCenter;
        }
        // Room above the trace for the labels.
        plot.Axes.SetLimitsY(bottom - 0.08 * height, top + 0.25 * height);
    }

    private static string Words(ChannelRole role)
    {
        var name = role.ToString();
        var words = string.Concat(name.Select((c, i) => i > 0 && char.IsUpper(c) ? " " + char.ToLowerInvariant(c) : char.ToLowerInvariant(c).ToString()));
        return words.ToString(CultureInfo.InvariantCulture);
    }
}
