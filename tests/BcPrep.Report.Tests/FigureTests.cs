using System.Globalization;
using BcPrep.Report;
using ScottPlot;

namespace BcPrep.Tests.Report;

/// <summary>The figures are PNGs of their declared size, carry real content and text, and do not depend on the culture.</summary>
public sealed class FigureTests
{
    private static readonly Lazy<DayReportFiles> Report = new(() => DayReport.Build(SampleDays.Day));

    [Fact]
    public void Sample_day_report_has_a_figure_per_key_channel_and_per_point_profile_and_budgets()
    {
        var paths = Report.Value.Figures.Select(f => f.RelativePath).ToList();

        // The sample rig's [steady] keys are mdot, t_out and t_w3; the sample day has three points, OP1–OP3.
        Assert.Equal(["day-mdot.png", "day-t_out.png", "day-t_w3.png"], paths.Where(p => p.StartsWith("day-", StringComparison.Ordinal)));
        foreach (var id in new[] { "OP1", "OP2", "OP3" })
        {
            Assert.Contains($"{id}/inlet-velocity.png", paths);
            Assert.Contains($"{id}/budget-mass_flow.png", paths);
            Assert.Contains($"{id}/budget-inlet.temperature.png", paths);
            // The sample rig has no radial rake, so no temperature profile figure.
            Assert.DoesNotContain($"{id}/inlet-temperature.png", paths);
        }
        Assert.Equal(paths.Count, paths.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void Every_figure_decodes_at_its_declared_size_with_many_grey_levels()
    {
        foreach (var figure in Report.Value.Figures)
        {
            var image = PngImage.Decode(figure.Png);

            Assert.Equal((figure.WidthPx, figure.HeightPx), (image.Width, image.Height));
            // A blank or one-colour canvas has a handful of colours; lines, shading and anti-aliased text give hundreds.
            Assert.True(image.DistinctColours > 100, $"{figure.RelativePath}: only {image.DistinctColours} distinct colours");
        }
        var day = PngImage.Decode(Report.Value.Figures.Single(f => f.RelativePath == "day-mdot.png").Png);
        Assert.Equal((1200, 420), (day.Width, day.Height));
    }

    [Fact]
    public void Every_figure_has_its_title_drawn_above_the_plot_area()
    {
        foreach (var figure in Report.Value.Figures)
        {
            var image = PngImage.Decode(figure.Png);

            // The top 30 px hold only the title: no frame, no data. Without a usable font this band stays white.
            var dark = image.DarkPixels(0, 0, image.Width, 30);
            Assert.True(dark > 150, $"{figure.RelativePath}: {dark} dark pixels in the title band");
        }
    }

    [Fact]
    public void Text_changes_the_picture_so_the_embedded_font_is_in_use()
    {
        // The same plot with and without a title and axis labels: the text must change a few thousand pixels.
        byte[] Render(bool withText)
        {
            var plot = FigureRendering.NewPlot();
            plot.Add.Signal(Enumerable.Range(0, 100).Select(i => Math.Sin(i / 10.0)).ToArray());
            if (withText)
            {
                plot.Title("Mass flow over the day");
                plot.XLabel("time [min]");
                plot.YLabel("mass flow [kg/s]");
            }
            return FigureRendering.Png(plot, 600, 400);
        }

        var changed = PngImage.Decode(Render(true)).DifferingPixels(PngImage.Decode(Render(false)));

        Assert.True(changed > 1500, $"only {changed} pixels changed by the text");
    }

    [Fact]
    public void Figures_are_byte_identical_under_a_culture_with_a_decimal_comma()
    {
        var comma = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        comma.NumberFormat.NumberDecimalSeparator = ",";
        comma.NumberFormat.NumberGroupSeparator = ".";
        var day = SampleDays.Day;
        var previous = CultureInfo.CurrentCulture;
        byte[] underComma;
        try
        {
            CultureInfo.CurrentCulture = comma;
            // mdot's tick labels are decimals (0.005 kg/s steps), the case a decimal comma would change.
            underComma = DayChannelFigure.Render(day, "mdot", "x.png").Png;
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }

        Assert.Equal(DayChannelFigure.Render(day, "mdot", "x.png").Png, underComma);
        Assert.Same(previous, CultureInfo.CurrentCulture);
    }

    [Fact]
    public void A_radial_rake_adds_the_inlet_temperature_figure()
    {
        var day = SampleDays.RakeDay;
        var point = day.Points[0];

        var figure = InletProfileFigures.Temperature(day, point, "t.png");

        Assert.NotNull(figure);
        var image = PngImage.Decode(figure.Png);
        Assert.Equal((800, 520), (image.Width, image.Height));
        Assert.True(image.DistinctColours > 100);
        Assert.Null(InletProfileFigures.Temperature(SampleDays.Day, SampleDays.Day.Points[0], "t.png"));
        Assert.Contains(DayReport.Build(day).Figures, f => f.RelativePath == $"{point.Id}/inlet-temperature.png");
    }
}
