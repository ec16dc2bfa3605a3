namespace BcPrep.Steady;

/// <summary>
/// Finds set-point steps in block-mean series: where the mean of the next <c>h</c> blocks differs from the mean of
/// the previous <c>h</c> by more than a channel's step threshold. Means, not medians, because a mean difference
/// peaks sharply where a step is, a median difference is flat across it. Each run of blocks above the threshold
/// gives one candidate at its peak, which is then moved back to the first block that left the level before it
/// (more than <see cref="OnsetSigmas"/> noise standard deviations): a first-order response peaks a few blocks
/// after its step. Candidates of all channels within <c>3h</c> blocks of each other are one step, at the earliest
/// onset. Gaps (NaN blocks) are skipped on both sides, so they neither make nor hide a step.
/// </summary>
public static class StepFinder
{
    /// <summary>Onset: a block farther than this many noise standard deviations from the level before the step.</summary>
    public const double OnsetSigmas = 4.0;

    /// <summary>Block indices at which a step begins (the first block of the new level), in increasing order.</summary>
    /// <param name="series">Per channel, despiked block means.</param>
    /// <param name="thresholds">Per channel, the smallest change of mean that is a step (channel unit).</param>
    /// <param name="noise">Per channel, the noise standard deviation of one block mean.</param>
    /// <param name="half">Blocks on each side of the compared means.</param>
    public static IReadOnlyList<int> Find(IReadOnlyList<double[]> series, IReadOnlyList<double> thresholds, IReadOnlyList<double> noise, int half)
    {
        ArgumentNullException.ThrowIfNull(series);
        ArgumentNullException.ThrowIfNull(thresholds);
        ArgumentNullException.ThrowIfNull(noise);
        var candidates = new List<int>();
        for (var c = 0; c < series.Count; c++)
        {
            candidates.AddRange(ChannelSteps(series[c], thresholds[c], noise[c], half));
        }
        candidates.Sort();
        var steps = new List<int>();
        foreach (var k in candidates)
        {
            if (steps.Count == 0 || k - steps[^1] > 3 * half)
            {
                steps.Add(k);
            }
        }
        return steps;
    }

    private static List<int> ChannelSteps(double[] y, double threshold, double noise, int half)
    {
        var result = new List<int>();
        var n = y.Length;
        var runBest = -1;
        var runScore = 0.0;
        for (var k = half; k <= n - half; k++)
        {
            var score = Math.Abs(Mean(y, k, k + half) - Mean(y, k - half, k)) / threshold;
            if (score > 1.0)
            {
                if (score > runScore)
                {
                    runScore = score;
                    runBest = k;
                }
            }
            else if (runBest >= 0)
            {
                result.Add(Onset(y, runBest, noise, half));
                runBest = -1;
                runScore = 0.0;
            }
        }
        if (runBest >= 0)
        {
            result.Add(Onset(y, runBest, noise, half));
        }
        return result;
    }

    /// <summary>The first block in [peak − h, peak] that left the level of the blocks before it (their median).</summary>
    internal static int Onset(double[] y, int peak, double noise, int half)
    {
        var before = new List<double>();
        for (var i = Math.Max(0, peak - (3 * half)); i < peak - half; i++)
        {
            if (double.IsFinite(y[i]))
            {
                before.Add(y[i]);
            }
        }
        if (before.Count < 3 || !(noise > 0))
        {
            return peak;
        }
        var level = BlockDespike.Median(before);
        for (var k = Math.Max(0, peak - half); k <= peak; k++)
        {
            if (double.IsFinite(y[k]) && Math.Abs(y[k] - level) > OnsetSigmas * noise)
            {
                return k;
            }
        }
        return peak;
    }

    private static double Mean(double[] y, int from, int to) => Mean(y, y.Length, from, to);

    /// <summary>Mean of the finite blocks in [from, to) of the first <paramref name="length"/>; NaN when fewer than half are finite.</summary>
    internal static double Mean(double[] y, int length, int from, int to)
    {
        var sum = 0.0;
        var count = 0;
        for (var i = Math.Max(0, from); i < Math.Min(length, to); i++)
        {
            if (double.IsFinite(y[i]))
            {
                sum += y[i];
                count++;
            }
        }
        return count * 2 >= to - from ? sum / count : double.NaN;
    }

    /// <summary>Noise standard deviation of a block series from its first differences: 1.4826·MAD(Δy)/√2 (robust to steps and spikes).</summary>
    public static double Noise(IReadOnlyList<double> y)
    {
        ArgumentNullException.ThrowIfNull(y);
        return Noise((y as double[] ?? [.. y]).AsSpan());
    }

    /// <inheritdoc cref="Noise(IReadOnlyList{double})"/>
    /// <remarks>
    /// On a span, with the differences in one array reused for their deviations: the streaming scan takes it over a
    /// day's block means at every grid point, where a list and a sort of each were most of the main thread's detection.
    /// </remarks>
    internal static double Noise(ReadOnlySpan<double> y)
    {
        var differences = y.Length > 1 ? new double[y.Length - 1] : [];
        var count = 0;
        for (var i = 1; i < y.Length; i++)
        {
            if (double.IsFinite(y[i]) && double.IsFinite(y[i - 1]))
            {
                differences[count++] = y[i] - y[i - 1];
            }
        }
        if (count < 3)
        {
            return 0.0;
        }
        var d = differences.AsSpan(0, count);
        var median = BlockDespike.Median(d);
        for (var i = 0; i < d.Length; i++)
        {
            d[i] = Math.Abs(d[i] - median);
        }
        return 1.4826 * BlockDespike.Median(d) / Math.Sqrt(2.0);
    }
}
