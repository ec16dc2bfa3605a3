using System.Globalization;
using BcPrep.Pipeline;
using ScottPlot;

namespace BcPrep.Report;

/// <summary>
/// The uncertainty budget of one quantity of one point as horizontal bars: each input's share of the variance
/// c²u²(x)/u_c²(y) in percent, the largest on top, the smallest inputs summed into one "other" bar, and the share
/// that input correlations add (when not zero) as its own bar.
/// </summary>
public static class BudgetFigure
{
    /// <summary>Quantities whose budgets the report draws, when the point has them: entries of the one quantity table.</summary>
    public static readonly IReadOnlyList<ScalarOutput> Quantities =
        [PointOutputs.MassFlow, PointOutputs.InletTemperature, PointOutputs.InletStaticPressure, PointOutputs.OutletStaticPressure, PointOutputs.WallHeatFlux];

    /// <summary>Inputs shown by name; the rest are summed.</summary>
    public const int TopContributors = 6;

    /// <summary>The bars (label, share in %) of <paramref name="quantity"/>, largest first; empty when the point lacks the quantity or its uncertainty is zero.</summary>
    public static IReadOnlyList<(string Label, double SharePercent)> Bars(PointResult point, ScalarOutput quantity)
    {
        if (point.Output(quantity) is not { StandardUncertainty: > 0 } output)
        {
            return [];
        }
        var lines = output.Budget.Where(b => b.VarianceShare > 0).OrderByDescending(b => b.VarianceShare).ThenBy(b => b.InputName, StringComparer.Ordinal).ToList();
        var bars = lines.Take(TopContributors).Select(b => (b.InputName, 100.0 * b.VarianceShare)).ToList();
        var rest = lines.Skip(TopContributors).ToList();
        if (rest.Count > 0)
        {
            bars.Add(($"other ({rest.Count.ToString(CultureInfo.InvariantCulture)} inputs)", 100.0 * rest.Sum(b => b.VarianceShare)));
        }
        if (Math.Abs(output.CorrelationVarianceShare) > 1e-6)
        {
            bars.Add(("input correlations", 100.0 * output.CorrelationVarianceShare));
        }
        return bars;
    }

    /// <summary>The figure; null when <see cref="Bars"/> is empty.</summary>
    public static ReportFigure? Render(PointResult point, ScalarOutput quantity, string relativePath)
    {
        var bars = Bars(point, quantity);
        if (bars.Count == 0)
        {
            return null;
        }
        var plot = FigureRendering.NewPlot();
        // The largest share at the top: bars are placed bottom-up.
        var positions = Enumerable.Range(0, bars.Count).Select(i => (double)(bars.Count - 1 - i)).ToArray();
        var barList = bars.Select((b, i) => new Bar
        {
            Position = positions[i],
            Value = b.SharePercent,
            FillColor = ReportStyle.Bar,
            LineColor = ReportStyle.Ink,
            Orientation = Orientation.Horizontal,
            Size = 0.7,
        }).ToList();
        plot.Add.Bars(barList);
        foreach (var (bar, (_, share)) in barList.Zip(bars))
        {
            var label = plot.Add.Text(share.ToString("0.0", CultureInfo.InvariantCulture) + " %", Math.Max(share, 0) + 1.5, bar.Position);
            label.LabelFontSize = 12;
            label.LabelFontColor = ReportStyle.Ink;
            label.LabelAlignment = Alignment.MiddleLeft;
        }
        plot.Axes.Left.SetTicks(positions, bars.Select(b => b.Label).ToArray());
        plot.Axes.Left.MajorTickStyle.Length = 0;
        plot.Grid.YAxisStyle.IsVisible = false;
        var min = Math.Min(0, bars.Min(b => b.SharePercent));
        plot.Axes.SetLimitsX(min, 118);
        plot.Axes.SetLimitsY(-0.6, bars.Count - 0.4);
        var output = point.Output(quantity)!;
        plot.Title($"{point.Id}: uncertainty budget of {quantity.Name}");
        plot.XLabel("share of the variance u_c²(y) [%]");
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"{point.Id}: {quantity.Name}, y ± u_c = {MeasurementText.WithUncertainty(output.Estimate, output.StandardUncertainty)}; share of each input in the variance, largest first.");
        return new ReportFigure(relativePath, caption, ReportStyle.BudgetWidthPx, ReportStyle.BudgetHeightPx, FigureRendering.Png(plot, ReportStyle.BudgetWidthPx, ReportStyle.BudgetHeightPx));
    }
}
