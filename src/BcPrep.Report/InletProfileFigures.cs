using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Rig;
using ScottPlot;

namespace BcPrep.Report;

/// <summary>
/// The inlet profiles of one operating point against the radius: the axial velocity u(r), and with a radial rake the
/// temperature T(r), each as a line with markers inside a grey band of ± the expanded uncertainty U of each profile
/// point (its own k, at the rig's coverage probability).
/// </summary>
public static class InletProfileFigures
{
    /// <summary>u(r) with its ±U band; r in mm from the axis (a figure is an edge, where a person's units are fine).</summary>
    public static ReportFigure Velocity(DayResult day, PointResult point, string relativePath)
    {
        var radiusM = point.Nominal.Velocity.Profile.RadiusM;
        var outputs = Enumerable.Range(0, radiusM.Length).Select(i => point.Output(ProfileOutputs.Velocity(i))).ToList();
        var values = outputs.Select((o, i) => o?.Estimate ?? point.Nominal.Velocity.Profile.Values[i]).ToArray();
        var expanded = outputs.Select(o => o?.ExpandedUncertainty ?? double.NaN).ToArray();
        var plot = FigureRendering.NewPlot();
        AddBandAndLine(plot, radiusM.Select(r => r * 1000.0).ToArray(), values, expanded, MarkerShape.FilledCircle, LinePattern.Solid, "u(r)", Coverage(day));
        plot.Title($"{point.Id}: inlet axial velocity ({ChoiceSpelling.Name(point.Nominal.Velocity.ModelUsed)})");
        plot.XLabel("r, distance from the axis [mm]");
        plot.YLabel("axial velocity [m/s]");
        var caption = $"{point.Id}: inlet axial velocity profile, scaled to the measured mass flow; grey band = ± expanded uncertainty U at p = {Coverage(day)}.";
        return new ReportFigure(relativePath, caption, ReportStyle.ProfileWidthPx, ReportStyle.ProfileHeightPx, FigureRendering.Png(plot, ReportStyle.ProfileWidthPx, ReportStyle.ProfileHeightPx));
    }

    /// <summary>T(r) from the radial rake with its ±U band and the rake sensors' window means as open squares; null without a rake.</summary>
    public static ReportFigure? Temperature(DayResult day, PointResult point, string relativePath)
    {
        if (point.Nominal.TemperatureProfile is not { } rake)
        {
            return null;
        }
        var radiusM = point.Nominal.Velocity.Profile.RadiusM;
        var outputs = Enumerable.Range(0, radiusM.Length).Select(i => point.Output(ProfileOutputs.Temperature(i))).ToList();
        var values = outputs.Select((o, i) => o?.Estimate ?? rake.Profile.Values[i]).ToArray();
        var expanded = outputs.Select(o => o?.ExpandedUncertainty ?? double.NaN).ToArray();
        var plot = FigureRendering.NewPlot();
        AddBandAndLine(plot, radiusM.Select(r => r * 1000.0).ToArray(), values, expanded, MarkerShape.FilledSquare, LinePattern.Dashed, "T(r)", Coverage(day));
        var sensors = day.Rig.Channels
            .Where(c => c.Role == ChannelRole.BulkTemperature && c.Plane == "inlet" && c.RadiusM is not null && point.Channels.ContainsKey(c.Id))
            .OrderBy(c => c.RadiusM).ToList();
        if (sensors.Count > 0)
        {
            var markers = plot.Add.Markers(sensors.Select(c => c.RadiusM!.Value * 1000.0).ToArray(), sensors.Select(c => point.Channels[c.Id].Mean).ToArray());
            markers.MarkerShape = MarkerShape.OpenSquare;
            markers.MarkerSize = 12;
            markers.Color = ReportStyle.Ink;
            markers.LegendText = "rake sensors (window mean)";
        }
        plot.Title($"{point.Id}: inlet temperature from the radial rake");
        plot.XLabel("r, distance from the axis [mm]");
        plot.YLabel("temperature [K]");
        var caption = $"{point.Id}: inlet temperature profile interpolated between the rake sensors; grey band = ± expanded uncertainty U at p = {Coverage(day)}.";
        return new ReportFigure(relativePath, caption, ReportStyle.ProfileWidthPx, ReportStyle.ProfileHeightPx, FigureRendering.Png(plot, ReportStyle.ProfileWidthPx, ReportStyle.ProfileHeightPx));
    }

    private static void AddBandAndLine(Plot plot, double[] xs, double[] ys, double[] expanded, MarkerShape marker, LinePattern pattern, string name, string coverage)
    {
        if (expanded.All(double.IsFinite))
        {
            var band = plot.Add.FillY(xs, ys.Zip(expanded, (y, u) => y - u).ToArray(), ys.Zip(expanded, (y, u) => y + u).ToArray());
            band.FillColor = ReportStyle.Band;
            band.LineColor = ReportStyle.Secondary;
            band.LineWidth = 1;
            band.LegendText = $"± U (p = {coverage})";
        }
        var line = plot.Add.Scatter(xs, ys);
        line.Color = ReportStyle.Ink;
        line.LineWidth = 2;
        line.LinePattern = pattern;
        line.MarkerShape = marker;
        line.MarkerSize = 6;
        line.LegendText = name;
        plot.ShowLegend(Alignment.LowerLeft);
        plot.Axes.SetLimitsX(0, xs.Max() * 1.03);
    }

    private static string Coverage(DayResult day) => day.Rig.CoverageProbability.ToString("0.##", CultureInfo.InvariantCulture);
}
