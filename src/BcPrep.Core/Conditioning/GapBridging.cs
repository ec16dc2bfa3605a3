using System.Globalization;
using System.Numerics;

namespace BcPrep.Conditioning;

/// <summary>
/// One gap between two valid samples. <see cref="StartS"/> is the time of the last valid sample before it and
/// <see cref="EndS"/> the first valid one after (at a record edge: the first / last missing cell's time).
/// <see cref="MissingSamples"/> counts non-finite cells plus samples absent from a time jump (at the nominal interval).
/// </summary>
public readonly record struct DataGap(double StartS, double EndS, int MissingSamples, bool Bridged, bool AtRecordEdge)
{
    /// <summary>EndS − StartS.</summary>
    public double DurationS => EndS - StartS;
}

/// <summary>What <see cref="GapBridging.Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/> found and changed.</summary>
public sealed record GapReport(
    double NominalIntervalS,
    int NonFiniteCells,
    int TimeJumps,
    int InsertedSamples,
    int InterpolatedSamples,
    IReadOnlyList<DataGap> Gaps)
{
    /// <summary>Gaps that were bridged by interpolation.</summary>
    public IEnumerable<DataGap> Bridged => Gaps.Where(g => g.Bridged);

    /// <summary>Gaps left open (too long, or at a record edge where interpolation would be extrapolation).</summary>
    public IEnumerable<DataGap> Unbridged => Gaps.Where(g => !g.Bridged);
}

/// <summary>Series after gap bridging: new time axis (s), values, and a per-sample flag for interpolated values.</summary>
public sealed record GapBridgeResult(double[] TimesS, double[] Values, bool[] Interpolated, GapReport Report);

/// <summary>What the gap search found: the report, the pairs of valid samples (indices) whose gap is bridged, the nominal interval and jump limit.</summary>
internal sealed record GapSearch(GapReport Report, IReadOnlyList<(int A, int B)> BridgedPairs, double NominalIntervalS, double JumpS);

/// <summary>Finds and bridges short gaps in a sampled channel.</summary>
public static class GapBridging
{
    /// <summary>A time step above this multiple of the nominal interval is a time jump.</summary>
    public const double JumpFactor = 1.5;

    /// <summary>
    /// Nominal interval = median of the time steps. A gap lies between two consecutive valid (finite) samples a, b
    /// when cells between them are NaN/∞ or t_b − t_a &gt; 1.5·nominal. Gaps with t_b − t_a ≤
    /// <paramref name="maxBridgeS"/> are bridged: NaN cells keep their time stamps, each time jump inside the gap gets
    /// round(Δt/nominal) − 1 evenly spaced new samples, and all of them take the straight line between (t_a, x_a)
    /// and (t_b, x_b). Longer gaps, and missing cells at the record edges (no extrapolation), stay as they are
    /// (NaN cells stay NaN, jumps stay jumps) and are reported. Cost O(n); the median of the steps needs no copy of
    /// them unless the clock has many distinct steps (see NominalInterval).
    /// </summary>
    /// <exception cref="BcPrepDataException">Lengths differ, fewer than 2 samples, a non-finite or non-increasing
    /// time stamp, or maxBridgeS negative/NaN.</exception>
    public static GapBridgeResult Bridge(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS) =>
        Bridge(timesS, values, maxBridgeS, null, null);

    /// <summary>
    /// As <see cref="Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/>, but when nothing is bridged the
    /// result holds <paramref name="timesS"/> and <paramref name="values"/> themselves instead of copies: a window of
    /// a long, clean record is not copied just to be read.
    /// </summary>
    public static GapBridgeResult Bridge(double[] timesS, double[] values, double maxBridgeS)
    {
        ArgumentNullException.ThrowIfNull(timesS);
        ArgumentNullException.ThrowIfNull(values);
        return Bridge(timesS, values, maxBridgeS, timesS, values);
    }

    private static GapBridgeResult Bridge(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS, double[]? sameTimes, double[]? sameValues)
    {
        var search = Search(timesS, values, maxBridgeS);
        if (search.BridgedPairs.Count == 0 && sameTimes is not null && sameValues is not null)
        {
            return new GapBridgeResult(sameTimes, sameValues, new bool[sameValues.Length], search.Report);
        }

        int n = values.Length + search.Report.InsertedSamples;
        var t = new double[n];
        var x = new double[n];
        var flag = new bool[n];
        AssembleInto(timesS, values, search, t, x, flag);
        return new GapBridgeResult(t, x, flag, search.Report);
    }

    /// <summary>
    /// The gap search of <see cref="Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/> without the bridged
    /// series: its report, and the pairs of valid samples whose gap it bridges. Nothing in it grows with the length.
    /// </summary>
    internal static GapSearch Search(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS)
    {
        var steps = ValidateAndSummariseSteps(timesS, values, maxBridgeS);
        double nominal = NominalInterval(timesS, steps);
        double jumpS = JumpFactor * nominal;
        int jumps = steps.Largest > jumpS ? CountStepsAbove(timesS, jumpS) : 0;
        int nonFinite = CountNonFinite(values);

        var gaps = new List<DataGap>();
        var bridgedPairs = new List<(int A, int B)>();
        if (jumps > 0 || nonFinite > 0)
        {
            FindGaps(timesS, values, maxBridgeS, nominal, jumpS, gaps, bridgedPairs);
        }

        int inserted = 0, interpolated = 0;
        foreach (var (a, b) in bridgedPairs)
        {
            int inside = InsertedInside(timesS, a, b, nominal, jumpS);
            inserted += inside;
            interpolated += inside + (b - a - 1);
        }

        return new GapSearch(new GapReport(nominal, nonFinite, jumps, inserted, interpolated, gaps), bridgedPairs, nominal, jumpS);
    }

    /// <summary>
    /// Writes the bridged series into <paramref name="t"/> and <paramref name="x"/> (at least
    /// <c>values.Length + InsertedSamples</c> long) and, when <paramref name="flag"/> is not empty, marks the
    /// interpolated samples in it (unmarked ones are left as they are). Returns the bridged length. An empty
    /// <paramref name="t"/> skips the times: without inserted samples they are <paramref name="timesS"/> itself.
    /// </summary>
    internal static int AssembleInto(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, GapSearch search, Span<double> t, Span<double> x, Span<bool> flag)
    {
        double nominal = search.NominalIntervalS, jumpS = search.JumpS;
        int o = 0, from = 0;
        foreach (var (a, b) in search.BridgedPairs)
        {
            // The samples up to and including a are kept as they are; then the gap up to b is filled.
            int kept = a + 1 - from;
            if (!t.IsEmpty)
            {
                timesS.Slice(from, kept).CopyTo(t[o..]);
            }

            values.Slice(from, kept).CopyTo(x[o..]);
            o += kept;
            for (int j = a + 1; j <= b; j++)
            {
                int extra = Inserted(timesS[j] - timesS[j - 1], nominal, jumpS);
                for (int m = 1; m <= extra; m++)
                {
                    double time = timesS[j - 1] + ((timesS[j] - timesS[j - 1]) * m / (extra + 1));
                    if (!t.IsEmpty)
                    {
                        t[o] = time;
                    }

                    x[o] = Line(timesS[a], values[a], timesS[b], values[b], time);
                    if (!flag.IsEmpty)
                    {
                        flag[o] = true;
                    }

                    o++;
                }

                if (j < b)
                {
                    if (!t.IsEmpty)
                    {
                        t[o] = timesS[j];
                    }

                    x[o] = Line(timesS[a], values[a], timesS[b], values[b], timesS[j]);
                    if (!flag.IsEmpty)
                    {
                        flag[o] = true;
                    }

                    o++;
                }
            }

            from = b;
        }

        int rest = values.Length - from;
        if (!t.IsEmpty)
        {
            timesS.Slice(from, rest).CopyTo(t[o..]);
        }

        values.Slice(from, rest).CopyTo(x[o..]);
        return o + rest;
    }

    /// <summary>
    /// The bridged series written over <paramref name="values"/> itself, when no samples are inserted (the gaps are
    /// cells without a value, not missing rows): the series keeps its length and times, and only the cells inside the
    /// bridged gaps are written, with the values <see cref="AssembleInto"/> gives them, each cell's old value recorded
    /// in <paramref name="edits"/>. Returns how many non-finite cells were bridged, or −1 (nothing written) when samples
    /// would be inserted.
    /// </summary>
    internal static int BridgeInPlace(ReadOnlySpan<double> timesS, Span<double> values, GapSearch search, SampleEdits edits)
    {
        if (search.Report.InsertedSamples != 0)
        {
            return -1;
        }
        int bridged = 0;
        foreach (var (a, b) in search.BridgedPairs)
        {
            for (int j = a + 1; j < b; j++)
            {
                bridged += double.IsFinite(values[j]) ? 0 : 1;
                edits.Record(j, values[j]);
                values[j] = Line(timesS[a], values[a], timesS[b], values[b], timesS[j]);
            }
        }
        return bridged;
    }

    /// <summary>The number of NaN/∞ values.</summary>
    internal static int CountNonFinite(ReadOnlySpan<double> values)
    {
        int i = 0;
        long count = 0;
        if (Vector.IsHardwareAccelerated && values.Length >= Vector<double>.Count)
        {
            var counts = Vector<long>.Zero;
            for (; i <= values.Length - Vector<double>.Count; i += Vector<double>.Count)
            {
                var v = new Vector<double>(values.Slice(i, Vector<double>.Count));
                // v − v is 0 for a finite value and NaN for NaN/∞; the comparison is all ones (−1) where it is not 0.
                counts += Vector.OnesComplement(Vector.Equals(v - v, Vector<double>.Zero));
            }

            count = -Vector.Sum(counts);
        }

        for (; i < values.Length; i++)
        {
            count += double.IsFinite(values[i]) ? 0 : 1;
        }

        return (int)count;
    }

    /// <summary>
    /// Gaps between consecutive valid samples, the record edges, and the pairs bridged. Stretches without a NaN/∞
    /// value or a time jump, nearly all of a record, are skipped a block at a time.
    /// </summary>
    private static void FindGaps(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS, double nominal, double jumpS,
        List<DataGap> gaps, List<(int A, int B)> bridgedPairs)
    {
        const int Block = 64;
        int previousValid = -1;
        int i = 0;
        while (i < values.Length)
        {
            int end = Math.Min(values.Length, i + Block);
            if (previousValid == i - 1 && end - i == Block && IsQuiet(timesS, values, i, end, jumpS))
            {
                // Every sample here is valid and follows the previous one within the jump limit: no gap starts or ends.
                previousValid = end - 1;
                i = end;
                continue;
            }

            for (; i < end; i++)
            {
                if (!double.IsFinite(values[i]))
                {
                    continue;
                }

                if (previousValid < 0 && i > 0)
                {
                    gaps.Add(new DataGap(timesS[0], timesS[i - 1], i, false, true));
                }
                else if (previousValid >= 0 && (i > previousValid + 1 || timesS[i] - timesS[previousValid] > jumpS))
                {
                    double duration = timesS[i] - timesS[previousValid];
                    int missing = MissingInside(timesS, previousValid, i, nominal, jumpS);
                    bool bridge = duration <= maxBridgeS;
                    gaps.Add(new DataGap(timesS[previousValid], timesS[i], missing, bridge, false));
                    if (bridge)
                    {
                        bridgedPairs.Add((previousValid, i));
                    }
                }

                previousValid = i;
            }
        }

        if (previousValid < values.Length - 1)
        {
            int first = previousValid + 1;
            gaps.Add(new DataGap(timesS[first], timesS[^1], values.Length - first, false, true));
        }
    }

    /// <summary>All values in [start, end) finite and every step into them (from start − 1, when there is one) at most <paramref name="jumpS"/>.</summary>
    private static bool IsQuiet(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, int start, int end, double jumpS)
    {
        int w = Vector<double>.Count;
        var bad = Vector<long>.Zero;
        var limit = new Vector<double>(jumpS);
        int i = start;
        for (; i <= end - w; i += w)
        {
            var v = new Vector<double>(values.Slice(i, w));
            bad |= Vector.OnesComplement(Vector.Equals(v - v, Vector<double>.Zero));
            if (i > 0)
            {
                var step = new Vector<double>(timesS.Slice(i, w)) - new Vector<double>(timesS.Slice(i - 1, w));
                bad |= Vector.GreaterThan(step, limit);
            }
            else
            {
                for (int j = 1; j < w; j++)
                {
                    if (timesS[j] - timesS[j - 1] > jumpS)
                    {
                        return false;
                    }
                }
            }
        }

        for (; i < end; i++)
        {
            if (!double.IsFinite(values[i]) || (i > 0 && timesS[i] - timesS[i - 1] > jumpS))
            {
                return false;
            }
        }

        return bad == Vector<long>.Zero;
    }

    private static int CountStepsAbove(ReadOnlySpan<double> timesS, double limitS)
    {
        int count = 0;
        for (int i = 1; i < timesS.Length; i++)
        {
            if (timesS[i] - timesS[i - 1] > limitS)
            {
                count++;
            }
        }

        return count;
    }

    private static double Line(double ta, double xa, double tb, double xb, double t) => xa + ((xb - xa) * (t - ta) / (tb - ta));

    private static int Inserted(double stepS, double nominal, double jumpS) =>
        stepS > jumpS ? Math.Max(0, (int)Math.Round(stepS / nominal) - 1) : 0;

    private static int InsertedInside(ReadOnlySpan<double> timesS, int a, int b, double nominal, double jumpS)
    {
        int count = 0;
        for (int j = a + 1; j <= b; j++)
        {
            count += Inserted(timesS[j] - timesS[j - 1], nominal, jumpS);
        }

        return count;
    }

    private static int MissingInside(ReadOnlySpan<double> timesS, int a, int b, double nominal, double jumpS) =>
        (b - a - 1) + InsertedInside(timesS, a, b, nominal, jumpS);

    /// <summary>
    /// The median of the time steps. The steps of a logger's clock take very few distinct values (at 1 kHz on the
    /// epoch-seconds clock, two: 4194 or 4195 units of 2⁻²² s), so one pass that counts the steps below and equal
    /// to a likely median (<see cref="StepSummary"/>) usually proves which values sit at the middle ranks. Only
    /// when it does not is a copy of the steps reordered by selection, as before.
    /// </summary>
    private static double NominalInterval(ReadOnlySpan<double> timesS, StepSummary steps)
    {
        int count = timesS.Length - 1;
        int upper = count / 2;
        if (steps.Rank(upper) is { } upperValue)
        {
            if (count % 2 == 1)
            {
                return upperValue;
            }

            if (steps.Rank(upper - 1) is { } lowerValue)
            {
                return 0.5 * (lowerValue + upperValue);
            }
        }

        // The selection reorders its input, so it works on a per-thread scratch copy of the steps.
        var copy = ThreadScratch.Rent(ScratchSlots.TimeSteps, count);
        for (int i = 1; i < timesS.Length; i++)
        {
            copy[i - 1] = timesS[i] - timesS[i - 1];
        }

        return OrderStatistics.MedianInPlace(copy.AsSpan(0, count));
    }

    /// <summary>
    /// Refuses what <see cref="Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/> documents, with the same
    /// messages as ever, and summarises the time steps in the same pass: the largest, and how many lie below and at
    /// a candidate median (the median of a sample of 255 steps spread over the record), with their neighbours.
    /// </summary>
    private static StepSummary ValidateAndSummariseSteps(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS)
    {
        if (timesS.Length != values.Length)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Time stamps ({timesS.Length}) and values ({values.Length}) must have the same length."), nameof(values));
        }

        if (timesS.Length < 2)
        {
            throw new BcPrepDataException("Gap search needs at least 2 samples.");
        }

        if (!(maxBridgeS >= 0.0))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Maximum bridged gap {maxBridgeS} s must be zero or positive."));
        }

        int count = timesS.Length - 1;
        int sampled = Math.Min(count, 255);
        Span<double> sample = stackalloc double[sampled];
        for (int j = 0; j < sampled; j++)
        {
            int i = (int)((long)j * count / sampled) + 1;
            sample[j] = timesS[i] - timesS[i - 1];
        }

        sample.Sort();
        double candidate = sample[sampled / 2];

        // One pass over the steps t[i] − t[i−1], i = 1…n−1: a non-finite stamp makes a step NaN or ±∞ and a
        // non-increasing one a step ≤ 0, so "finite and > 0" holds for all of them exactly when time is valid.
        int w = Vector<double>.Count;
        var bad = Vector<long>.Zero;
        var below = Vector<long>.Zero;
        var equal = Vector<long>.Zero;
        var largest = new Vector<double>(double.NegativeInfinity);
        var largestBelow = new Vector<double>(double.NegativeInfinity);
        var smallestAbove = new Vector<double>(double.PositiveInfinity);
        var at = new Vector<double>(candidate);
        int k = 1;
        if (Vector.IsHardwareAccelerated)
        {
            for (; k <= timesS.Length - w; k += w)
            {
                var later = new Vector<double>(timesS.Slice(k, w));
                var step = later - new Vector<double>(timesS.Slice(k - 1, w));
                bad |= Vector.OnesComplement(Vector.Equals(later - later, Vector<double>.Zero)) | Vector.OnesComplement(Vector.GreaterThan(step, Vector<double>.Zero));
                var isBelow = Vector.LessThan(step, at);
                var isAbove = Vector.GreaterThan(step, at);
                below -= isBelow;
                equal -= Vector.Equals(step, at);
                largest = Vector.Max(largest, step);
                largestBelow = Vector.Max(largestBelow, Vector.ConditionalSelect(isBelow, step, new Vector<double>(double.NegativeInfinity)));
                smallestAbove = Vector.Min(smallestAbove, Vector.ConditionalSelect(isAbove, step, new Vector<double>(double.PositiveInfinity)));
            }
        }

        var summary = new StepSummary(candidate, Vector.Sum(below), Vector.Sum(equal), Max(largestBelow), Min(smallestAbove), Max(largest));
        bool valid = bad == Vector<long>.Zero && double.IsFinite(timesS[0]);
        for (; k < timesS.Length; k++)
        {
            double step = timesS[k] - timesS[k - 1];
            valid &= double.IsFinite(timesS[k]) && step > 0.0;
            summary = summary.Add(step);
        }

        if (!valid)
        {
            ThrowAtFirstInvalidTime(timesS);
        }

        return summary;
    }

    private static double Max(Vector<double> v)
    {
        double max = double.NegativeInfinity;
        for (int i = 0; i < Vector<double>.Count; i++)
        {
            max = Math.Max(max, v[i]);
        }

        return max;
    }

    private static double Min(Vector<double> v)
    {
        double min = double.PositiveInfinity;
        for (int i = 0; i < Vector<double>.Count; i++)
        {
            min = Math.Min(min, v[i]);
        }

        return min;
    }

    private static void ThrowAtFirstInvalidTime(ReadOnlySpan<double> timesS)
    {
        for (int i = 0; i < timesS.Length; i++)
        {
            if (!double.IsFinite(timesS[i]) || (i > 0 && timesS[i] <= timesS[i - 1]))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Time stamp {i} ({timesS[i]} s) is not finite or not after the previous one; time must increase strictly."));
            }
        }

        throw new InvalidOperationException("A time stamp was found invalid but none is.");
    }

    /// <summary>
    /// The time steps of a record against a candidate median: how many lie below it and at it, the largest below
    /// and the smallest above it, and the largest step of all.
    /// </summary>
    private readonly record struct StepSummary(double Candidate, long Below, long Equal, double LargestBelow, double SmallestAbove, double Largest)
    {
        public StepSummary Add(double step) => new(
            Candidate,
            Below + (step < Candidate ? 1 : 0),
            Equal + (step == Candidate ? 1 : 0),
            step < Candidate ? Math.Max(LargestBelow, step) : LargestBelow,
            step > Candidate ? Math.Min(SmallestAbove, step) : SmallestAbove,
            Math.Max(Largest, step));

        /// <summary>The step of 0-based rank <paramref name="rank"/> in ascending order, when the counts prove it; else null.</summary>
        public double? Rank(long rank) =>
            rank >= Below && rank < Below + Equal ? Candidate
            : rank == Below - 1 ? LargestBelow
            : rank == Below + Equal ? SmallestAbove
            : null;
    }
}
