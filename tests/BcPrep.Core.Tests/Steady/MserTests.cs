using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class MserTests
{
    // Domain reference 5.2 check case [CC]: a falling warm-up then three repeats of a noisy plateau (n = 40).
    private static readonly double[] CheckCase =
        [10, 9, 8, 7, 6, 5, 4, 3, 2, 1,
         1, 1.2, 0.8, 1.1, 0.9, 1.0, 1.05, 0.95, 1.0, 1.0,
         1, 1.2, 0.8, 1.1, 0.9, 1.0, 1.05, 0.95, 1.0, 1.0,
         1, 1.2, 0.8, 1.1, 0.9, 1.0, 1.05, 0.95, 1.0, 1.0];

    [Fact]
    public void Statistic_matches_check_values()
    {
        Assert.Equal(0.14668, Mser.Statistic(CheckCase, 0), 5e-6);
        Assert.Equal(0.00033, Mser.Statistic(CheckCase, 9), 5e-6);
    }

    [Fact]
    public void Mser_truncation_lies_where_the_statistic_flattens()
    {
        var r = Mser.Truncate(CheckCase);
        Assert.InRange(r.TruncationSamples, 9, 13);
        Assert.True(r.InsideFirstHalf);
        Assert.Equal(Mser.Statistic(CheckCase, r.TruncationSamples), r.MinimumStatistic, 1e-12);
    }

    [Fact]
    public void Mser5_truncates_two_batches_of_five()
    {
        var r = Mser.Truncate(CheckCase, batchSize: 5);
        Assert.Equal(2, r.TruncationBatches);
        Assert.Equal(10, r.TruncationSamples);
    }

    [Fact]
    public void Steady_ramp_puts_truncation_at_the_end_of_the_search()
    {
        var ramp = Enumerable.Range(0, 100).Select(i => (double)i).ToArray();
        Assert.False(Mser.Truncate(ramp).InsideFirstHalf);
    }

    [Fact]
    public void Too_few_batches_are_refused()
    {
        Assert.Throws<BcPrepDataException>(() => Mser.Truncate([1, 2, 3], 1));
        Assert.Throws<BcPrepDataException>(() => Mser.Truncate(new double[19], 5));
    }
}
