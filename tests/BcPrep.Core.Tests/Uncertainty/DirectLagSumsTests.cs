using System.Numerics;
using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class DirectLagSumsTests
{
    // Reference: the estimator's definition Σᵢ dᵢ dᵢ₊ₖ summed in order, within 1e-12 of r(0) (rounding of two
    // summation orders); and, bit for bit, one vectorised sweep per lag as the window mean summed them before the lags
    // shared a sweep (the summation order is kept, so a window's cut-off and γ do not move).
    [Theory]
    [InlineData(3, 1, 3)]
    [InlineData(65, 1, 64)]
    [InlineData(2048, 1, 16)]
    [InlineData(5003, 1, 64)]
    [InlineData(5003, 16, 31)]
    [InlineData(20_000, 32, 64)]
    [InlineData(4099, 4097, 4099)]
    public void Equals_the_definition_and_one_sweep_per_lag(int n, int firstLag, int endLag)
    {
        var x = CorrelatedSeries.Ar1(n, 30.0, n);
        var mean = x.Average();
        var sums = new double[endLag];

        DirectLagSums.Compute(x, mean, firstLag, endLag, sums);

        var zeroLag = CorrelatedSeries.LaggedProduct(x, mean, 0);
        var d = x.Select(v => v - mean).ToArray();
        for (var k = firstLag; k < endLag; k++)
        {
            Assert.Equal(0.0, (sums[k] - CorrelatedSeries.LaggedProduct(x, mean, k)) / zeroLag, 1e-12);
            Assert.Equal(OneSweep(d, k), sums[k]);
        }
    }

    [Theory]
    [InlineData(0, 3)]
    [InlineData(2, 2)]
    [InlineData(1, 11)]
    public void Refuses_lags_outside_the_window(int firstLag, int endLag)
    {
        var x = new double[10];
        Assert.Throws<ArgumentException>(() => DirectLagSums.Compute(x, 0.0, firstLag, endLag, new double[20]));
    }

    /// <summary>The former single-lag sweep: lanes over i ≡ j (mod width) in increasing i, lane sum, scalar tail.</summary>
    private static double OneSweep(double[] d, int lag)
    {
        var a = d.AsSpan(0, d.Length - lag);
        var b = d.AsSpan(lag);
        var width = Vector<double>.Count;
        var acc = Vector<double>.Zero;
        var i = 0;
        for (; i <= a.Length - width; i += width)
        {
            acc += new Vector<double>(a.Slice(i, width)) * new Vector<double>(b.Slice(i, width));
        }
        var sum = Vector.Sum(acc);
        for (; i < a.Length; i++)
        {
            sum += a[i] * b[i];
        }
        return sum;
    }
}
