using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Conditioning;

/// <summary>Result of <see cref="HampelFilter.Apply"/>: the cleaned series and the 0-based indices replaced.</summary>
public sealed record HampelResult(double[] Values, IReadOnlyList<int> ReplacedIndices);

/// <summary>Moving-window Hampel identifier for spike removal.</summary>
public static class HampelFilter
{
    /// <summary>MAD-to-σ factor for Gaussian data, 1/Φ⁻¹(0.75).</summary>
    public const double MadToSigma = 1.482602218505602;

    /// <summary>
    /// For each sample i, over the window i−k…i+k (truncated at the ends; non-finite samples excluded), takes the
    /// median m_i and MAD_i = median|x_j − m_i|; replaces x_i by m_i when |x_i − m_i| &gt; n_σ·max(1.4826·MAD_i, floor).
    /// Windows are built from the original samples (not from already replaced ones).
    /// Flat-window rule: when MAD_i = 0 (more than half the window identical) and <paramref name="scaleFloor"/> is 0,
    /// nothing is flagged in that window; give the sensor resolution as the floor to catch spikes on a quantised,
    /// flat signal. NaN/∞ samples are passed through unchanged and never counted as replaced.
    /// Cost O(n·k) with a sorted window, no per-sample allocation.
    /// </summary>
    /// <param name="x">Samples (any unit).</param>
    /// <param name="halfWindow">k ≥ 1 neighbours per side (default 3).</param>
    /// <param name="sigmaThreshold">n_σ &gt; 0 (default 3).</param>
    /// <param name="scaleFloor">Lower bound of the robust σ, same unit as x, ≥ 0 (default 0).</param>
    /// <exception cref="BcPrepDataException">k &lt; 1, n_σ ≤ 0 or floor &lt; 0.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static HampelResult Apply(ReadOnlySpan<double> x, int halfWindow = 3, double sigmaThreshold = 3.0, double scaleFloor = 0.0)
    {
        Validate(halfWindow, sigmaThreshold, scaleFloor);
        bool finite = x.Length > 2 * halfWindow && AllFinite(x);
        if (halfWindow == SevenPointWindow.HalfWindow && finite)
        {
            return ApplySevenPoint(x, sigmaThreshold, scaleFloor);
        }

        if (halfWindow == TwentyOnePointWindow.HalfWindow && finite && TwentyOnePointWindow.IsAccelerated
            && x.Length - (2 * halfWindow) >= TwentyOnePointWindow.Lanes)
        {
            return ApplyTwentyOnePoint(x, sigmaThreshold, scaleFloor);
        }

        if (Vector.IsHardwareAccelerated && finite)
        {
            return ApplyVectorWindow(x, halfWindow, sigmaThreshold, scaleFloor);
        }

        int n = x.Length;
        var output = x.ToArray();
        var replaced = new List<int>();
        var window = new SortedWindow((2 * halfWindow) + 1);

        int right = -1;
        for (int i = 0; i < n; i++)
        {
            int leaving = i - halfWindow - 1;
            int last = Math.Min(n - 1, i + halfWindow);
            if (leaving >= 0 && right < last)
            {
                // In the middle of the record one sample leaves as one enters: one slide instead of two shifts.
                right++;
                window.Replace(x[leaving], x[right]);
            }
            else if (leaving >= 0)
            {
                window.Remove(x[leaving]);
            }

            while (right < last)
            {
                right++;
                window.Add(x[right]);
            }

            if (!double.IsFinite(x[i]) || window.Count == 0)
            {
                continue;
            }

            double median = window.Median();
            if (window.MadSurelyAbove(median, Math.Abs(x[i] - median) / (sigmaThreshold * MadToSigma)))
            {
                continue; // the usual sample: well inside its window's spread, no need for the exact MAD
            }

            if (IsSpike(x[i], median, window.MedianAbsoluteDeviation(median), sigmaThreshold, scaleFloor))
            {
                output[i] = median;
                replaced.Add(i);
            }
        }

        return new HampelResult(output, replaced);
    }

    /// <summary>
    /// The default window (k = 3) on finite samples: median and MAD of each full window from a sorting network,
    /// without branches that depend on the data, which is what made the sliding sorted window slow on noisy signals.
    /// The truncated windows at the two ends go through the general sorted window. Same values as the general path.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static HampelResult ApplySevenPoint(ReadOnlySpan<double> x, double sigmaThreshold, double scaleFloor)
    {
        const int k = SevenPointWindow.HalfWindow;
        int n = x.Length;
        var output = x.ToArray();
        var replaced = new List<int>();
        for (int i = 0; i < n; i++)
        {
            double median;
            double mad;
            if (i >= k && i < n - k)
            {
                (median, mad) = SevenPointWindow.MedianAndMad(x.Slice(i - k, (2 * k) + 1));
            }
            else
            {
                (median, mad) = TruncatedWindow(x, i, k);
            }

            if (IsSpike(x[i], median, mad, sigmaThreshold, scaleFloor))
            {
                output[i] = median;
                replaced.Add(i);
            }
        }

        return new HampelResult(output, replaced);
    }

    /// <summary>
    /// The usual window (k = 10) on finite samples: the full windows are decided four at a time by
    /// <see cref="TwentyOnePointWindow"/> (median and MAD from a sorting network, no branch on the data), the truncated
    /// ones at the two ends by the general sorted window. Same values as the general path.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static HampelResult ApplyTwentyOnePoint(ReadOnlySpan<double> x, double sigmaThreshold, double scaleFloor)
    {
        const int k = TwentyOnePointWindow.HalfWindow;
        int n = x.Length;
        var output = x.ToArray();
        var replaced = new List<int>();
        TruncatedEnd(x, 0, k, k, sigmaThreshold, scaleFloor, output, replaced);
        TwentyOnePointWindow.Apply(x, k, n - k, sigmaThreshold, scaleFloor, output, replaced);
        TruncatedEnd(x, n - k, n, k, sigmaThreshold, scaleFloor, output, replaced);
        return new HampelResult(output, replaced);
    }

    /// <summary>The rule for the centres <paramref name="from"/> … <paramref name="to"/> − 1 by the general sorted window.</summary>
    internal static void TruncatedEnd(ReadOnlySpan<double> x, int from, int to, int k, double sigmaThreshold, double scaleFloor, Span<double> output, List<int> replaced)
    {
        for (int i = from; i < to; i++)
        {
            var (median, mad) = TruncatedWindow(x, i, k);
            if (IsSpike(x[i], median, mad, sigmaThreshold, scaleFloor))
            {
                output[i] = median;
                replaced.Add(i);
            }
        }
    }

    /// <summary>
    /// Finite samples and any k: full windows slide through a <see cref="VectorSortedWindow"/>, the truncated ones
    /// at the two ends go through the general sorted window. Same decisions as the general path, step for step.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static HampelResult ApplyVectorWindow(ReadOnlySpan<double> x, int k, double sigmaThreshold, double scaleFloor)
    {
        var output = new double[x.Length];
        var replaced = SlidingInto(x, output, k, sevenPoint: false, sigmaThreshold, scaleFloor);
        return new HampelResult(output, replaced);
    }

    /// <summary>The Hampel rule: |x − m| &gt; n_σ·max(1.4826·MAD, floor), with a positive scale.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static bool IsSpike(double value, double median, double mad, double sigmaThreshold, double scaleFloor)
    {
        double scale = Math.Max(MadToSigma * mad, scaleFloor);
        return scale > 0.0 && Math.Abs(value - median) > sigmaThreshold * scale;
    }

    /// <summary>
    /// The radius of the quick "MAD surely above" test widened by far more than rounding (relative 1e-9, plus 1e-13
    /// of the values' magnitude), so that a "surely" never disagrees with the exact MAD.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double WidenedRadius(double median, double radius) => (radius * (1.0 + 1e-9)) + ((Math.Abs(median) + radius) * 1e-13);

    /// <summary>
    /// MAD of ascending values about their median. Deviations below the median (m − s[i], i descending) and above it
    /// (s[j] − m, j ascending) are each sorted, so the middle order statistics of |s − m| come from a merge that
    /// stops halfway.
    /// </summary>
    private static double SortedMad(ReadOnlySpan<double> sorted, double median)
    {
        int count = sorted.Length;
        int lo = SortedSearch.FirstAtOrAfter(sorted, median) - 1;
        int hi = lo + 1;
        int h = count / 2;
        double previous = 0.0;
        double current = 0.0;
        for (int rank = 0; rank <= h; rank++)
        {
            previous = current;
            double dLow = lo >= 0 ? median - sorted[lo] : double.PositiveInfinity;
            double dHigh = hi < count ? sorted[hi] - median : double.PositiveInfinity;
            if (dLow <= dHigh)
            {
                current = dLow;
                lo--;
            }
            else
            {
                current = dHigh;
                hi++;
            }
        }

        return (count % 2 == 1) ? current : 0.5 * (previous + current);
    }

    private static (double Median, double Mad) TruncatedWindow(ReadOnlySpan<double> x, int i, int k)
    {
        var window = new SortedWindow((2 * k) + 1);
        for (int j = Math.Max(0, i - k); j <= Math.Min(x.Length - 1, i + k); j++)
        {
            window.Add(x[j]);
        }

        double median = window.Median();
        return (median, window.MedianAbsoluteDeviation(median));
    }

    internal static bool AllFinite(ReadOnlySpan<double> x)
    {
        foreach (var v in x)
        {
            if (!double.IsFinite(v))
            {
                return false;
            }
        }

        return true;
    }

    internal static void Validate(int halfWindow, double sigmaThreshold, double scaleFloor)
    {
        if (halfWindow < 1)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Hampel half-window {halfWindow} must be at least 1."));
        }

        if (!(sigmaThreshold > 0.0) || !double.IsFinite(sigmaThreshold))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Hampel threshold {sigmaThreshold} (multiples of σ) must be positive and finite."));
        }

        if (!(scaleFloor >= 0.0) || !double.IsFinite(scaleFloor))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Hampel scale floor {scaleFloor} must be zero or positive."));
        }
    }

    /// <summary>A small sorted multiset of finite values with median and MAD by merging the two sides of the median.</summary>
    private sealed class SortedWindow(int capacity)
    {
        private readonly double[] _sorted = new double[capacity];

        public int Count { get; private set; }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Add(double value)
        {
            if (!double.IsFinite(value))
            {
                return;
            }

            int pos = Count;
            while (pos > 0 && _sorted[pos - 1] > value)
            {
                _sorted[pos] = _sorted[pos - 1];
                pos--;
            }

            _sorted[pos] = value;
            Count++;
        }

        /// <summary>Removes <paramref name="leaving"/> and adds <paramref name="entering"/> by sliding the entries between their places.</summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Replace(double leaving, double entering)
        {
            if (!double.IsFinite(leaving) || !double.IsFinite(entering))
            {
                Remove(leaving);
                Add(entering);
                return;
            }

            int pos = LowerBound(leaving);
            while (pos + 1 < Count && _sorted[pos + 1] < entering)
            {
                _sorted[pos] = _sorted[pos + 1];
                pos++;
            }

            while (pos > 0 && _sorted[pos - 1] > entering)
            {
                _sorted[pos] = _sorted[pos - 1];
                pos--;
            }

            _sorted[pos] = entering;
        }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Remove(double value)
        {
            if (!double.IsFinite(value))
            {
                return;
            }

            for (int pos = LowerBound(value); pos < Count - 1; pos++)
            {
                _sorted[pos] = _sorted[pos + 1];
            }

            Count--;
        }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public double Median()
        {
            int h = Count / 2;
            return (Count % 2 == 1) ? _sorted[h] : 0.5 * (_sorted[h - 1] + _sorted[h]);
        }

        public double MedianAbsoluteDeviation(double median) => SortedMad(_sorted.AsSpan(0, Count), median);

        /// <summary>
        /// True when the window's MAD about <paramref name="median"/> is certainly above <paramref name="radius"/>,
        /// so that a sample that far from the median is no spike. For an odd count 2h + 1 the MAD is the (h+1)-th
        /// smallest |s − m|, so it exceeds r when at most h values lie strictly inside (m − r, m + r): two binary
        /// searches instead of the merge. The radius is widened by far more than rounding (relative 1e-9, plus
        /// 1e-13 of the values' magnitude), so a "true" never disagrees with the exact MAD; near the boundary, and
        /// for an even count, the answer is false and the caller computes the MAD exactly.
        /// </summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public bool MadSurelyAbove(double median, double radius)
        {
            if (Count % 2 == 0 || !double.IsFinite(radius))
            {
                return false;
            }

            double wide = WidenedRadius(median, radius);
            int inside = LowerBound(median + wide) - UpperBound(median - wide);
            return inside <= Count / 2;
        }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        private int UpperBound(double value) => SortedSearch.FirstAfter(_sorted.AsSpan(0, Count), value);

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        private int LowerBound(double value) => SortedSearch.FirstAtOrAfter(_sorted.AsSpan(0, Count), value);
    }

    /// <summary>
    /// As <see cref="Apply"/>, but the cleaned series goes into <paramref name="output"/> (as long as
    /// <paramref name="x"/>, not overlapping it) instead of a new array, so a caller with a reusable buffer allocates
    /// nothing in proportion to the length; returns the replaced indices. On finite samples it takes the paths of
    /// <see cref="ApplySevenPoint"/> (k = 3), <see cref="ApplyTwentyOnePoint"/> (k = 10) and
    /// <see cref="ApplyVectorWindow"/> (any other k), writing into the buffer; with NaN/∞ samples it goes through
    /// <see cref="Apply"/> and copies.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static IReadOnlyList<int> ApplyInto(ReadOnlySpan<double> x, Span<double> output, int halfWindow = 3, double sigmaThreshold = 3.0, double scaleFloor = 0.0)
    {
        if (output.Length != x.Length || output.Overlaps(x))
        {
            throw new ArgumentException("The output must be as long as the samples and must not overlap them.", nameof(output));
        }

        Validate(halfWindow, sigmaThreshold, scaleFloor);
        bool finite = x.Length > 2 * halfWindow && AllFinite(x);
        bool sevenPoint = halfWindow == SevenPointWindow.HalfWindow;
        if (!finite || !(sevenPoint || Vector.IsHardwareAccelerated))
        {
            var result = Apply(x, halfWindow, sigmaThreshold, scaleFloor);
            result.Values.CopyTo(output);
            return result.ReplacedIndices;
        }

        int k = halfWindow;
        int n = x.Length;
        var replaced = new List<int>();
        if (k == TwentyOnePointWindow.HalfWindow && TwentyOnePointWindow.IsAccelerated && n - (2 * k) >= TwentyOnePointWindow.Lanes)
        {
            // As ApplyTwentyOnePoint: the kernel writes only the samples it replaces.
            x.CopyTo(output);
            TruncatedEnd(x, 0, k, k, sigmaThreshold, scaleFloor, output, replaced);
            TwentyOnePointWindow.Apply(x, k, n - k, sigmaThreshold, scaleFloor, output, replaced);
            TruncatedEnd(x, n - k, n, k, sigmaThreshold, scaleFloor, output, replaced);
            return replaced;
        }

        return SlidingInto(x, output, k, sevenPoint, sigmaThreshold, scaleFloor, replaced);
    }

    /// <summary>
    /// Finite samples: every sample into <paramref name="output"/>, full windows by the seven-point network (k = 3) or a
    /// sliding <see cref="VectorSortedWindow"/>, the truncated ones at the two ends by the general sorted window. Same
    /// decisions as the general path, step for step; returns the replaced indices.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static List<int> SlidingInto(ReadOnlySpan<double> x, Span<double> output, int k, bool sevenPoint, double sigmaThreshold, double scaleFloor, List<int>? replaced = null)
    {
        int n = x.Length;
        replaced ??= [];
        VectorSortedWindow? window = null;
        for (int i = 0; i < n; i++)
        {
            double median;
            double mad;
            if (i < k || i >= n - k)
            {
                (median, mad) = TruncatedWindow(x, i, k);
            }
            else if (sevenPoint)
            {
                (median, mad) = SevenPointWindow.MedianAndMad(x.Slice(i - k, (2 * k) + 1));
            }
            else
            {
                if (window is null)
                {
                    window = new VectorSortedWindow(x.Slice(i - k, (2 * k) + 1));
                }
                else
                {
                    window.Slide(x[i - k - 1], x[i + k]);
                }

                median = window.Median;
                double radius = Math.Abs(x[i] - median) / (sigmaThreshold * MadToSigma);
                if (double.IsFinite(radius))
                {
                    double wide = WidenedRadius(median, radius);
                    if (window.CountInside(median - wide, median + wide) <= k)
                    {
                        output[i] = x[i];
                        continue; // as in the general path: well inside the window's spread
                    }
                }

                mad = SortedMad(window.Sorted, median);
            }

            if (IsSpike(x[i], median, mad, sigmaThreshold, scaleFloor))
            {
                output[i] = median;
                replaced.Add(i);
            }
            else
            {
                output[i] = x[i];
            }
        }

        return replaced;
    }
}
