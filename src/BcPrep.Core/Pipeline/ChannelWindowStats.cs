using BcPrep.Conditioning;
using BcPrep.Uncertainty;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// What one channel did inside one window: counts, the mean and its Type A uncertainty (from de-spiked but
/// unfiltered samples, because a low-pass narrows the scatter and would understate the uncertainty), and what
/// conditioning changed.
/// </summary>
public sealed record ChannelWindowStats(
    string Channel,
    string Window,
    int SampleCount,
    int MissingCount,
    int BridgedSamples,
    int SpikesReplaced,
    double Mean,
    double StandardDeviation,
    double Min,
    double Max,
    WindowMeanResult TypeA,
    IReadOnlyList<SensorFaultFlag> Faults)
{
    /// <summary>What conditioning did in this window (gaps, spike times, fault verdicts); null when not recorded.</summary>
    public WindowConditioning? Conditioning { get; init; }
}

/// <summary>Reduces one channel's window samples to <see cref="ChannelWindowStats"/>.</summary>
public static class WindowStatistics
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
        var bridged = GapBridging.Bridge(timesS, values, settings.MaxBridgeS);
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
        var faults = SensorFaults.Check(clean, limits).Flags;
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
    public const double LostFractionLimit = 0.25;

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
