using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Conditioning;

/// <summary>Kinds of sensor fault recognised on a window of samples.</summary>
public enum SensorFaultKind
{
    /// <summary>Many samples pinned at a rail (declared, or the window's own max/min).</summary>
    Saturation,

    /// <summary>Standard deviation far below the resolution: the reading does not move.</summary>
    Stuck,

    /// <summary>Samples outside the physically plausible range (e.g. an open thermocouple).</summary>
    Implausible,

    /// <summary>NaN/∞ samples in the window.</summary>
    NonFinite,
}

/// <summary>
/// Limits for <see cref="SensorFaults.Check(ReadOnlySpan{double}, SensorFaultLimits)"/>, in the channel's engineering unit.
/// </summary>
/// <param name="RailLow">Declared lower rail (full-scale minimum); null = use the window minimum.</param>
/// <param name="RailHigh">Declared upper rail; null = use the window maximum.</param>
/// <param name="RailTolerance">A sample within this distance of a rail counts as "at the rail" (≥ 0).</param>
/// <param name="RailFractionThreshold">Saturation when at least this fraction of samples sit at one rail (0…1).</param>
/// <param name="RailMinimumRun">…and at least this many of them are consecutive (≥ 1).</param>
/// <param name="Resolution">Smallest change the channel can show (&gt; 0 enables the stuck test beyond zero variance).</param>
/// <param name="StuckFractionOfResolution">Stuck when the standard deviation ≤ this × resolution (common practice 0.05).</param>
/// <param name="PlausibleMin">Lowest plausible reading.</param>
/// <param name="PlausibleMax">Highest plausible reading.</param>
public sealed record SensorFaultLimits(
    double? RailLow = null,
    double? RailHigh = null,
    double RailTolerance = 0.0,
    double RailFractionThreshold = 0.05,
    int RailMinimumRun = 3,
    double Resolution = 0.0,
    double StuckFractionOfResolution = 0.05,
    double PlausibleMin = double.NegativeInfinity,
    double PlausibleMax = double.PositiveInfinity);

/// <summary>One raised flag with its evidence: how many samples, which fraction, first index, the telling value.</summary>
public sealed record SensorFaultFlag(SensorFaultKind Kind, int SampleCount, double Fraction, int FirstIndex, double EvidenceValue, string Evidence);

/// <summary>All flags raised on one window (empty = no fault seen).</summary>
public sealed record SensorFaultReport(int SampleCount, IReadOnlyList<SensorFaultFlag> Flags)
{
    /// <summary>True when any flag was raised.</summary>
    public bool HasFault => Flags.Count > 0;
}

/// <summary>Sensor fault screening on a window of samples (pure, O(n), no allocation beyond the report).</summary>
public static class SensorFaults
{
    /// <summary>
    /// Raises: NonFinite (any NaN/∞); Implausible (any finite sample outside [PlausibleMin, PlausibleMax]);
    /// Stuck (standard deviation of the finite samples ≤ StuckFractionOfResolution·Resolution, or exactly 0 when
    /// no resolution is given); Saturation (per rail: fraction of finite samples within RailTolerance of the rail ≥
    /// RailFractionThreshold and longest run ≥ RailMinimumRun). Rails default to the window max/min; this self-rail
    /// test is skipped for a stuck window, which would otherwise be "at its own rail" everywhere, and it asks for a
    /// pile-up (see <see cref="IsPileUp"/>), because the top level of any quantised signal holds many samples.
    /// An empty window or one without finite samples raises only NonFinite (if any samples).
    /// </summary>
    /// <remarks>
    /// The standard deviation is the running (Welford) one, and its exact value decides and is written as
    /// evidence. Its recurrence divides once per sample in a chain that cannot be overlapped, the slowest part of
    /// the check, so on a window of finite samples it runs only when its value matters: when the two-pass standard
    /// deviation, with a margin far wider than both methods' rounding, leaves a decision open (see
    /// <see cref="FastCheck"/>). The flags and their evidence are the same to the bit.
    /// </remarks>
    public static SensorFaultReport Check(ReadOnlySpan<double> window, SensorFaultLimits limits) => Check(window, limits, out _, out _);

    /// <summary>As <see cref="Check(ReadOnlySpan{double}, SensorFaultLimits)"/>, also giving the least and greatest finite sample (±∞ when none).</summary>
    internal static SensorFaultReport Check(ReadOnlySpan<double> window, SensorFaultLimits limits, out double min, out double max)
    {
        ArgumentNullException.ThrowIfNull(limits);
        if (window.Length >= 2 && Summarise(window, limits) is { } summary)
        {
            min = summary.Min;
            max = summary.Max;
            return FastCheck(window, limits, summary);
        }

        return CheckEverySample(window, limits, out min, out max);
    }

    /// <summary>The check as first written, sample by sample; used for windows with NaN/∞ samples and tiny ones.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static SensorFaultReport CheckEverySample(ReadOnlySpan<double> window, SensorFaultLimits limits, out double min, out double max)
    {
        var flags = new List<SensorFaultFlag>();
        int n = window.Length;
        int finite = 0, nonFinite = 0, firstNonFinite = -1, implausible = 0, firstImplausible = -1;
        double mean = 0.0, m2 = 0.0, worst = double.NaN;
        min = double.PositiveInfinity;
        max = double.NegativeInfinity;
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
            flags.Add(ImplausibleFlag(limits, implausible, finite, firstImplausible, worst));
        }

        double sd = finite > 1 ? Math.Sqrt(m2 / (finite - 1)) : 0.0;
        bool stuck = finite > 1 && sd <= StuckThreshold(limits);
        if (stuck)
        {
            flags.Add(StuckFlag(limits, finite, sd, max - min));
        }

        AddRailFlag(window, limits.RailHigh ?? (stuck ? double.NaN : max), limits.RailHigh is not null, "upper", limits, finite, sd, flags);
        AddRailFlag(window, limits.RailLow ?? (stuck ? double.NaN : min), limits.RailLow is not null, "lower", limits, finite, sd, flags);
        return new SensorFaultReport(n, flags);
    }

    /// <summary>
    /// The same flags as <see cref="CheckEverySample"/> on a window of finite samples, in three vectorised passes
    /// (range, sum and plausibility; the two-pass standard deviation; both rails at once) and a fourth, the running
    /// standard deviation, only when a decision needs its exact value.
    /// </summary>
    /// <remarks>
    /// Both standard deviations approximate the exact one of the samples: the two-pass one within about n·u and the
    /// running one within about n·κ·u relatively (u = 2⁻⁵³, κ = |mean|/s; Chan, Golub and LeVeque 1983, from
    /// memory). <see cref="Bracket"/> takes 16·n·u·(κ + 2), a wide safety factor over their sum, so the running one
    /// lies in [s·(1 − ε), s·(1 + ε)]; a decision taken with every value of that interval is the decision the
    /// running one takes. Where the interval straddles a limit (or ε is not small) the running one is computed.
    /// </remarks>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static SensorFaultReport FastCheck(ReadOnlySpan<double> window, SensorFaultLimits limits, WindowSummary summary)
    {
        var flags = new List<SensorFaultFlag>();
        int n = window.Length;
        if (summary.AnyImplausible)
        {
            int implausible = 0, firstImplausible = -1;
            double worst = double.NaN;
            for (int i = 0; i < n; i++)
            {
                double v = window[i];
                if (v < limits.PlausibleMin || v > limits.PlausibleMax)
                {
                    implausible++;
                    firstImplausible = firstImplausible < 0 ? i : firstImplausible;
                    worst = double.IsNaN(worst) || Distance(v, limits) > Distance(worst, limits) ? v : worst;
                }
            }

            flags.Add(ImplausibleFlag(limits, implausible, n, firstImplausible, worst));
        }

        // A constant window has a running standard deviation of exactly 0 (every deviation is 0).
        double? exactSd = summary.Min == summary.Max ? 0.0 : null;
        var (sdLow, sdHigh) = exactSd is { } known ? (known, known) : Bracket(window, summary);
        double threshold = StuckThreshold(limits);
        if (!(sdLow > threshold))
        {
            exactSd ??= RunningStandardDeviation(window);
            (sdLow, sdHigh) = (exactSd.Value, exactSd.Value);
        }

        bool stuck = exactSd is { } sdKnown && sdKnown <= threshold;
        if (stuck)
        {
            flags.Add(StuckFlag(limits, n, exactSd!.Value, summary.Max - summary.Min));
        }

        var upper = new Rail(limits.RailHigh ?? (stuck ? double.NaN : summary.Max), limits.RailHigh is not null, limits);
        var lower = new Rail(limits.RailLow ?? (stuck ? double.NaN : summary.Min), limits.RailLow is not null, limits);
        var bandLow = Math.Max(limits.Resolution, 0.25 * sdLow);
        var bandHigh = Math.Max(limits.Resolution, 0.25 * sdHigh);
        CountAtRails(window, ref upper, ref lower, bandLow, bandHigh);
        foreach (var (rail, name) in new[] { (upper, "upper"), (lower, "lower") })
        {
            if (double.IsNaN(rail.Level))
            {
                continue;
            }

            if (!rail.Declared)
            {
                // Pile-up: more samples at the extreme than in the band just inside it (see IsPileUp).
                bool? pileUp = rail.Count > rail.InsideHigh ? true : rail.Count <= rail.InsideLow ? false : null;
                if (pileUp is null)
                {
                    exactSd ??= RunningStandardDeviation(window);
                    pileUp = IsPileUp(window, rail.Level, rail.Tolerance, Math.Max(limits.Resolution, 0.25 * exactSd.Value));
                }

                if (pileUp == false)
                {
                    continue;
                }
            }

            AddSaturationFlag(rail.Level, name, rail.Tolerance, rail.Count, rail.Longest, rail.First, limits, n, flags);
        }

        return new SensorFaultReport(n, flags);
    }

    /// <summary>Range, sum and whether any sample is implausible, in one vectorised pass; null when a sample is NaN/∞.</summary>
    private static WindowSummary? Summarise(ReadOnlySpan<double> window, SensorFaultLimits limits)
    {
        int w = Vector<double>.Count;
        var notFinite = Vector<long>.Zero;
        var implausible = Vector<long>.Zero;
        var low = new Vector<double>(double.PositiveInfinity);
        var high = new Vector<double>(double.NegativeInfinity);
        var sum = Vector<double>.Zero;
        var plausibleMin = new Vector<double>(limits.PlausibleMin);
        var plausibleMax = new Vector<double>(limits.PlausibleMax);
        int i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            for (; i <= window.Length - w; i += w)
            {
                var v = new Vector<double>(window.Slice(i, w));
                notFinite |= Vector.OnesComplement(Vector.Equals(v - v, Vector<double>.Zero));
                implausible |= Vector.LessThan(v, plausibleMin) | Vector.GreaterThan(v, plausibleMax);
                low = Vector.Min(low, v);
                high = Vector.Max(high, v);
                sum += v;
            }
        }

        double min = double.PositiveInfinity, max = double.NegativeInfinity, total = 0.0;
        bool anyImplausible = implausible != Vector<long>.Zero;
        for (int lane = 0; lane < w; lane++)
        {
            min = Math.Min(min, low[lane]);
            max = Math.Max(max, high[lane]);
            total += sum[lane];
        }

        for (; i < window.Length; i++)
        {
            double v = window[i];
            if (!double.IsFinite(v))
            {
                return null;
            }

            min = Math.Min(min, v);
            max = Math.Max(max, v);
            total += v;
            anyImplausible |= v < limits.PlausibleMin || v > limits.PlausibleMax;
        }

        if (notFinite != Vector<long>.Zero)
        {
            return null;
        }

        if (min == 0.0 || max == 0.0)
        {
            // The sign of a zero extreme is written as evidence; take it exactly as Math.Min/Math.Max do, in order.
            (min, max) = (double.PositiveInfinity, double.NegativeInfinity);
            foreach (var v in window)
            {
                min = Math.Min(min, v);
                max = Math.Max(max, v);
            }
        }

        return new WindowSummary(min, max, total, anyImplausible);
    }

    /// <summary>An interval that surely holds the running standard deviation (see <see cref="FastCheck"/>); (0, +∞) when none narrow enough is known.</summary>
    private static (double Low, double High) Bracket(ReadOnlySpan<double> window, WindowSummary summary)
    {
        int n = window.Length;
        double mean = summary.Sum / n;
        int w = Vector<double>.Count;
        var squares = Vector<double>.Zero;
        var at = new Vector<double>(mean);
        int i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            for (; i <= n - w; i += w)
            {
                var d = new Vector<double>(window.Slice(i, w)) - at;
                squares += d * d;
            }
        }

        double ss = Vector.Sum(squares);
        for (; i < n; i++)
        {
            double d = window[i] - mean;
            ss += d * d;
        }

        double sd = Math.Sqrt(ss / (n - 1));
        double kappa = (Math.Abs(mean) + sd) / sd;
        double epsilon = 16.0 * n * (kappa + 2.0) * UnitRoundoff;
        if (!(epsilon <= 1e-3) || !double.IsFinite(sd) || !(sd > 0.0))
        {
            return (0.0, double.PositiveInfinity);
        }

        return (sd * (1.0 - epsilon), sd * (1.0 + epsilon));
    }

    /// <summary>The running (Welford) standard deviation of finite samples, exactly as <see cref="CheckEverySample"/> computes it.</summary>
    private static double RunningStandardDeviation(ReadOnlySpan<double> window)
    {
        int finite = 0;
        double mean = 0.0, m2 = 0.0;
        foreach (var v in window)
        {
            finite++;
            double d = v - mean;
            mean += d / finite;
            m2 += d * (v - mean);
        }

        return finite > 1 ? Math.Sqrt(m2 / (finite - 1)) : 0.0;
    }

    /// <summary>
    /// Per rail: the samples within its tolerance (how many, the longest run, the first), and the samples in the band
    /// just inside it with the band's low and high estimate (<see cref="IsPileUp"/>). A rail at NaN matches nothing.
    /// Both rails in one vectorised pass; a block with no sample at a rail only ends the runs.
    /// </summary>
    private static void CountAtRails(ReadOnlySpan<double> window, ref Rail upper, ref Rail lower, double bandLow, double bandHigh)
    {
        int w = Vector<double>.Count;
        double upperLimitLow = upper.Tolerance + bandLow, upperLimitHigh = upper.Tolerance + bandHigh;
        double lowerLimitLow = lower.Tolerance + bandLow, lowerLimitHigh = lower.Tolerance + bandHigh;
        var upperLevel = new Vector<double>(upper.Level);
        var lowerLevel = new Vector<double>(lower.Level);
        var upperTolerance = new Vector<double>(upper.Tolerance);
        var lowerTolerance = new Vector<double>(lower.Tolerance);
        var upperInside = Vector<long>.Zero;
        var upperInsideHigh = Vector<long>.Zero;
        var lowerInside = Vector<long>.Zero;
        var lowerInsideHigh = Vector<long>.Zero;
        int i = 0;
        if (Vector.IsHardwareAccelerated)
        {
            for (; i <= window.Length - w; i += w)
            {
                var v = new Vector<double>(window.Slice(i, w));
                var du = Vector.Abs(v - upperLevel);
                var dl = Vector.Abs(v - lowerLevel);
                var atUpper = Vector.LessThanOrEqual(du, upperTolerance);
                var atLower = Vector.LessThanOrEqual(dl, lowerTolerance);
                upperInside -= Vector.AndNot(Vector.LessThanOrEqual(du, new Vector<double>(upperLimitLow)), atUpper);
                upperInsideHigh -= Vector.AndNot(Vector.LessThanOrEqual(du, new Vector<double>(upperLimitHigh)), atUpper);
                lowerInside -= Vector.AndNot(Vector.LessThanOrEqual(dl, new Vector<double>(lowerLimitLow)), atLower);
                lowerInsideHigh -= Vector.AndNot(Vector.LessThanOrEqual(dl, new Vector<double>(lowerLimitHigh)), atLower);
                if ((atUpper | atLower) == Vector<long>.Zero)
                {
                    upper.Run = 0;
                    lower.Run = 0;
                    continue;
                }

                for (int j = i; j < i + w; j++)
                {
                    upper.Visit(window[j], j);
                    lower.Visit(window[j], j);
                }
            }
        }

        upper.InsideLow = (int)Vector.Sum(upperInside);
        upper.InsideHigh = (int)Vector.Sum(upperInsideHigh);
        lower.InsideLow = (int)Vector.Sum(lowerInside);
        lower.InsideHigh = (int)Vector.Sum(lowerInsideHigh);
        for (; i < window.Length; i++)
        {
            double v = window[i];
            upper.Visit(v, i);
            lower.Visit(v, i);
            upper.Band(v, upperLimitLow, upperLimitHigh);
            lower.Band(v, lowerLimitLow, lowerLimitHigh);
        }
    }

    private static double StuckThreshold(SensorFaultLimits limits) => limits.StuckFractionOfResolution * Math.Max(limits.Resolution, 0.0);

    private static SensorFaultFlag ImplausibleFlag(SensorFaultLimits limits, int implausible, int finite, int firstImplausible, double worst) =>
        new(SensorFaultKind.Implausible, implausible, (double)implausible / finite, firstImplausible, worst,
            Format($"{implausible} samples outside plausible range [{limits.PlausibleMin}, {limits.PlausibleMax}], worst {worst}, first at index {firstImplausible}"));

    private static SensorFaultFlag StuckFlag(SensorFaultLimits limits, int finite, double sd, double range) =>
        new(SensorFaultKind.Stuck, finite, 1.0, 0, sd,
            Format($"standard deviation {sd} over {finite} samples ≤ {limits.StuckFractionOfResolution} × resolution {limits.Resolution}; range {range}"));

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

        AddSaturationFlag(rail, name, tolerance, count, longest, first, limits, finite, flags);
    }

    private static void AddSaturationFlag(double rail, string name, double tolerance, int count, int longest, int first, SensorFaultLimits limits, int finite, List<SensorFaultFlag> flags)
    {
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

    /// <summary>u = 2⁻⁵³, the unit roundoff of double.</summary>
    private const double UnitRoundoff = 1.1102230246251565e-16;

    private sealed record WindowSummary(double Min, double Max, double Sum, bool AnyImplausible);

    /// <summary>One rail's level and tolerance with what <see cref="CountAtRails"/> counted at it.</summary>
    private struct Rail(double level, bool declared, SensorFaultLimits limits)
    {
        public readonly double Level = level;
        public readonly bool Declared = declared;

        // At a declared rail the tolerance is the user's. At the window's own extreme only the extreme level
        // itself counts (half the tolerance, which defaults to the resolution), as in AddRailFlag.
        public readonly double Tolerance = declared ? limits.RailTolerance : 0.5 * limits.RailTolerance;
        public int Count;
        public int Run;
        public int Longest;
        public int First = -1;
        public int InsideLow;
        public int InsideHigh;

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Visit(double v, int index)
        {
            if (Math.Abs(v - Level) <= Tolerance)
            {
                Count++;
                Run++;
                Longest = Math.Max(Longest, Run);
                First = First < 0 ? index : First;
            }
            else
            {
                Run = 0;
            }
        }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Band(double v, double limitLow, double limitHigh)
        {
            double distance = Math.Abs(v - Level);
            if (distance > Tolerance)
            {
                InsideLow += distance <= limitLow ? 1 : 0;
                InsideHigh += distance <= limitHigh ? 1 : 0;
            }
        }
    }
}
