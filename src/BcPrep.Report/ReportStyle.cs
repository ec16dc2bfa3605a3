using ScottPlot;

namespace BcPrep.Report;

/// <summary>
/// The report's own palette and sizes. Every series differs from its neighbours by line pattern or marker shape as
/// well as by shade, so the figures read the same when printed in greyscale; the shades are chosen far apart in
/// lightness for the same reason.
/// </summary>
internal static class ReportStyle
{
    public static readonly Color Ink = Color.FromHex("#111111");
    public static readonly Color Secondary = Color.FromHex("#555555");
    public static readonly Color Grid = Color.FromHex("#E4E4E4");

    /// <summary>Averaging window of an operating point: a mid grey that still lets the trace show through.</summary>
    public static readonly Color AveragingWindow = Color.FromHex("#9A9A9A").WithAlpha(0.45);

    /// <summary>The steady stretch around it: lighter.</summary>
    public static readonly Color SteadyStretch = Color.FromHex("#CFCFCF").WithAlpha(0.45);

    /// <summary>A rejected candidate stretch: hatched edge shade, told apart from accepted shading by its hatch and dashed border.</summary>
    public static readonly Color Rejected = Color.FromHex("#6E6E6E");

    /// <summary>Uncertainty band around a profile.</summary>
    public static readonly Color Band = Color.FromHex("#BDBDBD").WithAlpha(0.6);

    /// <summary>Bars of the uncertainty budget.</summary>
    public static readonly Color Bar = Color.FromHex("#4D4D4D");

    public const int DayWidthPx = 1200;
    public const int DayHeightPx = 420;
    public const int ProfileWidthPx = 800;
    public const int ProfileHeightPx = 520;
    public const int BudgetWidthPx = 900;
    public const int BudgetHeightPx = 360;
}
