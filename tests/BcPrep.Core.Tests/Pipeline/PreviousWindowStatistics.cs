using System.Globalization;
using System.Runtime.CompilerServices;
using BcPrep.Conditioning;
using BcPrep.Pipeline;
using BcPrep.Uncertainty;
using BcPrep.Values;

namespace BcPrep.Tests.Pipeline;

// The window statistics as they were before they worked in per-thread scratch (main at 94c0c0e): gap bridging,
// sensor-fault screening and the evaluation, copied verbatim apart from names, so that tests can hold the buffered
// evaluation equal to it to the bit. The Hampel filter and the Type A are the library's own (unchanged here).
#pragma warning disable

internal static class PreviousGapBridging
{
    /// <summary>A time step above this multiple of the nominal interval is a time jump.</summary>
    private const double JumpFactor = 1.5;

    /// <summary>
    /// Nominal interval = median of the time steps. A gap lies between two consecutive valid (finite) samples a, b
    /// when cells between them are NaN/∞ or t_b − t_a &gt; 1.5·nominal. Gaps with t_b − t_a ≤
    /// <paramref name="maxBridgeS"/> are bridged: NaN cells keep their time stamps, each time jump inside the gap gets
    /// round(Δt/nominal) − 1 evenly spaced new samples, and all of them take the straight line between (t_a, x_a)
    /// and (t_b, x_b). Longer gaps, and missing cells at the record edges (no extrapolation), stay as they are
    /// (NaN cells stay NaN, jumps stay jumps) and are reported. Cost O(n); one copy of the time steps for the median.
    /// </summary>
    /// <exception cref="BcPrepDataException">Lengths differ, fewer than 2 samples, a non-finite or non-increasing
    /// time stamp, or maxBridgeS negative/NaN.</exception>
    public static GapBridgeResult Bridge(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS) =>
        Bridge(timesS, values, maxBridgeS, null, null);

    /// <summary>
    /// As the span overload, but when nothing is bridged the
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
        Validate(timesS, values, maxBridgeS);
        double nominal = NominalInterval(timesS);
        double jumpS = JumpFactor * nominal;

        var gaps = new List<DataGap>();
        int nonFinite = 0, jumps = 0;
        for (int i = 1; i < timesS.Length; i++)
        {
            if (timesS[i] - timesS[i - 1] > jumpS)
            {
                jumps++;
            }
        }

        int previousValid = -1;
        var bridgedPairs = new List<(int A, int B)>();
        for (int i = 0; i < values.Length; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                nonFinite++;
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

        if (previousValid < values.Length - 1)
        {
            int first = previousValid + 1;
            gaps.Add(new DataGap(timesS[first], timesS[^1], values.Length - first, false, true));
        }

        if (bridgedPairs.Count == 0 && sameTimes is not null && sameValues is not null)
        {
            var report = new GapReport(nominal, nonFinite, jumps, 0, 0, gaps);
            return new GapBridgeResult(sameTimes, sameValues, new bool[sameValues.Length], report);
        }

        return Assemble(timesS, values, nominal, jumpS, bridgedPairs, gaps, nonFinite, jumps);
    }

    private static GapBridgeResult Assemble(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double nominal,
        double jumpS, List<(int A, int B)> bridgedPairs, List<DataGap> gaps, int nonFinite, int jumps)
    {
        int inserted = 0;
        foreach (var (a, b) in bridgedPairs)
        {
            inserted += InsertedInside(timesS, a, b, nominal, jumpS);
        }

        int n = values.Length + inserted;
        var t = new double[n];
        var x = new double[n];
        var flag = new bool[n];
        int interpolated = 0;
        int o = 0, next = 0;
        for (int i = 0; i < values.Length; i++)
        {
            t[o] = timesS[i];
            x[o] = values[i];
            o++;
            if (next < bridgedPairs.Count && bridgedPairs[next].A == i)
            {
                var (a, b) = bridgedPairs[next++];
                for (int j = a + 1; j <= b; j++)
                {
                    int extra = Inserted(timesS[j] - timesS[j - 1], nominal, jumpS);
                    for (int m = 1; m <= extra; m++)
                    {
                        t[o] = timesS[j - 1] + ((timesS[j] - timesS[j - 1]) * m / (extra + 1));
                        x[o] = Line(timesS[a], values[a], timesS[b], values[b], t[o]);
                        flag[o] = true;
                        o++;
                        interpolated++;
                    }

                    if (j < b)
                    {
                        t[o] = timesS[j];
                        x[o] = Line(timesS[a], values[a], timesS[b], values[b], timesS[j]);
                        flag[o] = true;
                        o++;
                        interpolated++;
                    }
                }

                i = b - 1;
            }
        }

        var report = new GapReport(nominal, nonFinite, jumps, inserted, interpolated, gaps);
        return new GapBridgeResult(t, x, flag, report);
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

    private static double NominalInterval(ReadOnlySpan<double> timesS)
    {
        var steps = new double[timesS.Length - 1];
        for (int i = 1; i < timesS.Length; i++)
        {
            steps[i - 1] = timesS[i] - timesS[i - 1];
        }

        return OrderStatistics.MedianInPlace(steps);
    }

    private static void Validate(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double maxBridgeS)
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

        for (int i = 0; i < timesS.Length; i++)
        {
            if (!double.IsFinite(timesS[i]) || (i > 0 && timesS[i] <= timesS[i - 1]))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Time stamp {i} ({timesS[i]} s) is not finite or not after the previous one; time must increase strictly."));
            }
        }
    }
}

internal static class PreviousSensorFaults
{
    /// <summary>
    /// Raises: NonFinite (any NaN/∞); Implausible (any finite sample outside [PlausibleMin, PlausibleMax]);
    /// Stuck (standard deviation of the finite samples ≤ StuckFractionOfResolution·Resolution, or exactly 0 when
    /// no resolution is given); Saturation (per rail: fraction of finite samples within RailTolerance of the rail ≥
    /// RailFractionThreshold and longest run ≥ RailMinimumRun). Rails default to the window max/min; this self-rail
    /// test is skipped for a stuck window, which would otherwise be "at its own rail" everywhere, and it asks for a
    /// pile-up (see IsPileUp), because the top level of any quantised signal holds many samples.
    /// An empty window or one without finite samples raises only NonFinite (if any samples).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static SensorFaultReport Check(ReadOnlySpan<double> window, SensorFaultLimits limits)
    {
        ArgumentNullException.ThrowIfNull(limits);
        var flags = new List<SensorFaultFlag>();
        int n = window.Length;
        int finite = 0, nonFinite = 0, firstNonFinite = -1, implausible = 0, firstImplausible = -1;
        double min = double.PositiveInfinity, max = double.NegativeInfinity, mean = 0.0, m2 = 0.0, worst = double.NaN;
        for (int i = 0; i < n; i++)
        {
            double v = window[i];
            if (!double.IsFinite(v))
            {
                nonFinite++;
                firstNonFinite = firstNonFinite < 0 ? i : firstNonFinite;
                continue;
            }

            finite++;
            double d = v - mean;
            mean += d / finite;
            m2 += d * (v - mean);
            min = Math.Min(min, v);
            max = Math.Max(max, v);
            if (v < limits.PlausibleMin || v > limits.PlausibleMax)
            {
                implausible++;
                firstImplausible = firstImplausible < 0 ? i : firstImplausible;
                worst = double.IsNaN(worst) || Distance(v, limits) > Distance(worst, limits) ? v : worst;
            }
        }

        if (nonFinite > 0)
        {
            flags.Add(new SensorFaultFlag(SensorFaultKind.NonFinite, nonFinite, (double)nonFinite / n, firstNonFinite, double.NaN,
                Format($"{nonFinite} of {n} samples are NaN/∞, first at index {firstNonFinite}")));
        }

        if (finite == 0)
        {
            return new SensorFaultReport(n, flags);
        }

        if (implausible > 0)
        {
            flags.Add(new SensorFaultFlag(SensorFaultKind.Implausible, implausible, (double)implausible / finite, firstImplausible, worst,
                Format($"{implausible} samples outside plausible range [{limits.PlausibleMin}, {limits.PlausibleMax}], worst {worst}, first at index {firstImplausible}")));
        }

        double sd = finite > 1 ? Math.Sqrt(m2 / (finite - 1)) : 0.0;
        bool stuck = finite > 1 && sd <= limits.StuckFractionOfResolution * Math.Max(limits.Resolution, 0.0);
        if (stuck)
        {
            flags.Add(new SensorFaultFlag(SensorFaultKind.Stuck, finite, 1.0, 0, sd,
                Format($"standard deviation {sd} over {finite} samples ≤ {limits.StuckFractionOfResolution} × resolution {limits.Resolution}; range {max - min}")));
        }

        AddRailFlag(window, limits.RailHigh ?? (stuck ? double.NaN : max), limits.RailHigh is not null, "upper", limits, finite, sd, flags);
        AddRailFlag(window, limits.RailLow ?? (stuck ? double.NaN : min), limits.RailLow is not null, "lower", limits, finite, sd, flags);
        return new SensorFaultReport(n, flags);
    }

    private static void AddRailFlag(ReadOnlySpan<double> window, double rail, bool declared, string name, SensorFaultLimits limits, int finite, double sd, List<SensorFaultFlag> flags)
    {
        if (double.IsNaN(rail))
        {
            return;
        }

        // At a declared rail the tolerance is the user's. At the window's own extreme only the extreme level itself
        // counts (half the tolerance, which defaults to the resolution): with the whole resolution, the level just
        // inside would join it, and on a quantised signal that is a large share of all samples.
        double tolerance = declared ? limits.RailTolerance : 0.5 * limits.RailTolerance;
        if (!declared && !IsPileUp(window, rail, tolerance, Math.Max(limits.Resolution, 0.25 * sd)))
        {
            return;
        }

        int count = 0, run = 0, longest = 0, first = -1;
        for (int i = 0; i < window.Length; i++)
        {
            if (double.IsFinite(window[i]) && Math.Abs(window[i] - rail) <= tolerance)
            {
                count++;
                run++;
                longest = Math.Max(longest, run);
                first = first < 0 ? i : first;
            }
            else
            {
                run = 0;
            }
        }

        double fraction = (double)count / finite;
        if (fraction >= limits.RailFractionThreshold && longest >= limits.RailMinimumRun)
        {
            flags.Add(new SensorFaultFlag(SensorFaultKind.Saturation, count, fraction, first, rail,
                Format($"{count} samples ({fraction:P1}) at the {name} rail {rail} ± {tolerance}, longest run {longest}, first at index {first}")));
        }
    }

    /// <summary>
    /// A clipped signal piles its samples up at the clip: more of them sit within <paramref name="tolerance"/> of the
    /// extreme than in the band of width <paramref name="band"/> (the resolution, or a quarter standard deviation if
    /// larger) just inside it. A clean signal, Gaussian or quantised, thins out towards its extreme instead, so its
    /// top level holds fewer samples than the levels next to it. Our rule (common practice has none written down).
    /// </summary>
    private static bool IsPileUp(ReadOnlySpan<double> window, double rail, double tolerance, double band)
    {
        int atRail = 0, inside = 0;
        for (int i = 0; i < window.Length; i++)
        {
            double distance = Math.Abs(window[i] - rail);
            if (distance <= tolerance)
            {
                atRail++;
            }
            else if (distance <= tolerance + band)
            {
                inside++;
            }
        }

        return atRail > inside;
    }

    private static double Distance(double v, SensorFaultLimits limits) =>
        v < limits.PlausibleMin ? limits.PlausibleMin - v : v - limits.PlausibleMax;

    private static string Format(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

internal static class PreviousWindowStatistics
{
    /// <summary>
    /// Bridges gaps up to <see cref="ConditioningSettings.MaxBridgeS"/>. A longer gap inside the window is left open:
    /// the statistics use the samples on both sides of it (the mean and Type A over the segments, with the reduced
    /// sample count), and the gap is reported; only when such gaps take more than <see cref="LostFractionLimit"/> of
    /// the window does it fail, with <see cref="WindowLostFailure"/>. Missing cells at the window edges are dropped
    /// and reported. Then it removes
    /// spikes with the Hampel filter of <paramref name="settings"/> (floor of the robust σ =
    /// <see cref="ConditioningSettings.HampelScaleFloor"/>), screens the de-spiked samples for sensor faults with
    /// <paramref name="limits"/>, and takes the mean and Type A uncertainty of the de-spiked, unfiltered samples.
    /// Notch and low-pass settings are not used here on purpose: a low-pass narrows the scatter and would
    /// understate the Type A uncertainty. What was done is in <see cref="ChannelWindowStats.Conditioning"/>.
    /// </summary>
    /// <remarks>Messages give times since <paramref name="dayStart"/>, the first sample of the day (by default the clock's zero).</remarks>
    public static ChannelWindowStats Evaluate(string channel, TimeWindow window, double[] timesS, double[] values, ConditioningSettings settings, SensorFaultLimits limits, DayStart dayStart = default)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var finite = FiniteCount(values);
        if (finite < 3)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel),
                $"window '{window.Id}' ({dayStart.Since(window.Start).Value:F1}–{dayStart.Since(window.End).Value:F1} s since the first sample of the day) holds {finite} valid samples of '{channel}'; at least 3 are needed");
        }
        var bridged = PreviousGapBridging.Bridge(timesS, values, settings.MaxBridgeS);
        var interior = bridged.Report.Unbridged.Where(g => !g.AtRecordEdge).ToList();
        var lostS = interior.Sum(g => g.DurationS);
        if (window.DurationS > 0 && lostS > LostFractionLimit * window.DurationS)
        {
            var gap = interior.OrderByDescending(g => g.DurationS).First();
            throw new WindowLostFailure(new SourceLocation("(logs)", Key: channel), string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"channel '{channel}' lost {lostS:F1} s of window '{window.Id}' ({dayStart.Since(window.Start).Value:F1}–{dayStart.Since(window.End).Value:F1} s since the first sample of the day) to {interior.Count} gap(s) longer than the {settings.MaxBridgeS:G} s that may be bridged, the longest {gap.DurationS:F1} s from {dayStart.Since(new LoggerSeconds(gap.StartS)).Value:F1} s; more than {LostFractionLimit:P0} of the window is too little left to stand for it"));
        }
        var (keptTimes, kept) = FiniteSamples(bridged.TimesS, bridged.Values);
        var despiked = HampelFilter.Apply(kept, settings.HampelHalfWindow, settings.HampelSigmas, settings.HampelScaleFloor);
        var clean = despiked.Values;
        var faults = PreviousSensorFaults.Check(clean, limits).Flags;
        var typeA = WindowMean.Evaluate(clean);
        var (min, max) = Range(clean);
        var report = new WindowConditioning(
            bridged.Report.Bridged.ToList(), bridged.Report.Unbridged.Where(g => g.AtRecordEdge).ToList(),
            despiked.ReplacedIndices.Select(i => keptTimes[i]).ToList(),
            faults.Select(f => new FaultVerdict(f, FaultSeverity.Warning, f.FirstIndex >= 0 && f.FirstIndex < keptTimes.Length ? keptTimes[f.FirstIndex] : double.NaN)).ToList());
        return new ChannelWindowStats(
            channel, window.Id, clean.Length, values.Length - finite, bridged.Report.InterpolatedSamples,
            despiked.ReplacedIndices.Count, typeA.Mean, typeA.StandardDeviation, min, max, typeA, faults)
        {
            Conditioning = report with { UnbridgedGaps = interior },
        };
    }

    /// <summary>
    /// The largest part of a window (0.25) that gaps too long to bridge may take before the point fails. With three
    /// quarters left, the mean still stands for the whole window: the plateau is steady, so the missing quarter
    /// holds the same value, and the Type A uncertainty, taken over the samples on both sides of each gap, already
    /// carries the smaller sample count. Common practice, no standard behind the number.
    /// </summary>
    private const double LostFractionLimit = 0.25;

    private static int FiniteCount(double[] values)
    {
        var count = 0;
        foreach (var v in values)
        {
            count += double.IsFinite(v) ? 1 : 0;
        }
        return count;
    }

    /// <summary>The finite samples with their times; the arrays themselves when all are finite (the usual case).</summary>
    private static (double[] TimesS, double[] Values) FiniteSamples(double[] timesS, double[] values)
    {
        var finite = FiniteCount(values);
        if (finite == values.Length)
        {
            return (timesS, values);
        }
        var keptTimes = new double[finite];
        var kept = new double[finite];
        var o = 0;
        for (var i = 0; i < values.Length; i++)
        {
            if (double.IsFinite(values[i]))
            {
                keptTimes[o] = timesS[i];
                kept[o++] = values[i];
            }
        }
        return (keptTimes, kept);
    }

    private static (double Min, double Max) Range(double[] values)
    {
        var min = double.PositiveInfinity;
        var max = double.NegativeInfinity;
        foreach (var v in values)
        {
            min = Math.Min(min, v);
            max = Math.Max(max, v);
        }
        return (min, max);
    }
}
