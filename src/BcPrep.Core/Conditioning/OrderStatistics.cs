namespace BcPrep.Conditioning;

/// <summary>Median by selection in place (Hoare's quickselect), on a span so that a scratch buffer can be used.</summary>
internal static class OrderStatistics
{
    /// <summary>
    /// The sample median, the mean of the two middle order statistics for an even count (the convention of
    /// MathNet's ArrayStatistics.MedianInplace). Reorders <paramref name="values"/>; expected O(n). NaN is not allowed.
    /// </summary>
    public static double MedianInPlace(Span<double> values)
    {
        if (values.Length == 0)
        {
            return double.NaN;
        }
        var upper = values.Length / 2;
        var upperValue = Select(values, upper);
        if (values.Length % 2 == 1)
        {
            return upperValue;
        }
        // After selection everything left of `upper` is ≤ it, so the lower middle is their maximum.
        var lowerValue = double.NegativeInfinity;
        foreach (var v in values[..upper])
        {
            lowerValue = Math.Max(lowerValue, v);
        }
        return 0.5 * (lowerValue + upperValue);
    }

    /// <summary>The k-th smallest (0-based); on return values[..k] ≤ values[k] ≤ values[(k+1)..].</summary>
    private static double Select(Span<double> values, int k)
    {
        var left = 0;
        var right = values.Length - 1;
        while (right > left)
        {
            var pivot = MedianOfThree(values[left], values[(left + right) >>> 1], values[right]);
            var i = left;
            var j = right;
            while (i <= j)
            {
                while (values[i] < pivot)
                {
                    i++;
                }
                while (values[j] > pivot)
                {
                    j--;
                }
                if (i <= j)
                {
                    (values[i], values[j]) = (values[j], values[i]);
                    i++;
                    j--;
                }
            }
            if (k <= j)
            {
                right = j;
            }
            else if (k >= i)
            {
                left = i;
            }
            else
            {
                return values[k];
            }
        }
        return values[k];
    }

    private static double MedianOfThree(double a, double b, double c) => Math.Max(Math.Min(a, b), Math.Min(Math.Max(a, b), c));
}
