using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class InPlaceHampelTests
{
    private const int K = TwentyOnePointWindow.HalfWindow;
    private const int Block = InPlaceHampel.BlockCentres;

    /// <summary>Lengths at the shortest the rule takes, and around one, two and three blocks of centres.</summary>
    public static TheoryData<int> Lengths() => new()
    {
        (2 * K) + TwentyOnePointWindow.Lanes, (2 * K) + 5, 300, Block - 1, Block + (2 * K), (2 * Block) + (2 * K) - 1,
        (2 * Block) + (2 * K), (2 * Block) + (2 * K) + 1, (3 * Block) + 7, (5 * Block) + (2 * K) + 3,
    };

    /// <summary>
    /// A slow wave with noise and spikes at both ends, around every block boundary (where a block's first windows reach
    /// back into samples the block before replaced) and in clusters of two and three.
    /// </summary>
    private static double[] SpikySeries(int n, int seed)
    {
        var random = new Random(seed);
        var x = Enumerable.Range(0, n).Select(i => 10.0 + Math.Sin(i * 0.001) + (0.1 * random.NextDouble())).ToArray();
        var at = new List<int> { 0, 1, K - 1, K, K + 1, n / 2, n / 2 + 1, n / 2 + 2, n - K - 1, n - K, n - 2, n - 1 };
        for (var b = K + Block; b < n; b += Block)
        {
            at.AddRange([b - K - 1, b - K, b - 1, b, b + 1, b + K - 1, b + K]);
        }
        for (var s = 0; s < n / 50; s++)
        {
            at.Add(random.Next(n));
        }
        foreach (var i in at.Where(i => i >= 0 && i < n).Distinct())
        {
            x[i] += (random.Next(2) == 0 ? -1 : 1) * (2.0 + (3.0 * random.NextDouble()));
        }
        return x;
    }

    // Reference: HampelFilter.ApplyInto, which builds every window from the original samples (Pearson 2002 as in the
    // filter's own tests); the in-place rule must give the same replaced indices, in the same order, and the same bits.
    [Theory]
    [MemberData(nameof(Lengths))]
    public void Writing_over_the_samples_gives_what_apply_into_gives(int n)
    {
        foreach (var (sigmas, floor) in new[] { (3.0, 0.0), (6.0, 0.0), (3.0, 0.05) })
        {
            var original = SpikySeries(n, n + (int)(sigmas * 10) + (floor > 0 ? 1 : 0));
            var expected = new double[n];
            var expectedReplaced = HampelFilter.ApplyInto(original, expected, K, sigmas, floor);
            var x = (double[])original.Clone();
            var replaced = new List<int>();
            var originals = new List<double>();

            Assert.True(InPlaceHampel.TryApply(x, sigmas, floor, replaced, originals));

            Assert.Equal(expectedReplaced, replaced);
            Assert.Equal(expected.Select(BitConverter.DoubleToInt64Bits), x.Select(BitConverter.DoubleToInt64Bits));
            Assert.Equal(replaced.Select(i => BitConverter.DoubleToInt64Bits(original[i])), originals.Select(BitConverter.DoubleToInt64Bits));
            // Spikes were found near both ends and, past one block, beside a block boundary (a test that found
            // nothing there would prove nothing).
            Assert.Contains(replaced, i => i < K);
            Assert.Contains(replaced, i => i >= n - (2 * K));
            if (n > Block + (3 * K))
            {
                Assert.Contains(replaced, i => Math.Abs(i - (K + Block)) <= K);
            }
        }
    }

    // Common practice: a series with a flat stretch (MAD = 0, nothing flagged without a floor) and a step, where the
    // in-place copy's carried originals decide the windows across the step; still the same as ApplyInto.
    [Fact]
    public void A_flat_stretch_and_a_step_across_a_block_boundary_give_what_apply_into_gives()
    {
        var n = (2 * Block) + 500;
        var original = Enumerable.Range(0, n).Select(i => i < Block + K - 3 ? 1.0 : 5.0 + (i % 7 * 1e-3)).ToArray();
        original[Block + K] = 50.0;
        original[100] = 3.0;
        var expected = new double[n];
        var expectedReplaced = HampelFilter.ApplyInto(original, expected, K, 3.0, 0.0);
        var x = (double[])original.Clone();
        var replaced = new List<int>();

        Assert.True(InPlaceHampel.TryApply(x, 3.0, 0.0, replaced, []));

        Assert.Equal(expectedReplaced, replaced);
        Assert.Equal(expected.Select(BitConverter.DoubleToInt64Bits), x.Select(BitConverter.DoubleToInt64Bits));
        Assert.Contains(Block + K, replaced);
    }

    // Common practice: only the usual window on finite samples long enough for one vector of centres is done in
    // place; the rest goes through ApplyInto into a second array, and TryApply leaves it as it is.
    [Fact]
    public void Only_the_usual_window_on_finite_samples_is_taken()
    {
        var x = Enumerable.Range(0, 100).Select(i => (double)i).ToArray();
        Assert.True(InPlaceHampel.Applies(x, K));
        Assert.False(InPlaceHampel.Applies(x, 3));
        Assert.False(InPlaceHampel.Applies(x.AsSpan(0, (2 * K) + TwentyOnePointWindow.Lanes - 1), K));
        x[50] = double.NaN;
        Assert.False(InPlaceHampel.Applies(x, K));
        var before = (double[])x.Clone();
        var replaced = new List<int>();
        Assert.False(InPlaceHampel.TryApply(x, 3.0, 0.0, replaced, []));
        Assert.Empty(replaced);
        Assert.Equal(before.Select(BitConverter.DoubleToInt64Bits), x.Select(BitConverter.DoubleToInt64Bits));
    }
}
