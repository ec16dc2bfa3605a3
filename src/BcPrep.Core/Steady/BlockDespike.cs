namespace BcPrep.Steady;

/// <summary>
/// Hampel rule on a series of block means: a block more than <c>sigmas</c> robust standard deviations (1.4826·MAD)
/// from the median of its neighbours is replaced by that median. A spike of a few samples that survived into a
/// block mean (at a high rate, or when the samples were not de-spiked) would otherwise pass for a step or wreck a
/// scatter test. NaN blocks (gaps) stay NaN and are not counted as neighbours, so a gap never creates a value.
/// </summary>
public static class BlockDespike
{
    /// <summary>The same numbers as the window statistics' Hampel rule, on blocks: 10 neighbours each side, 4 σ.</summary>
    public static double[] Apply(IReadOnlyList<double> values, int halfWindow = DefaultHalfWindow, double sigmas = DefaultSigmas)
    {
        ArgumentNullException.ThrowIfNull(values);
        var all = values as double[] ?? [.. values];
        var result = new double[all.Length];
        var scratch = new List<double>(2 * halfWindow + 1);
        for (var i = 0; i < all.Length; i++)
        {
            result[i] = At(all, all.Length, i, scratch, halfWindow, sigmas);
        }
        return result;
    }

    /// <summary>Neighbours on each side of a block.</summary>
    public const int DefaultHalfWindow = 10;

    /// <summary>Robust standard deviations beyond which a block is replaced.</summary>
    public const double DefaultSigmas = 4.0;

    /// <summary>
    /// The de-spiked value of block <paramref name="i"/> of the first <paramref name="count"/> blocks. It depends on
    /// the blocks up to <paramref name="halfWindow"/> after it only, so a streaming scan gets the same value as soon
    /// as those have arrived.
    /// </summary>
    internal static double At(double[] values, int count, int i, List<double> scratch, int halfWindow = DefaultHalfWindow, double sigmas = DefaultSigmas)
    {
        var v = values[i];
        if (!double.IsFinite(v))
        {
            return v;
        }
        scratch.Clear();
        for (var j = Math.Max(0, i - halfWindow); j <= Math.Min(count - 1, i + halfWindow); j++)
        {
            if (double.IsFinite(values[j]))
            {
                scratch.Add(values[j]);
            }
        }
        if (scratch.Count < 5)
        {
            return v;
        }
        var median = Median(scratch);
        for (var j = 0; j < scratch.Count; j++)
        {
            scratch[j] = Math.Abs(scratch[j] - median);
        }
        var scale = 1.4826 * Median(scratch);
        return scale > 0 && Math.Abs(v - median) > sigmas * scale ? median : v;
    }

    /// <summary>
    /// The median of at least one finite value (the mean of the two middle ones for an even count), by selection: the
    /// same order statistics as sorting gives, so the same value to the bit (block means and their differences are
    /// never −0, the one value sorting and selection could place apart from +0), without sorting a day's values.
    /// Reorders <paramref name="values"/>.
    /// </summary>
    internal static double Median(List<double> values) => Median(System.Runtime.InteropServices.CollectionsMarshal.AsSpan(values));

    /// <inheritdoc cref="Median(List{double})"/>
    internal static double Median(Span<double> values) => Conditioning.OrderStatistics.MedianInPlace(values);
}
