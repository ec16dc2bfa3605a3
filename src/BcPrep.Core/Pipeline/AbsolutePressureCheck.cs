using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// Refuses an operating point whose window means give an absolute pressure at or below zero, naming the channel
/// (and its barometer reference) in the rig file. Such a value comes from a wrong sign, gain or offset or a broken
/// transducer; the property functions would reject it too, but without saying which channel is to blame.
/// </summary>
public static class AbsolutePressureCheck
{
    /// <summary>
    /// Absolute pressure of a channel = its window mean, minus its tare mean when it has one, plus its reference
    /// channel's (tared) mean for a gauge reading. A gauge channel whose reference is itself not positive is not
    /// reported again: the reference is the cause. Throws <see cref="BcPrepFailure"/> (input data) listing every
    /// offending channel; returns silently when all are positive or not in the window.
    /// </summary>
    public static void Require(RigDescription rig, string pointId,
        IReadOnlyDictionary<string, ChannelWindowStats> window, IReadOnlyDictionary<string, ChannelWindowStats> tares)
    {
        var problems = new List<Problem>();
        var pressures = rig.Channels.Where(c => c.Role is ChannelRole.BarometricPressure or ChannelRole.StaticPressure).ToList();
        foreach (var channel in pressures)
        {
            if (Tared(channel.Id, window, tares) is not { } own)
            {
                continue;
            }
            var absolute = own;
            var how = $"the window mean of '{channel.Id}' is {Format(own)} Pa";
            if (channel.ReferenceChannel is { } reference && Tared(reference, window, tares) is { } referencePa)
            {
                if (!(referencePa > 0))
                {
                    continue;
                }
                absolute += referencePa;
                how = $"the window mean of '{channel.Id}' (gauge, {Format(own)} Pa) plus its reference '{reference}' ({Format(referencePa)} Pa) is {Format(absolute)} Pa";
            }
            if (!(absolute > 0))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'" },
                    $"point '{pointId}': {(absolute < 0 ? "negative" : "zero")} absolute pressure: {how}; check the sign, gain and offset of its calibration and the transducer"));
            }
        }
        if (problems.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.InputData, problems);
        }
    }

    private static double? Tared(string channel, IReadOnlyDictionary<string, ChannelWindowStats> window, IReadOnlyDictionary<string, ChannelWindowStats> tares)
    {
        if (!window.TryGetValue(channel, out var stats))
        {
            return null;
        }
        return tares.TryGetValue(channel, out var tare) ? stats.Mean - tare.Mean : stats.Mean;
    }

    // A message for a person: six significant digits through the one formatter of numbers for people.
    private static string Format(double pa) => MeasurementText.Number(pa, 6);
}
