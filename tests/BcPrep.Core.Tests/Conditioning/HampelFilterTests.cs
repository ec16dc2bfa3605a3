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

    // Reference: the plain definition (Definition below: each truncated window sorted afresh, non-finite samples left
    // out), on generated series that stress what the fast paths take for granted: the k = 10 network (four centres at
    // once, MAD from the two sorted runs of deviations), the sliding vector window (k = 1, 25), the seven-point
    // network (k = 3) and the general path (NaN cells). Values are compared bit for bit, indices in order.
    //  - isolated spikes, pairs and bursts up to k + 2 long: a burst of more than k moves the median itself, so a
    //    wrong order statistic or a lane mix-up in the network changes which samples are replaced and by what;
    //  - steps: windows whose two halves differ, where the MAD merge must take deviations from both sides;
    //  - plateaus of one repeated value (with and without a floor): MAD = 0, ties at the median, the flat-window rule;
    //  - quantised noise: ties everywhere and samples exactly at the threshold;
    //  - NaN cells: the general path, its windows shortened by the missing samples;
    //  - lengths from 1 to 2k + 9: no full window, a few full windows, and every position of the last vector group.
    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(10)]
    [InlineData(25)]
    public void Every_path_equals_the_definition_on_generated_series(int k)
    {
        foreach (var kind in new[] { "isolated", "pairs", "bursts", "steps", "plateaus", "quantised", "nan" })
        {
            foreach (var floor in new[] { 0.0, 0.05 })
            {
                for (var seed = 0; seed < 3; seed++)
                {
                    var x = Series(kind, 2500, k, seed);
                    AssertDefinition(x, k, 3.0, floor, kind);
                    AssertDefinition(x, k, 6.0, floor, kind);
                }
            }
        }

        for (var n = 1; n <= (2 * k) + 9; n++)
        {
            foreach (var kind in new[] { "bursts", "plateaus", "quantised", "nan" })
            {
                AssertDefinition(Series(kind, n, k, n), k, 2.0, 0.0, $"{kind}, n = {n}");
            }
        }
    }

    private static void AssertDefinition(double[] x, int k, double nSigma, double floor, string what)
    {
        var fast = HampelFilter.Apply(x, k, nSigma, floor);
        var (values, indices) = Definition(x, k, nSigma, floor);

        Assert.True(indices.SequenceEqual(fast.ReplacedIndices), $"{what}, k = {k}, n_σ = {nSigma}, floor = {floor}: replaced indices differ");
        for (var i = 0; i < x.Length; i++)
        {
            Assert.True(BitConverter.DoubleToInt64Bits(values[i]) == BitConverter.DoubleToInt64Bits(fast.Values[i]),
                $"{what}, k = {k}, n_σ = {nSigma}, floor = {floor}: sample {i} is {fast.Values[i]:R}, definition {values[i]:R}");
        }
    }

    /// <summary>Generated test series (noise of standard deviation about 0.1 on a level of 20 unless said).</summary>
    private static double[] Series(string kind, int n, int k, int seed)
    {
        var random = new Random((kind.Length * 1000) + (k * 10) + seed);
        double Noise() => 0.1 * (random.NextDouble() + random.NextDouble() + random.NextDouble() - 1.5);
        var x = new double[n];
        for (var i = 0; i < n; i++)
        {
            x[i] = 20.0 + Noise();
        }

        switch (kind)
        {
            case "isolated":
                for (var i = 5; i < n; i += 37 + random.Next(60))
                {
                    x[i] += (random.Next(2) == 0 ? -1 : 1) * (0.3 + (5.0 * random.NextDouble()));
                }
                break;
            case "pairs":
                for (var i = 3; i + 1 < n; i += 40 + random.Next(60))
                {
                    x[i] += 3.0;
                    x[i + 1] += random.Next(2) == 0 ? 3.0 : -2.0;
                }
                break;
            case "bursts":
                for (var i = 2; i < n; i += (3 * k) + 10 + random.Next(50))
                {
                    var length = 1 + random.Next(k + 2);
                    for (var j = i; j < Math.Min(n, i + length); j++)
                    {
                        x[j] += 4.0 + random.NextDouble();
                    }
                }
                break;
            case "steps":
                for (var i = 0; i < n; i++)
                {
                    x[i] += 2.0 * ((i / 150) % 3);
                }
                break;
            case "plateaus":
                for (var i = 0; i < n; i++)
                {
                    // Runs of one value (ties at the median, MAD = 0), a lone spike in some, noise between them.
                    if ((i / 60) % 2 == 0)
                    {
                        x[i] = 20.0 + (0.5 * ((i / 120) % 3));
                    }
                }
                for (var i = 7; i < n; i += 83)
                {
                    x[i] += 1.5;
                }
                break;
            case "quantised":
                for (var i = 0; i < n; i++)
                {
                    x[i] = 20.0 + (0.05 * Math.Round(x[i] / 0.05)) - 20.0 + (i % 97 == 13 ? 0.4 : 0.0);
                }
                break;
            case "nan":
                for (var i = 0; i < n; i++)
                {
                    if (random.Next(25) == 0)
                    {
                        x[i] = double.NaN;
                    }
                    else if (random.Next(40) == 0)
                    {
                        x[i] += 3.0;
                    }
                }
                break;
        }

        return x;
    }

    /// <summary>
    /// The Hampel rule by its definition: for each finite sample, the median and MAD of the finite samples of the window
    /// i − k … i + k (cut at the ends) by sorting; replaced by the median when max(1.4826·MAD, floor) &gt; 0 and
    /// |x − m| &gt; n_σ times it. The products are written as the filter writes them, so the numbers are comparable
    /// bit for bit.
    /// </summary>
    internal static (double[] Values, List<int> Indices) Definition(double[] x, int k, double nSigma, double floor)
    {
        var y = (double[])x.Clone();
        var idx = new List<int>();
        for (int i = 0; i < x.Length; i++)
        {
            if (!double.IsFinite(x[i]))
            {
                continue;
            }

            var w = x[Math.Max(0, i - k)..(Math.Min(x.Length - 1, i + k) + 1)].Where(double.IsFinite).ToArray();
            double m = Median(w);
            double mad = Median(w.Select(v => Math.Abs(v - m)).ToArray());
            double scale = Math.Max(HampelFilter.MadToSigma * mad, floor);
            if (scale > 0 && Math.Abs(x[i] - m) > nSigma * scale)
            {
                y[i] = m;
                idx.Add(i);
            }
        }

        return (y, idx);
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
