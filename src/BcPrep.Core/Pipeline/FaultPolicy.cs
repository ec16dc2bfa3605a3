using System.Globalization;
using BcPrep.Conditioning;
using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// Decides which sensor faults fail an operating point. A channel the boundary conditions use (any role but
/// <c>other</c>) fails the point when its de-spiked samples are implausible (e.g. an open thermocouple) or sit at a
/// declared rail (a saturated transducer): its mean would be a wrong boundary condition. Flat at the window's own
/// maximum or minimum without a declared rail is only a warning, because a quiet, coarsely quantised signal looks
/// the same. A stuck channel (no variance) is a warning: it may be a very steady, coarse signal, and the person must
/// judge it. Faults on <c>other</c> channels are always warnings.
/// </summary>
public static class FaultPolicy
{
    /// <summary>Severity of one flag raised on <paramref name="channel"/> with the <paramref name="limits"/> used.</summary>
    public static FaultSeverity Judge(ChannelSpec channel, SensorFaultFlag flag, SensorFaultLimits limits)
    {
        ArgumentNullException.ThrowIfNull(channel);
        ArgumentNullException.ThrowIfNull(flag);
        ArgumentNullException.ThrowIfNull(limits);
        if (channel.Role == ChannelRole.Other)
        {
            return FaultSeverity.Warning;
        }
        return flag.Kind switch
        {
            SensorFaultKind.Implausible => FaultSeverity.Failure,
            SensorFaultKind.Saturation when flag.EvidenceValue == limits.RailHigh || flag.EvidenceValue == limits.RailLow => FaultSeverity.Failure,
            _ => FaultSeverity.Warning,
        };
    }

    /// <summary>
    /// Window statistics of channel <paramref name="channelId"/> with the rig's conditioning settings and the channel's limits,
    /// each fault judged. A failing fault raises <see cref="BcPrepFailure"/> (<see cref="FailureKind.InputData"/>,
    /// exit code 3) naming channel, window and evidence.
    /// </summary>
    public static ChannelWindowStats Evaluate(RigDescription rig, string channelId, TimeWindow window, double[] timesS, double[] values, DayStart dayStart) =>
        Evaluate(rig, channelId, window, timesS, values.AsMemory(), dayStart);

    /// <inheritdoc cref="Evaluate(RigDescription, string, TimeWindow, double[], double[], DayStart)"/>
    internal static ChannelWindowStats Evaluate(RigDescription rig, string channelId, TimeWindow window, double[] timesS, ReadOnlyMemory<double> values, DayStart dayStart) =>
        Evaluate(rig, channelId, window, dayStart, (settings, limits) => WindowStatistics.Evaluate(channelId, window, timesS, values, settings, limits, dayStart));

    /// <inheritdoc cref="Evaluate(RigDescription, string, TimeWindow, double[], double[], DayStart)"/>
    /// <remarks>The values are the caller's to write over, each cell written recorded in <paramref name="edits"/>, a copy made into <paramref name="copySlot"/> (<see cref="WindowStatistics.EvaluateInPlace"/>).</remarks>
    internal static ChannelWindowStats EvaluateInPlace(RigDescription rig, string channelId, TimeWindow window, double[] timesS, Memory<double> values, SampleEdits edits, DayStart dayStart,
        int copySlot = ScratchSlots.CleanSamples) =>
        Evaluate(rig, channelId, window, dayStart, (settings, limits) => WindowStatistics.EvaluateInPlace(channelId, window, timesS, values, edits, settings, limits, dayStart, copySlot));

    private static ChannelWindowStats Evaluate(RigDescription rig, string channelId, TimeWindow window, DayStart dayStart,
        Func<ConditioningSettings, SensorFaultLimits, ChannelWindowStats> statistics)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(window);
        var channel = rig.Channel(channelId);
        if (channel is null)
        {
            return statistics(new ConditioningSettings(MaxBridgeS: rig.Conditioning.MaxBridgeS, HampelHalfWindow: rig.Conditioning.HampelHalfWindow, HampelSigmas: rig.Conditioning.HampelSigmas), new SensorFaultLimits());
        }
        var limits = ChannelConditioningPlan.Limits(channel);
        var stats = statistics(ChannelConditioningPlan.Settings(rig, channel), limits);
        var report = stats.Conditioning!;
        var verdicts = report.Faults.Select(v => v with { Severity = Judge(channel, v.Flag, limits) }).ToList();
        if (verdicts.FirstOrDefault(v => v.Severity == FaultSeverity.Failure) is { } failing)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channelId), string.Create(CultureInfo.InvariantCulture,
                $"channel '{channelId}' ({channel.Role}) in window '{window.Id}' ({dayStart.Since(window.Start).Value:F1}–{dayStart.Since(window.End).Value:F1} s), from {dayStart.Since(new LoggerSeconds(failing.FirstTimeS)).Value:F1} s: {failing.Flag.Kind}: {failing.Flag.Evidence}; its mean cannot serve as a boundary condition"));
        }
        return stats with { Conditioning = report with { Faults = verdicts } };
    }
}
