using System.Globalization;

namespace BcPrep.Steady;

/// <summary>Result of MSER truncation: truncation point in raw samples and batches, the minimum statistic, and
/// whether the minimum lies strictly inside the searched first half (otherwise the run is too short or not steady).</summary>
public readonly record struct MserResult(int TruncationSamples, int TruncationBatches, double MinimumStatistic, bool InsideFirstHalf);

/// <summary>MSER warm-up truncation (White 1997) and MSER-5 (Spratt 1998: the same rule on batch means of 5).</summary>
public static class Mser
{
    /// <summary>MSER(d) = Σ_{i&gt;d}(Y_i − Ȳ_d)² / (n − d)², Ȳ_d the mean of Y_{d+1..n} (0-based: samples d…n−1).</summary>
    /// <exception cref="ArgumentOutOfRangeException">d outside 0…n−1 (a caller's mistake).</exception>
    public static double Statistic(ReadOnlySpan<double> y, int d)
    {
        if (d < 0 || d >= y.Length)
        {
            throw new ArgumentOutOfRangeException(nameof(d), d, string.Create(CultureInfo.InvariantCulture, $"MSER truncation must lie in 0…{y.Length - 1}."));
        }

        var tail = y[d..];
        double mean = 0.0;
        foreach (double v in tail)
        {
            mean += v;
        }

        mean /= tail.Length;
        double ss = 0.0;
        foreach (double v in tail)
        {
            ss += (v - mean) * (v - mean);
        }

        return ss / ((double)tail.Length * tail.Length);
    }

    /// <summary>
    /// d* = argmin MSER(d) over 0 ≤ d ≤ ⌊m/2⌋ on the m batch means of <paramref name="batchSize"/> consecutive samples
    /// (a trailing partial batch is dropped; batchSize 1 = MSER, 5 = MSER-5). O(n) by suffix sums about the overall
    /// mean. Ties go to the smallest d. Non-finite samples are not allowed.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">batchSize &lt; 1.</exception>
    /// <exception cref="BcPrepDataException">Fewer than 4 batches, or a non-finite sample.</exception>
    public static MserResult Truncate(ReadOnlySpan<double> y, int batchSize = 1)
    {
        if (batchSize < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(batchSize), batchSize, "The MSER batch size must be at least 1.");
        }

        int m = y.Length / batchSize;
        if (m < 4)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"MSER needs at least 4 batches; {y.Length} samples give {m} batches of {batchSize}."));
        }

        var batches = new double[m];
        double grand = 0.0;
        for (int b = 0; b < m; b++)
        {
            double s = 0.0;
            for (int j = 0; j < batchSize; j++)
            {
                double v = y[(b * batchSize) + j];
                if (!double.IsFinite(v))
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"MSER sample {(b * batchSize) + j} is {v}."));
                }

                s += v;
            }

            batches[b] = s / batchSize;
            grand += batches[b];
        }

        grand /= m;
        double sum = 0.0, sumSq = 0.0;
        int bestD = 0;
        double best = double.PositiveInfinity;
        var stats = new double[(m / 2) + 1];
        for (int d = m - 1; d >= 0; d--)
        {
            double c = batches[d] - grand;
            sum += c;
            sumSq += c * c;
            int count = m - d;
            if (d <= m / 2)
            {
                stats[d] = (sumSq - (sum * sum / count)) / ((double)count * count);
            }
        }

        for (int d = 0; d <= m / 2; d++)
        {
            if (stats[d] < best)
            {
                best = stats[d];
                bestD = d;
            }
        }

        return new MserResult(bestD * batchSize, bestD, best, bestD < m / 2);
    }
}
