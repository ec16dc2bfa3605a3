using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class RadixTwoFftTests
{
    // Reference: the definition of the discrete Fourier transform, X[k] = Σ x[j]·exp(−2πi·jk/n), summed directly.
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(8)]
    [InlineData(64)]
    [InlineData(1024)]
    public void Forward_transform_equals_the_dft_definition(int n)
    {
        var random = new Random(n);
        var re = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var im = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var (expectedRe, expectedIm) = Dft(re, im);

        RadixTwoFft.Transform(re, im, n, inverse: false);

        for (var k = 0; k < n; k++)
        {
            Assert.Equal(expectedRe[k], re[k], 1e-11);
            Assert.Equal(expectedIm[k], im[k], 1e-11);
        }
    }

    // Reference: the inverse of an unnormalised DFT returns n times the input.
    [Fact]
    public void Inverse_after_forward_returns_n_times_the_input()
    {
        const int n = 4096;
        var random = new Random(5);
        var original = Enumerable.Range(0, n).Select(_ => random.NextDouble()).ToArray();
        var re = (double[])original.Clone();
        var im = new double[n];

        RadixTwoFft.Transform(re, im, n, inverse: false);
        RadixTwoFft.Transform(re, im, n, inverse: true);

        for (var j = 0; j < n; j++)
        {
            Assert.Equal(original[j] * n, re[j], 1e-9);
            Assert.Equal(0.0, im[j], 1e-9);
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(3)]
    [InlineData(12)]
    public void Refuses_a_length_that_is_not_a_power_of_two(int n)
    {
        var buffer = new double[16];
        Assert.Throws<ArgumentException>(() => RadixTwoFft.Transform(buffer, buffer.ToArray(), n, inverse: false));
    }

    // Reference: the twiddle's definition, cos and sin of 2πk/n computed by Math.Cos and Math.Sin for that n. The
    // contiguous copy of the stages up to ContiguousStages holds exactly those doubles, whatever size was asked first,
    // so the short stages give the bits they gave with a table per size.
    [Fact]
    public void Stages_up_to_the_contiguous_limit_read_the_twiddles_their_own_expression_gives_to_the_bit()
    {
        Assert.Equal(1 << 18, RadixTwoFft.ContiguousStages);
        foreach (var sizes in new[] { new[] { 8, 64, 1 << 14, 1 << 18 }, new[] { 1 << 18, 1 << 15, 4, 512 } })
        {
            foreach (var n in sizes)
            {
                var twiddles = RadixTwoFft.TwiddlesFor(n);
                Assert.Equal(n / 2, twiddles.Count);
                for (var k = 0; k < n / 2; k++)
                {
                    var angle = 2.0 * Math.PI * k / n;
                    Assert.Equal(BitConverter.DoubleToInt64Bits(Math.Cos(angle)), BitConverter.DoubleToInt64Bits(twiddles.Cos(k)));
                    Assert.Equal(BitConverter.DoubleToInt64Bits(Math.Sin(angle)), BitConverter.DoubleToInt64Bits(twiddles.Sin(k)));
                }
            }
        }
    }

    // Reference: the same definition, cos and sin of 2πk/n by Math.Cos and Math.Sin of the rounded angle, and the
    // exact twiddle cos, sin(π·2k/n) by double.CosPi/SinPi (2k/n is exact in binary, so no angle is rounded). Past the
    // contiguous limit the twiddles are made from two small tables (an angle sum); every one of them, at the 2²² points
    // of a 20-minute window at 1 kHz and at sizes read with a stride after it, must lie within 4.5e-16 of both (the
    // bound FactoredTwiddles names, four units in the last place of a number in [0.5, 1); measured 4.44e-16 against
    // either, where the direct values lie up to 3.9e-16 from the exact ones), and those whose fine index is 0 must be
    // the direct doubles exactly.
    [Fact]
    public void Long_stage_twiddles_lie_within_the_named_bound_of_the_direct_values()
    {
        const double bound = 4.5e-16;
        foreach (var n in new[] { 1 << 22, 1 << 19, 1 << 21, 1 << 20 })
        {
            var twiddles = RadixTwoFft.TwiddlesFor(n);
            Assert.Equal(n / 2, twiddles.Count);
            var worst = 0.0;
            var worstExact = 0.0;
            var worstDirectExact = 0.0;
            for (var k = 0; k < n / 2; k++)
            {
                var angle = 2.0 * Math.PI * k / n;
                var (cos, sin) = twiddles.At(k);
                worst = Math.Max(worst, Math.Max(Math.Abs(cos - Math.Cos(angle)), Math.Abs(sin - Math.Sin(angle))));
                var turns = 2.0 * k / n;
                worstExact = Math.Max(worstExact, Math.Max(Math.Abs(cos - double.CosPi(turns)), Math.Abs(sin - double.SinPi(turns))));
                worstDirectExact = Math.Max(worstDirectExact, Math.Max(Math.Abs(Math.Cos(angle) - double.CosPi(turns)), Math.Abs(Math.Sin(angle) - double.SinPi(turns))));
            }
            Assert.True(worst <= bound, $"largest difference from the direct values at {n} points: {worst:E3}");
            Assert.True(worstExact <= bound, $"largest difference from the exact twiddles at {n} points: {worstExact:E3} (direct values: {worstDirectExact:E3})");
        }
        var table = FactoredTwiddles.Build(1 << 22);
        for (var h = 0; h < (1 << 21); h += 1 << 11)
        {
            var angle = 2.0 * Math.PI * h / (1 << 22);
            Assert.Equal(BitConverter.DoubleToInt64Bits(Math.Cos(angle)), BitConverter.DoubleToInt64Bits(table.At(h).Cos));
            Assert.Equal(BitConverter.DoubleToInt64Bits(Math.Sin(angle)), BitConverter.DoubleToInt64Bits(table.At(h).Sin));
        }
    }

    // The factored tables must be small: that is their point (32 MB for the direct table at 2²² points).
    [Fact]
    public void Factored_twiddles_at_the_longest_window_stay_small()
    {
        var before = GC.GetAllocatedBytesForCurrentThread();
        _ = FactoredTwiddles.Build(1 << 22);
        var allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.InRange(allocated, 1, 64 * 1024);
    }

    // Reference: handbook values of sine and cosine: at 1/8 of a turn cos = sin = √2/2, at a quarter turn cos = 0 and
    // sin = 1, read from the contiguous copy (8 points) and the long table (2²⁰ points).
    [Fact]
    public void Known_twiddles_are_the_handbook_values()
    {
        var eight = RadixTwoFft.TwiddlesFor(8);
        Assert.Equal(1.0, eight.Cos(0));
        Assert.Equal(0.0, eight.Sin(0));
        Assert.Equal(Math.Sqrt(0.5), eight.Cos(1), 3e-16);
        Assert.Equal(Math.Sqrt(0.5), eight.Sin(1), 3e-16);
        Assert.Equal(0.0, eight.Cos(2), 1e-16);
        Assert.Equal(1.0, eight.Sin(2));
        var longStage = RadixTwoFft.TwiddlesFor(1 << 20);
        Assert.Equal(0.0, longStage.Cos(1 << 18), 1e-16);
        Assert.Equal(1.0, longStage.Sin(1 << 18));
        Assert.Equal(Math.Sqrt(0.5), longStage.Cos(1 << 17), 3e-16);
    }

    // The long stages (past 2¹⁸) read their twiddles from the long table with a stride, a chunk at a time: the sizes
    // 2¹⁹ and 2²⁰ cover one and two such stages, both ways.
    [Theory]
    [InlineData(2, false)]
    [InlineData(4, true)]
    [InlineData(16, false)]
    [InlineData(8192, false)]
    [InlineData(32768, true)]
    [InlineData(1 << 19, false)]
    [InlineData(1 << 20, true)]
    public void Cache_blocked_stages_equal_whole_array_stages_to_the_bit(int n, bool inverse)
    {
        var random = new Random(n);
        var re = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var im = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var expectedRe = (double[])re.Clone();
        var expectedIm = (double[])im.Clone();
        StageByStage(expectedRe, expectedIm, inverse);

        RadixTwoFft.Transform(re, im, n, inverse);

        Assert.Equal(expectedRe, re);
        Assert.Equal(expectedIm, im);
    }

    // The same transform with every twiddle the direct Math.Cos/Math.Sin value: the factored long-stage twiddles move
    // the result only by rounding. Bound: a radix-2 transform's rounding error grows about as √(log₂ n)·ε·max|X|
    // (common practice, from memory); 1e-14 of the largest output leaves room on top of that.
    [Theory]
    [InlineData(1 << 20, false)]
    [InlineData(1 << 21, true)]
    public void Factored_long_stage_twiddles_move_a_transform_only_by_rounding(int n, bool inverse)
    {
        var random = new Random(n);
        var re = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var im = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var directRe = (double[])re.Clone();
        var directIm = (double[])im.Clone();
        StageByStage(directRe, directIm, inverse, directTwiddles: true);

        RadixTwoFft.Transform(re, im, n, inverse);

        var largest = directRe.Concat(directIm).Max(Math.Abs);
        var worst = 0.0;
        for (var i = 0; i < n; i++)
        {
            worst = Math.Max(worst, Math.Max(Math.Abs(re[i] - directRe[i]), Math.Abs(im[i] - directIm[i])));
        }
        Assert.True(worst <= 1e-14 * largest, $"largest difference {worst:E3} against {largest:E3}");
    }

    [Fact]
    public void Tiled_bit_reversal_puts_every_element_at_its_reversed_index_as_the_straightforward_pass_does()
    {
        // Every power of two from 1 to 2^17: below 2^6 the straightforward pass itself, from there the tiles, with a
        // middle of 0 to 11 bits (tiles that are their own mirror and tiles that trade with another).
        for (var bits = 0; bits <= 17; bits++)
        {
            var n = 1 << bits;
            var re = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
            var im = Enumerable.Range(0, n).Select(i => -0.5 - i).ToArray();
            var straightRe = (double[])re.Clone();
            var straightIm = (double[])im.Clone();
            RadixTwoFft.BitReverseStraight(straightRe, straightIm, n);

            RadixTwoFft.BitReverse(re, im, n);

            Assert.Equal(straightRe, re);
            Assert.Equal(straightIm, im);
            // The definition itself: element i holds what was at i with its bits reversed.
            for (var i = 0; i < n; i++)
            {
                var reversed = 0;
                for (var b = 0; b < bits; b++)
                {
                    reversed |= ((i >> b) & 1) << (bits - 1 - b);
                }
                Assert.Equal(reversed, re[i]);
            }
        }
    }

    /// <summary>Bit reversal, then each stage over the whole array, twiddles cos, sin(2πk/L) computed for each stage.</summary>
    private static void StageByStage(double[] re, double[] im, bool inverse, bool directTwiddles = false)
    {
        var n = re.Length;
        for (int i = 1, j = 0; i < n; i++)
        {
            var bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1)
            {
                j ^= bit;
            }
            j ^= bit;
            if (i < j)
            {
                (re[i], re[j]) = (re[j], re[i]);
                (im[i], im[j]) = (im[j], im[i]);
            }
        }
        var sign = inverse ? 1.0 : -1.0;
        for (var length = 2; length <= n; length <<= 1)
        {
            var half = length >> 1;
            var cos = new double[half];
            var sin = new double[half];
            // Past the contiguous limit the transform's own twiddles (the factored tables, tested against the direct
            // values above), so that this checks the order of the stages to the bit; the direct values on request.
            var table = length > RadixTwoFft.ContiguousStages && !directTwiddles ? RadixTwoFft.TwiddlesFor(length) : (StageTwiddles?)null;
            for (var k = 0; k < half; k++)
            {
                (cos[k], sin[k]) = table is { } t ? t.At(k) : (Math.Cos(2.0 * Math.PI * k / length), Math.Sin(2.0 * Math.PI * k / length));
            }
            for (var start = 0; start < n; start += length)
            {
                for (var k = 0; k < half; k++)
                {
                    var wr = cos[k];
                    var wi = sign * sin[k];
                    var a = start + k;
                    var b = a + half;
                    var tr = (re[b] * wr) - (im[b] * wi);
                    var ti = (re[b] * wi) + (im[b] * wr);
                    re[b] = re[a] - tr;
                    im[b] = im[a] - ti;
                    re[a] += tr;
                    im[a] += ti;
                }
            }
        }
    }

    private static (double[] Re, double[] Im) Dft(double[] re, double[] im)
    {
        var n = re.Length;
        var outRe = new double[n];
        var outIm = new double[n];
        for (var k = 0; k < n; k++)
        {
            for (var j = 0; j < n; j++)
            {
                var angle = -2.0 * Math.PI * j * k / n;
                outRe[k] += (re[j] * Math.Cos(angle)) - (im[j] * Math.Sin(angle));
                outIm[k] += (re[j] * Math.Sin(angle)) + (im[j] * Math.Cos(angle));
            }
        }
        return (outRe, outIm);
    }
}
