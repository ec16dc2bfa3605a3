using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class HampelFilterTests
{
    [Fact]
    public void Check_case_replaces_the_two_spikes_by_the_local_median()
    {
        // Domain reference 6.3 [CC, MATLAB hampel defaults k = 3, n_σ = 3].
        double[] x = [1.0, 1.1, 0.9, 1.0, 8.0, 1.05, 0.95, 1.0, 1.02, 0.98, -5.0, 1.0, 1.01];
        var result = HampelFilter.Apply(x);

        Assert.Equal([4, 10], result.ReplacedIndices);
        Assert.Equal(1.0, result.Values[4], 1e-15);
        Assert.Equal(1.0, result.Values[10], 1e-15);
        for (int i = 0; i < x.Length; i++)
        {
            if (i != 4 && i != 10)
            {
                Assert.Equal(x[i], result.Values[i]);
            }
        }
    }

    [Fact]
    public void Flat_window_with_zero_mad_flags_nothing_without_a_floor()
    {
        double[] x = [2.0, 2.0, 2.0, 2.0, 2.1, 2.0, 2.0, 2.0, 2.0];
        Assert.Empty(HampelFilter.Apply(x).ReplacedIndices);
    }

    [Fact]
    public void Resolution_floor_catches_a_spike_on_a_flat_signal()
    {
        double[] x = [2.0, 2.0, 2.0, 2.0, 9.0, 2.0, 2.0, 2.0, 2.0, 2.1];
        var result = HampelFilter.Apply(x, scaleFloor: 0.1);
        Assert.Equal([4], result.ReplacedIndices);
        Assert.Equal(2.0, result.Values[4]);
    }

    [Fact]
    public void Non_finite_samples_are_passed_through_and_excluded_from_windows()
    {
        double[] x = [1.0, 1.1, double.NaN, 0.9, 7.0, 1.0, 1.05, 0.95];
        var result = HampelFilter.Apply(x);
        Assert.True(double.IsNaN(result.Values[2]));
        Assert.Equal([4], result.ReplacedIndices);
    }

    [Fact]
    public void Matches_a_naive_sort_per_window_implementation_on_random_data()
    {
        var rng = new Random(1234);
        var x = new double[3000];
        for (int i = 0; i < x.Length; i++)
        {
            x[i] = Math.Round(rng.NextDouble() * 10.0, 1) + (rng.NextDouble() < 0.02 ? 40.0 : 0.0);
        }

        foreach (int k in new[] { 1, 3, 5, 10, 12 })
        {
            var fast = HampelFilter.Apply(x, k, 2.5);
            var (slowValues, slowIdx) = Naive(x, k, 2.5);
            Assert.Equal(slowIdx, fast.ReplacedIndices);
            Assert.Equal(slowValues, fast.Values);
        }
    }

    // The shortcut that skips the exact MAD for samples well inside the spread must agree with the definition even
    // where rounding is coarse against the noise: microkelvin noise on 300 K, and samples sitting exactly at the
    // threshold (a quantised signal, where |x − m| = n_σ·1.4826·MAD happens).
    [Theory]
    [InlineData(300.0, 1e-7, 10, 4.0)]
    [InlineData(0.0, 1.0, 10, 4.0)]
    [InlineData(1e5, 0.5, 4, 3.0)]
    public void Matches_the_naive_implementation_on_small_noise_over_a_large_offset(double offset, double noise, int k, double nSigma)
    {
        var rng = new Random(77);
        var x = new double[4000];
        for (int i = 0; i < x.Length; i++)
        {
            x[i] = offset + (noise * Math.Round(rng.NextDouble() * 8.0)) + (rng.NextDouble() < 0.01 ? 30.0 * noise : 0.0);
        }

        var fast = HampelFilter.Apply(x, k, nSigma);
        var (slowValues, slowIdx) = Naive(x, k, nSigma);

        Assert.Equal(slowIdx, fast.ReplacedIndices);
        Assert.Equal(slowValues, fast.Values);
    }

    [Theory]
    [InlineData(0, 3.0, 0.0)]
    [InlineData(3, 0.0, 0.0)]
    [InlineData(3, 3.0, -1.0)]
    public void Invalid_settings_are_refused(int k, double nSigma, double floor)
    {
        Assert.Throws<BcPrepDataException>(() => HampelFilter.Apply([1.0, 2.0], k, nSigma, floor));
    }

    private static (double[] Values, List<int> Indices) Naive(double[] x, int k, double nSigma)
    {
        var y = (double[])x.Clone();
        var idx = new List<int>();
        for (int i = 0; i < x.Length; i++)
        {
            var w = x[Math.Max(0, i - k)..(Math.Min(x.Length - 1, i + k) + 1)];
            double m = Median(w);
            double mad = Median(w.Select(v => Math.Abs(v - m)).ToArray());
            if (mad > 0 && Math.Abs(x[i] - m) > nSigma * HampelFilter.MadToSigma * mad)
            {
                y[i] = m;
                idx.Add(i);
            }
        }

        return (y, idx);
    }

    private static double Median(double[] v)
    {
        var s = v.Order().ToArray();
        int h = s.Length / 2;
        return s.Length % 2 == 1 ? s[h] : 0.5 * (s[h - 1] + s[h]);
    }
}
