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
    public static double[] Apply(IReadOnlyList<double> values, int halfWindow = 10, double sigmas = 4.0)
    {
        ArgumentNullException.ThrowIfNull(values);
        var n = values.Count;
        var result = new double[n];
        var window = new List<double>(2 * halfWindow + 1);
        var deviations = new List<double>(2 * halfWindow + 1);
        for (var i = 0; i < n; i++)
        {
            var v = values[i];
            result[i] = v;
            if (!double.IsFinite(v))
            {
                continue;
            }
            window.Clear();
            for (var j = Math.Max(0, i - halfWindow); j <= Math.Min(n - 1, i + halfWindow); j++)
            {
                if (double.IsFinite(values[j]))
                {
                    window.Add(values[j]);
                }
            }
            if (window.Count < 5)
            {
                continue;
            }
            var median = Median(window);
            deviations.Clear();
            deviations.AddRange(window.Select(w => Math.Abs(w - median)));
            var scale = 1.4826 * Median(deviations);
            if (scale > 0 && Math.Abs(v - median) > sigmas * scale)
            {
                result[i] = median;
            }
        }
        return result;
    }

    internal static double Median(List<double> values)
    {
        values.Sort();
        var n = values.Count;
        return n % 2 == 1 ? values[n / 2] : 0.5 * (values[(n / 2) - 1] + values[n / 2]);
    }
}
