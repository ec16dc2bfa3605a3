using BcPrep.Pipeline;
using BcPrep.Report;
using BcPrep.Values;

namespace BcPrep.Tests.Report;

/// <summary>
/// The day figures draw their data: the trace's pixels cover the plotted time span, break where blocks are
/// missing, and lie where the series is. The trace is the only near-black drawing inside the band of the data's
/// values (shadings, hatches and borders are mid grey or lighter, point labels sit above the band).
/// </summary>
public sealed class DayFigureTraceTests
{
    // Ink is #111111 (luma 17), but a flat 1.5 px anti-aliased line that falls between two rows leaves each at about
    // luma 80. Shadings and hatches stay above 150, the dashed border of a rejected stretch is #6E6E6E (luma 110). Only
    // the averaging windows' solid borders (#555555, luma 85) are as dark: a column or two at each window edge.
    private const double TraceLuma = 100;

    // A 1.5 px anti-aliased line; the rows of its dark pixels straddle the value.
    private const double RowTolerancePx = 3;

    public static TheoryData<string> DayFigures => new(DayChannelFigure.Channels(SampleDays.Day));

    [Theory]
    [MemberData(nameof(DayFigures))]
    public void Sample_day_figure_draws_its_trace_over_the_whole_day(string channel)
    {
        var day = SampleDays.Day;
        var means = day.Blocks.Means[channel];
        var figure = DayChannelFigure.Render(day, channel, "x.png");

        var (covered, columns) = Coverage(figure, day, means);

        // The sample log misses two t_out cells, whose blocks are NaN: a break of at most a pixel each, not a vanished line.
        Assert.True(covered >= 0.98 * columns, $"{channel}: trace in {covered} of {columns} columns of the day");
    }

    [Fact]
    public void Figure_of_a_known_series_has_its_line_where_the_series_is_and_a_break_where_blocks_are_missing()
    {
        var day = SampleDays.Day;
        var times = day.Blocks.TimesS;
        var spanS = times[^1] - times[0];
        // One slow sine period over the day (it moves less than a pixel within a pixel column), 20 % to 25 % missing.
        double Value(double timeS) => 0.05 + (0.01 * Math.Sin(2 * Math.PI * (timeS - times[0]) / spanS));
        bool Missing(double timeS) => (timeS - times[0]) / spanS is >= 0.20 and < 0.25;
        var means = times.Select(t => Missing(t) ? double.NaN : Value(t)).ToArray();
        var known = day with { Blocks = new BlockSeries(times, new Dictionary<string, double[]> { ["mdot"] = means }) };

        var figure = DayChannelFigure.Render(known, "mdot", "x.png");
        var image = PngImage.Decode(figure.Png);
        var area = figure.Area!;

        var checkedColumns = 0;
        foreach (var x in SpanColumns(area, known, times))
        {
            var timeS = known.Start.OnClock(new DaySeconds(60 * (area.XMin + ((x + 0.5 - area.LeftPx) / (area.RightPx - area.LeftPx) * (area.XMax - area.XMin))))).Value;
            var rows = DarkRows(image, area, x, 0.04, 0.06).ToList();
            var gapS = 2 * (times[1] - times[0]) + (60 * (area.XMax - area.XMin) / (area.RightPx - area.LeftPx));
            if (Missing(timeS - gapS) && Missing(timeS + gapS))
            {
                Assert.True(rows.Count == 0, $"column {x} ({timeS - times[0]:0} s into the day) lies in the missing stretch but has trace pixels at rows {string.Join(",", rows)}");
                continue;
            }
            if (Missing(timeS - gapS) || Missing(timeS + gapS))
            {
                continue;
            }
            var expectedRow = area.RowOf(Value(timeS));
            Assert.True(rows.Count > 0, $"column {x}: no trace pixel, expected one near row {expectedRow:0.0}");
            Assert.InRange(expectedRow, rows.Min() - RowTolerancePx, rows.Max() + RowTolerancePx);
            checkedColumns++;
        }
        // Most of the ~1100 columns of the data area: the check looked at the whole line.
        Assert.True(checkedColumns > 900, $"only {checkedColumns} columns checked");
    }

    [Fact]
    public void A_single_missing_block_breaks_the_trace_without_removing_it()
    {
        var day = SampleDays.Day;
        var means = (double[])day.Blocks.Means["mdot"].Clone();
        means[means.Length / 2] = double.NaN;
        var known = day with { Blocks = new BlockSeries(day.Blocks.TimesS, new Dictionary<string, double[]> { ["mdot"] = means }) };

        var (covered, columns) = Coverage(DayChannelFigure.Render(known, "mdot", "x.png"), known, means);

        Assert.True(covered >= 0.98 * columns, $"trace in {covered} of {columns} columns");
    }

    /// <summary>How many image columns of the plotted time span hold a trace pixel inside the band of the data's values.</summary>
    private static (int Covered, int Columns) Coverage(ReportFigure figure, DayResult day, double[] means)
    {
        var image = PngImage.Decode(figure.Png);
        var area = figure.Area!;
        var columns = SpanColumns(area, day, day.Blocks.TimesS).ToList();
        var finite = means.Where(double.IsFinite).ToArray();
        var covered = columns.Count(x => DarkRows(image, area, x, finite.Min(), finite.Max()).Any());
        return (covered, columns.Count);
    }

    /// <summary>The image columns from the first block to the last, a few pixels in from each end.</summary>
    private static IEnumerable<int> SpanColumns(PlotArea area, DayResult day, double[] timesS)
    {
        var first = (int)Math.Ceiling(area.ColumnOf(day.Start.Since(new LoggerSeconds(timesS[0])).Value / 60.0)) + 2;
        var last = (int)Math.Floor(area.ColumnOf(day.Start.Since(new LoggerSeconds(timesS[^1])).Value / 60.0)) - 2;
        return Enumerable.Range(first, Math.Max(0, last - first + 1));
    }

    /// <summary>
    /// Rows of near-black pixels in column <paramref name="x"/> within the band of values [<paramref name="low"/>,
    /// <paramref name="high"/>] (widened by the line's width), inside the data area with its frame excluded.
    /// </summary>
    private static IEnumerable<int> DarkRows(PngImage image, PlotArea area, int x, double low, double high)
    {
        var top = Math.Max((int)area.TopPx + 2, (int)Math.Floor(area.RowOf(high) - RowTolerancePx));
        var bottom = Math.Min((int)area.BottomPx - 2, (int)Math.Ceiling(area.RowOf(low) + RowTolerancePx));
        for (var y = top; y <= bottom; y++)
        {
            if (image.Luma(x, y) < TraceLuma)
            {
                yield return y;
            }
        }
    }
}
