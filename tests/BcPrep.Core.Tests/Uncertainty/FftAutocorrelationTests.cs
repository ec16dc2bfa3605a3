using BcPrep.Uncertainty;
using MathNet.Numerics.Statistics;

namespace BcPrep.Tests.Uncertainty;

public class FftAutocorrelationTests
{
    // Reference: MathNet.Numerics 5.0 Correlation.Auto (mean removed, biased, lag 0 = 1), the general library's
    // estimator; odd, even and power-of-two lengths exercise the half-length packing at both ends.
    [Theory]
    [InlineData(2, 0.0)]
    [InlineData(3, 0.5)]
    [InlineData(5, 0.5)]
    [InlineData(8, 0.9)]
    [InlineData(1000, 0.8)]
    [InlineData(4097, 0.99)]
    public void Equals_the_general_library_estimator_at_every_lag(int n, double phi)
    {
        var x = Ar1.Series(n, phi, new Random(n));
        var reference = Correlation.Auto(x, 0, n - 1);

        var rho = FftAutocorrelation.Compute(x, x.Average());

        Assert.Equal(n, rho.Length);
        for (var k = 0; k < n; k++)
        {
            Assert.Equal(reference[k], rho[k], 1e-12);
        }
    }

    // The fast path held to the straightforward one: packing straight to bit-reversed indices gives the values and
    // zeros that packing in order and then reversing gives, to the bit, for odd and even windows, windows that fill
    // their packed half or a quarter of it, and transforms below and above the tiled size (2^6 points).
    [Theory]
    [InlineData(1, 2)]
    [InlineData(7, 8)]
    [InlineData(64, 32)]
    [InlineData(65, 64)]
    [InlineData(127, 64)]
    [InlineData(128, 64)]
    [InlineData(1000, 512)]
    [InlineData(1000, 2048)]
    [InlineData(4097, 4096)]
    [InlineData(70001, 65536)]
    public void Packing_to_reversed_indices_equals_packing_then_reversing(int n, int half)
    {
        var random = new Random(n + half);
        var x = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.3).ToArray();
        var mean = x.Average();
        var expectedRe = Enumerable.Repeat(double.NaN, half).ToArray();
        var expectedIm = Enumerable.Repeat(double.NaN, half).ToArray();
        FftAutocorrelation.Pack(x, mean, expectedRe, expectedIm, half);
        RadixTwoFft.BitReverseStraight(expectedRe, expectedIm, half);
        // Stale values from an earlier window, which every index must overwrite.
        var re = Enumerable.Repeat(double.NaN, half).ToArray();
        var im = Enumerable.Repeat(double.NaN, half).ToArray();

        FftAutocorrelation.PackBitReversed(x, mean, re, im, half);

        Assert.Equal(expectedRe, re);
        Assert.Equal(expectedIm, im);
        Assert.Equal(x[0] - mean, re[0]);
    }

    // Reference: the estimator's definition summed directly, Σᵢ dᵢ dᵢ₊ₖ / Σᵢ dᵢ², on a series with a known shape.
    [Fact]
    public void Equals_the_direct_sums_of_its_definition()
    {
        double[] x = [1, 4, 2, 8, 5, 7, 3, 6, 0, 9, 1];
        var mean = x.Average();
        var d = x.Select(v => v - mean).ToArray();
        var zero = d.Sum(v => v * v);

        var rho = FftAutocorrelation.Compute(x, mean);

        for (var k = 0; k < x.Length; k++)
        {
            var sum = 0.0;
            for (var i = 0; i + k < x.Length; i++)
            {
                sum += d[i] * d[i + k];
            }
            Assert.Equal(sum / zero, rho[k], 1e-13);
        }
    }
}
