using System.Globalization;
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
/// Limits for <see cref="SensorFaults.Check"/>, in the channel's engineering unit.
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
