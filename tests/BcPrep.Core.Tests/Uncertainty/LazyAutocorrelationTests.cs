using BcPrep.Uncertainty;
using MathNet.Numerics.Statistics;

namespace BcPrep.Tests.Uncertainty;

public class LazyAutocorrelationTests
{
    // Reference: MathNet.Numerics 5.0 Correlation.Auto (FFT, mean removed, biased, lag 0 = 1), which the window
    // mean used before lags were computed on demand; both must give the same estimator.
    [Theory]
    [InlineData(0.0, 1000)]
    [InlineData(0.8, 5000)]
    [InlineData(0.99, 3001)]
    public void Equals_the_general_library_estimator_at_every_lag_read(double phi, int n)
    {
        var x = Ar1.Series(n, phi, new Random(3));
        var reference = Correlation.Auto(x, 0, n - 1);
        var lazy = new LazyAutocorrelation(x, x.Average());

        foreach (var lag in new[] { 0, 1, 2, 17, 63, 64, 200, LazyAutocorrelation.DirectLagLimit - 1, LazyAutocorrelation.DirectLagLimit + 5, n / 2, n - 1 })
        {
            Assert.Equal(reference[lag], lazy[lag], 1e-12);
        }
    }

    // Reference: the estimator's definition ρ̂(k) = Σᵢ dᵢ dᵢ₊ₖ / Σᵢ dᵢ², summed directly, held within 1e-12 (of ρ̂(0) = 1)
    // at every lag as a cut-off reads them (in order, one past the last): AR(1) noise of correlation time 1, 30 and
    // 300 samples, a 50 Hz hum at 1 kHz with a slowly wandering phase, a drift and a steep ramp; window lengths just
    // above the switch points (64 direct lags; sections of half the whole window's transform, 4097 = 2¹² + 1) and
    // not near them. The route says which computation gave the last lags, so each route is exercised (none is named
    // where the predicted reach of a slow decay decides it).
    [Theory]
    [InlineData("ar1-tau1", 65, 64, "Direct")]
    [InlineData("ar1-tau1", 65, 65, "WholeWindow")]
    [InlineData("ar1-tau1", 20_000, 64, "Direct")]
    [InlineData("ar1-tau1", 20_000, 65, "Sectioned")]
    [InlineData("ar1-tau30", 20_000, 600, "Sectioned")]
    [InlineData("ar1-tau300", 30_000, 5000, "Sectioned")]
    [InlineData("ar1-tau1", 4097, 2048, "Sectioned")]
    [InlineData("ar1-tau1", 4097, 2049, "WholeWindow")]
    [InlineData("ar1-tau300", 4097, 2049, "any")]
    [InlineData("hum", 20_000, 1000, "Sectioned")]
    [InlineData("hum", 20_000, 1500, "any")]
    [InlineData("hum", 129, 128, "WholeWindow")]
    [InlineData("drift", 8193, 3000, "any")]
    [InlineData("ramp", 20_000, 3000, "WholeWindow")]
    public void Equals_the_definition_at_every_lag_read(string series, int n, int lagsRead, string route)
    {
        var x = CorrelatedSeries.Named(series, n, lagsRead);
        var mean = x.Average();
        var zeroLag = CorrelatedSeries.LaggedProduct(x, mean, 0);
        var lazy = new LazyAutocorrelation(x, mean);

        for (var k = 0; k < lagsRead; k++)
        {
            Assert.Equal(CorrelatedSeries.LaggedProduct(x, mean, k) / zeroLag, lazy[k], 1e-12);
        }

        if (route != "any")
        {
            Assert.Equal(Enum.Parse<AutocorrelationRoute>(route), lazy.LastRoute);
        }
    }

    // Common practice (cost only, no value depends on it): a correlation that has not decayed by the last direct lag
    // goes straight to the whole window, and an exponential decay is extended once, past its expected cut-off.
    [Fact]
    public void Predicts_the_lags_a_slow_correlation_needs()
    {
        // One estimator at a time: each holds its lags in the thread's scratch.
        var ramp = CorrelatedSeries.Named("ramp", 100_000, 1);
        var slow = new LazyAutocorrelation(ramp, ramp.Average());
        _ = slow[64];
        Assert.Equal(AutocorrelationRoute.WholeWindow, slow.LastRoute);

        var ar1 = CorrelatedSeries.Named("ar1-tau300", 100_000, 1);
        var decaying = new LazyAutocorrelation(ar1, ar1.Average());
        _ = decaying[64];
        Assert.Equal(AutocorrelationRoute.Sectioned, decaying.LastRoute);
        _ = decaying[4000];
        Assert.Equal(AutocorrelationRoute.Sectioned, decaying.LastRoute);
        Assert.Equal(1, decaying.SectionPasses);
    }

    // Reference: the estimator's definition (summed directly) and the single transform that zero-pads to 2n
    // (FftAutocorrelation.Compute, held to the definition in its own tests), within 1e-12 of ρ̂(0) = 1. A window above
    // SplitFrom whose length is under 5/8 of a power of two takes its whole-window lags from a transform of that power
    // of two (the lags below size − n + 1) and the far ones from FarLagSums: every lag read in order, as the cut-offs
    // read them, each part computed once; a near lag read after the far ones is computed again, not taken from the
    // arrays the far lags overwrote.
    [Theory]
    [InlineData("ramp", 70_001)]
    [InlineData("drift", 81_000)]
    [InlineData("ar1-tau300", 66_000)]
    public void A_split_whole_window_equals_the_single_transform_and_the_definition(string series, int n)
    {
        var x = CorrelatedSeries.Named(series, n, 7);
        var mean = x.Average();
        Assert.True(LazyAutocorrelation.SplitsWholeWindow(n, out var size, out _));
        var farFrom = size - n + 1;
        var single = FftAutocorrelation.Compute(x, mean);
        var lazy = new LazyAutocorrelation(x, mean);
        // A lag past the sections' reach sends it to the whole window.
        _ = lazy[n / 2];
        Assert.Equal(AutocorrelationRoute.WholeWindow, lazy.LastRoute);
        for (var k = 0; k < n; k++)
        {
            Assert.Equal(single[k], lazy[k], 1e-12);
        }
        Assert.Equal(1, lazy.FarPasses);

        var zeroLag = CorrelatedSeries.LaggedProduct(x, mean, 0);
        foreach (var k in new[] { 1, 2, 1000, farFrom - 2, farFrom - 1, farFrom, farFrom + 1, farFrom + ((n - farFrom) / 2), n - 2, n - 1, 3 })
        {
            Assert.Equal(CorrelatedSeries.LaggedProduct(x, mean, k) / zeroLag, lazy[k], 1e-12);
        }
        Assert.Equal(2, lazy.FarPasses);
    }

    // Where the split applies: above SplitFrom and when the far lags' transform needs no more points than the near
    // one (n up to about 5/8 of a power of two). The 8 h 1 kHz day's 20-minute windows (1 221 001 samples) split:
    // two arrays of 2²⁰ complex points instead of 2²¹.
    [Fact]
    public void Splits_only_long_windows_whose_far_lags_are_few()
    {
        Assert.True(LazyAutocorrelation.SplitsWholeWindow(1_221_001, out var size, out var far));
        Assert.Equal(1 << 21, size);
        Assert.True(far <= size / 2);
        Assert.Equal(1 << 20, LazyAutocorrelation.WholeWindowPoints(1_221_001));
        Assert.False(LazyAutocorrelation.SplitsWholeWindow(100_000, out _, out _));
        Assert.Equal(1 << 17, LazyAutocorrelation.WholeWindowPoints(100_000));
        Assert.False(LazyAutocorrelation.SplitsWholeWindow(LazyAutocorrelation.SplitFrom, out _, out _));
        Assert.False(LazyAutocorrelation.SplitsWholeWindow(4097, out _, out _));
    }

    [Fact]
    public void Refuses_a_lag_outside_the_window()
    {
        var lazy = new LazyAutocorrelation([1.0, 2.0, 4.0], 7.0 / 3.0);
        Assert.Throws<ArgumentOutOfRangeException>(() => lazy[3]);
        Assert.Throws<ArgumentOutOfRangeException>(() => lazy[-1]);
    }
}
