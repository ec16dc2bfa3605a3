using BcPrep.Rig;
using BcPrep.Steady;

namespace BcPrep.Pipeline;

/// <summary>
/// The channels steady detection looks at, from the rig file: the <c>[steady]</c> keys as written, or, when none
/// are written, defaults that need no hand tuning, plus the heater channels as step markers.
/// </summary>
public static class DetectionKeys
{
    /// <summary>
    /// A channel is settled when its predicted remaining change is at most this fraction of its declared standard
    /// uncertainty: then what is still to come stays small beside what the sensor is trusted to anyway.
    /// </summary>
    public const double ToleranceFractionOfU = 0.2;

    /// <summary>
    /// A flow key's smallest operating mean, as a fraction of the day's largest flow (its 99th percentile of block
    /// means): the rig at rest (fan off) is steady, yet no operating point.
    /// </summary>
    public const double RestFractionOfLargestFlow = 0.05;

    /// <summary>
    /// The default key channels when <c>[steady]</c> names none: the mass flow (or, without one, the flow meter's
    /// differential pressures), the outlet bulk temperature and every wall thermocouple (the slowest one, whichever
    /// it is on the day, then decides when a point is settled).
    /// </summary>
    public static IReadOnlyList<ChannelSpec> DefaultKeys(RigDescription rig)
    {
        ArgumentNullException.ThrowIfNull(rig);
        var flow = rig.Channels.Where(c => c.Role == ChannelRole.MassFlow).ToList();
        if (flow.Count == 0)
        {
            flow = rig.Channels.Where(c => c.Role == ChannelRole.DifferentialPressure).ToList();
        }
        var outlet = rig.Channels.Where(c => c.Role == ChannelRole.BulkTemperature && c.Plane == "outlet" && c.RadiusM is null);
        var walls = rig.Channels.Where(c => c.Role == ChannelRole.WallTemperature);
        return [.. flow, .. outlet, .. walls];
    }

    /// <summary>Channels that only mark set-point steps: the heater's voltage, current or power, which jump when the setting changes.</summary>
    public static IReadOnlyList<ChannelSpec> StepMarkers(RigDescription rig)
    {
        ArgumentNullException.ThrowIfNull(rig);
        return rig.Channels.Where(c => c.Role is ChannelRole.HeaterVoltage or ChannelRole.HeaterCurrent or ChannelRole.HeaterPower).ToList();
    }

    /// <summary>
    /// Remaining-change tolerance of a default key at a level: <see cref="ToleranceFractionOfU"/> of the root sum
    /// of squares of its declared Type B terms there; a channel that declares none gets 0.1 % of its level.
    /// </summary>
    public static Func<double, double> ToleranceFromUncertainty(ChannelSpec channel)
    {
        ArgumentNullException.ThrowIfNull(channel);
        return level =>
        {
            var variance = channel.Uncertainty.Sum(term => Math.Pow(TypeBTerms.StandardUncertainty(term, channel, level), 2));
            var u = Math.Sqrt(variance);
            return u > 0 ? ToleranceFractionOfU * u : Math.Max(1e-3 * Math.Abs(level), 1e-12);
        };
    }

    /// <summary>
    /// The detector's channels with their block means: the written keys, or the defaults with tolerances from the
    /// declared uncertainty; then the heater channels as step markers.
    /// </summary>
    public static IReadOnlyList<KeyChannel> For(RigDescription rig, Func<string, IReadOnlyList<double>> blockMeans)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(blockMeans);
        var result = new List<KeyChannel>();
        if (rig.Steady.Keys.Count > 0)
        {
            result.AddRange(rig.Steady.Keys.Select(k => new KeyChannel(k.Channel, blockMeans(k.Channel), k.MaxChangeSi / rig.Steady.WindowS, k.MaxScatterSi, k.StepSi,
                k.MinimumSi ?? double.NegativeInfinity)));
        }
        else
        {
            // Where the flow or a heater channel marks the steps, the slow temperatures are left out of the search.
            var fastMarkers = StepMarkers(rig).Count > 0 || DefaultKeys(rig).Any(c => c.Role is ChannelRole.MassFlow or ChannelRole.DifferentialPressure);
            foreach (var channel in DefaultKeys(rig))
            {
                var flow = channel.Role is ChannelRole.MassFlow or ChannelRole.DifferentialPressure;
                result.Add(new KeyChannel(channel.Id, blockMeans(channel.Id), double.PositiveInfinity, double.PositiveInfinity, double.Epsilon)
                {
                    // Known only at the day's end: the detector applies it to the final windows then.
                    RestFractionOfLargest = flow ? RestFractionOfLargestFlow : null,
                    Tolerance = ToleranceFromUncertainty(channel),
                    MarksSteps = !fastMarkers || channel.Role is ChannelRole.MassFlow or ChannelRole.DifferentialPressure,
                });
            }
        }
        var keyIds = result.Select(k => k.Name).ToHashSet(StringComparer.Ordinal);
        result.AddRange(StepMarkers(rig).Where(c => !keyIds.Contains(c.Id))
            .Select(c => new KeyChannel(c.Id, blockMeans(c.Id), double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { StepOnly = true }));
        return result;
    }
}
