using BcPrep.Conditioning;
using BcPrep.Uncertainty;

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
    /// Bridges gaps up to <see cref="ConditioningSettings.MaxBridgeS"/> (a longer gap inside the window fails it with
    /// <see cref="FailureKind.InputData"/>; missing cells at the window edges are dropped and reported), removes
    /// spikes with the Hampel filter of <paramref name="settings"/> (floor of the robust σ =
    /// <see cref="ConditioningSettings.HampelScaleFloor"/>), screens the de-spiked samples for sensor faults with
    /// <paramref name="limits"/>, and takes the mean and Type A uncertainty of the de-spiked, unfiltered samples.
    /// Notch and low-pass settings are not used here on purpose: a low-pass narrows the scatter and would
    /// understate the Type A uncertainty. What was done is in <see cref="ChannelWindowStats.Conditioning"/>.
    /// </summary>
    /// <remarks>Messages give times since dayStartS, the first sample of the day on the log clock.</remarks>
    public static ChannelWindowStats Evaluate(string channel, TimeWindow window, double[] timesS, double[] values, ConditioningSettings settings, SensorFaultLimits limits, double dayStartS = 0.0)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var finite = FiniteCount(values);
        if (finite < 3)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel),
                $"window '{window.Id}' ({window.StartS - dayStartS:F1}–{window.EndS - dayStartS:F1} s since the first sample of the day) holds {finite} valid samples of '{channel}'; at least 3 are needed");
        }
        var bridged = GapBridging.Bridge(timesS, values, settings.MaxBridgeS);
        var interior = bridged.Report.Unbridged.Where(g => !g.AtRecordEdge).ToList();
        if (interior.Count > 0)
        {
            var gap = interior.OrderByDescending(g => g.DurationS).First();
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel), string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"channel '{channel}' has a {gap.DurationS:F1} s gap ({gap.StartS - dayStartS:F1}–{gap.EndS - dayStartS:F1} s since the first sample of the day) inside window '{window.Id}', longer than the {settings.MaxBridgeS:G} s that may be bridged"));
        }
        var (keptTimes, kept) = FiniteSamples(bridged.TimesS, bridged.Values);
        var despiked = HampelFilter.Apply(kept, settings.HampelHalfWindow, settings.HampelSigmas, settings.HampelScaleFloor);
        var clean = despiked.Values;
        var faults = SensorFaults.Check(clean, limits).Flags;
        var typeA = WindowMean.Evaluate(clean);
        var (min, max) = Range(clean);
        var report = new WindowConditioning(
            bridged.Report.Bridged.ToList(), bridged.Report.Unbridged.ToList(),
            despiked.ReplacedIndices.Select(i => keptTimes[i]).ToList(),
            faults.Select(f => new FaultVerdict(f, FaultSeverity.Warning, f.FirstIndex >= 0 && f.FirstIndex < keptTimes.Length ? keptTimes[f.FirstIndex] : double.NaN)).ToList());
        return new ChannelWindowStats(
            channel, window.Id, clean.Length, values.Length - finite, bridged.Report.InterpolatedSamples,
            despiked.ReplacedIndices.Count, typeA.Mean, typeA.StandardDeviation, min, max, typeA, faults)
        {
            Conditioning = report,
        };
    }

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
