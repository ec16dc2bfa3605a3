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
}
