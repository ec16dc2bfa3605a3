using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class TrendFitTests
{
    [Fact]
    public void Exact_line_gives_its_slope_and_zero_uncertainty()
    {
        var t = Enumerable.Range(0, 50).Select(i => (double)i).ToArray();
        var y = t.Select(v => 3.0 - (0.02 * v)).ToArray();
        var fit = TrendFit.Fit(t, y);
        Assert.Equal(-0.02, fit.SlopePerS, 1e-14);
        Assert.Equal(0.0, fit.SlopeUncertaintyPerS, 1e-12);
        Assert.Equal(2.51, fit.Mean, 1e-12);
    }

    [Fact]
    public void Inflated_uncertainty_covers_the_true_zero_slope_under_ar1_noise()
    {
        // Statistical check (common practice): with φ = 0.7 the naive OLS u(b) would cover 0 in only ~60 % of
        // windows at k = 2; the AR(1)-inflated u(b) should be near the nominal 95 %.
        var t = Enumerable.Range(0, 300).Select(i => (double)i).ToArray();
        int covered = 0;
        const int trials = 400;
        double phiSum = 0;
        for (int k = 0; k < trials; k++)
        {
            var fit = TrendFit.Fit(t, SteadyTestData.Ar1(300, 0.7, 1.0, 1000 + k));
            covered += Math.Abs(fit.SlopePerS) <= 2.0 * fit.SlopeUncertaintyPerS ? 1 : 0;
            phiSum += fit.ResidualAr1;
        }

        Assert.InRange(covered / (double)trials, 0.88, 0.99);
        Assert.InRange(phiSum / trials, 0.62, 0.72);
    }

    [Fact]
    public void Too_few_samples_give_nan()
    {
        Assert.True(double.IsNaN(TrendFit.Fit([0.0, 1.0], [1.0, 2.0]).SlopePerS));
    }
}
