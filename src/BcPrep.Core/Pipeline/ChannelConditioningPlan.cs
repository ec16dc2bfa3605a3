using BcPrep.Calibration;
using BcPrep.Conditioning;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// Turns the rig file's [conditioning] table and a channel's <c>limits</c> into the settings of the conditioning
/// stage, filling in the defaults of each sensor kind.
/// </summary>
public static class ChannelConditioningPlan
{
    /// <summary>
    /// Margin (fraction of the ITS-90 span) inside each end of a thermocouple's range below which readings are taken
    /// as implausible by default. Common practice, our choice: an open thermocouple on most loggers is driven to a
    /// rail (burn-out detection), which lands at or near an end of the range; emf beyond the range already fails
    /// calibration. For type K (−270…1372 °C) the default plausible range is −237…1339 °C.
    /// </summary>
    public const double ThermocoupleRangeMargin = 0.02;

    /// <summary>
    /// Conditioning settings of <paramref name="channel"/>: the rig's [conditioning] values, with the channel's
    /// resolution as the floor of Hampel's robust σ (so a quantised, flat signal still shows spikes).
    /// </summary>
    public static ConditioningSettings Settings(RigDescription rig, ChannelSpec channel)
    {
        ArgumentNullException.ThrowIfNull(rig);
        var c = rig.Conditioning;
        return new ConditioningSettings(c.MaxBridgeS, c.HampelHalfWindow, c.HampelSigmas, Resolution(channel), c.LowPassOrder, c.LowPassCutoffHz, c.MainsHz, c.NotchQ, c.NotchHarmonics);
    }

    /// <summary>
    /// Fault limits in SI: rails (raw rails converted through the channel's calibration), rail tolerance (declared,
    /// else the resolution), plausible range (declared, else the thermocouple default, else unbounded), resolution
    /// (declared in <c>limits</c>, else a <c>resolution</c> uncertainty term, else 0: only an exactly constant
    /// signal counts as stuck).
    /// </summary>
    public static SensorFaultLimits Limits(ChannelSpec channel)
    {
        ArgumentNullException.ThrowIfNull(channel);
        var l = channel.Limits;
        var resolution = Resolution(channel);
        var (railLow, railHigh) = (l.RailLow, l.RailHigh);
        if (l.RailsRaw)
        {
            var convert = ChannelConversion.For(channel);
            (railLow, railHigh) = (railLow is { } lo ? convert(lo, double.NaN) : null, railHigh is { } hi ? convert(hi, double.NaN) : null);
            if (railLow > railHigh)
            {
                (railLow, railHigh) = (railHigh, railLow); // a falling calibration swaps the raw rails
            }
        }
        var (plausibleMin, plausibleMax) = DefaultPlausibleRange(channel);
        return new SensorFaultLimits(
            RailLow: railLow,
            RailHigh: railHigh,
            RailTolerance: l.RailToleranceSi ?? resolution,
            Resolution: resolution,
            PlausibleMin: l.PlausibleMinSi ?? plausibleMin,
            PlausibleMax: l.PlausibleMaxSi ?? plausibleMax);
    }

    /// <summary>Declared resolution, else the value of a <c>resolution</c> uncertainty term, else 0.</summary>
    public static double Resolution(ChannelSpec channel)
    {
        ArgumentNullException.ThrowIfNull(channel);
        return channel.Limits.ResolutionSi
            ?? channel.Uncertainty.FirstOrDefault(u => u.Kind == UncertaintyTermKind.Resolution)?.ValueSi
            ?? 0.0;
    }

    private static (double Min, double Max) DefaultPlausibleRange(ChannelSpec channel)
    {
        if (channel.Sensor is ThermocoupleSensor tc)
        {
            var range = Its90Thermocouple.DirectRangeK(tc.Type);
            var margin = ThermocoupleRangeMargin * (range.Max - range.Min);
            return (range.Min + margin, range.Max - margin);
        }
        return (double.NegativeInfinity, double.PositiveInfinity);
    }
}
