using System.Globalization;
using ScottPlot;

namespace BcPrep.Report;

/// <summary>A rendered figure: where it goes in the output folder, what it shows, its size in pixels and its PNG bytes.</summary>
public sealed record ReportFigure(string RelativePath, string Caption, int WidthPx, int HeightPx, byte[] Png)
{
    /// <summary>The data area as rendered, for figures whose data a test checks in the pixels; null for the others.</summary>
    public PlotArea? Area { get; init; }
}

/// <summary>Turns a ScottPlot plot into PNG bytes with the report's fonts and invariant number formatting.</summary>
internal static class FigureRendering
{
    /// <summary>
    /// Renders <paramref name="plot"/> at the given size. ScottPlot formats tick labels in the current culture, so
    /// the culture is invariant while it renders (and restored after): a decimal comma must never reach a figure
    /// whose tables use points.
    /// </summary>
    public static byte[] Png(Plot plot, int widthPx, int heightPx) => PngWithArea(plot, widthPx, heightPx).Png;

    /// <summary>Renders like <see cref="Png"/> and also returns where the data area came to lie.</summary>
    public static (byte[] Png, PlotArea Area) PngWithArea(Plot plot, int widthPx, int heightPx)
    {
        ReportFonts.Register();
        var previous = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
            var png = plot.GetImageBytes(widthPx, heightPx, ImageFormat.Png);
            return (png, PlotArea.Of(plot));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }
    }

    /// <summary>A new plot with the report's look: white background, black frame and text, light grey grid.</summary>
    public static Plot NewPlot()
    {
        ReportFonts.Register();
        var plot = new Plot();
        plot.FigureBackground.Color = Colors.White;
        plot.DataBackground.Color = Colors.White;
        plot.Axes.Color(Colors.Black);
        plot.Grid.MajorLineColor = ReportStyle.Grid;
        plot.Font.Set(ReportFonts.Family);
        return plot;
    }
}
