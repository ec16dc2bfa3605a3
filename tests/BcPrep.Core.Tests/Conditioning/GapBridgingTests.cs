using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class GapBridgingTests
{
    [Fact]
    public void Short_nan_run_is_interpolated_linearly_and_flagged()
    {
        double[] t = [0, 1, 2, 3, 4, 5];
        double[] x = [10, 11, double.NaN, double.NaN, 14, 15];
        var r = GapBridging.Bridge(t, x, maxBridgeS: 5);

        Assert.Equal([10, 11, 12, 13, 14, 15], r.Values);
        Assert.Equal([false, false, true, true, false, false], r.Interpolated);
        var gap = Assert.Single(r.Report.Gaps);
        Assert.Equal(new DataGap(1, 4, 2, true, false), gap);
        Assert.Equal(2, r.Report.NonFiniteCells);
        Assert.Equal(1.0, r.Report.NominalIntervalS);
    }

    [Fact]
    public void Short_time_jump_gets_inserted_samples_on_the_nominal_grid()
    {
        double[] t = [0, 0.5, 1.0, 2.5, 3.0];
        double[] x = [0, 1, 2, 5, 6];
        var r = GapBridging.Bridge(t, x, maxBridgeS: 2);

        Assert.Equal([0, 0.5, 1.0, 1.5, 2.0, 2.5, 3.0], r.TimesS);
        Assert.Equal([0, 1, 2, 3, 4, 5, 6], r.Values);
        Assert.Equal(2, r.Report.InsertedSamples);
        Assert.Equal(1, r.Report.TimeJumps);
        Assert.True(Assert.Single(r.Report.Gaps).Bridged);
    }

    [Fact]
    public void Long_gap_and_edge_gaps_are_reported_not_bridged()
    {
        double[] t = [0, 1, 2, 3, 4, 5, 6, 7, 20, 21];
        double[] x = [double.NaN, 1, 2, double.NaN, double.NaN, double.NaN, double.NaN, 7, 8, double.NaN];
        var r = GapBridging.Bridge(t, x, maxBridgeS: 3);

        Assert.Equal(x.Length, r.Values.Length);
        Assert.True(double.IsNaN(r.Values[4]));
        Assert.DoesNotContain(true, r.Interpolated);
        Assert.Equal(4, r.Report.Gaps.Count);
        Assert.Empty(r.Report.Bridged);
        Assert.Contains(new DataGap(0, 0, 1, false, true), r.Report.Gaps);
        Assert.Contains(new DataGap(2, 7, 4, false, false), r.Report.Gaps);
        Assert.Contains(new DataGap(7, 20, 12, false, false), r.Report.Gaps);
        Assert.Contains(new DataGap(21, 21, 1, false, true), r.Report.Gaps);
    }

    [Fact]
    public void Non_increasing_time_is_refused()
    {
        Assert.Throws<BcPrepDataException>(() => GapBridging.Bridge([0, 1, 1], [1, 2, 3], 1));
    }

    [Fact]
    public void Mismatched_lengths_are_a_callers_mistake_not_bad_data()
    {
        // Times and values come from the same rows: a length mismatch is a bug, so it must not read as exit 3.
        Assert.Throws<ArgumentException>(() => GapBridging.Bridge([0, 1], [1, 2, 3], 1));
    }
}
