using ScottPlot;

namespace BcPrep.Report;

/// <summary>
/// Where a figure's data area lies in its image and which axis ranges it spans, as rendered. It lets a test find a
/// value of the series in the pixels (is the line drawn where the data is?) without knowing the layout rules of the
/// plotting library.
/// </summary>
public sealed record PlotArea(float LeftPx, float RightPx, float TopPx, float BottomPx, double XMin, double XMax, double YMin, double YMax)
{
    /// <summary>The image column of abscissa <paramref name="x"/> (in axis units).</summary>
    public double ColumnOf(double x) => LeftPx + ((x - XMin) / (XMax - XMin) * (RightPx - LeftPx));

    /// <summary>The image row of ordinate <paramref name="y"/> (in axis units); rows count downwards.</summary>
    public double RowOf(double y) => BottomPx - ((y - YMin) / (YMax - YMin) * (BottomPx - TopPx));

    internal static PlotArea Of(Plot plot)
    {
        var rect = plot.LastRender.DataRect;
        var limits = plot.Axes.GetLimits();
        return new PlotArea(rect.Left, rect.Right, rect.Top, rect.Bottom, limits.Left, limits.Right, limits.Bottom, limits.Top);
    }
}
