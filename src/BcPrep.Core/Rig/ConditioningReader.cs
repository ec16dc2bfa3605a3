namespace BcPrep.Rig;

/// <summary>Reads the [conditioning] table and each channel's <c>limits</c> table, reporting every problem with its key.</summary>
public static class ConditioningReader
{
    private static readonly string[] MainsChoices = ["none", "50 Hz", "60 Hz"];

    private static readonly Dimension[] RawDimensions = [Dimension.Voltage, Dimension.Current, Dimension.Resistance, Dimension.Frequency];

    /// <summary>The [conditioning] table, or <see cref="ConditioningSpec.Default"/> when it is absent.</summary>
    public static ConditioningSpec Read(TableReader? t)
    {
        var d = ConditioningSpec.Default;
        if (t is null)
        {
            return d;
        }
        var maxBridge = t.Quantity("max_bridge", Dimension.Duration, minSi: 0, maxSi: 3600) ?? d.MaxBridgeS;
        var halfWindow = t.Number("hampel_half_window", min: 1, max: 1000) ?? d.HampelHalfWindow;
        var sigmas = t.Number("hampel_sigmas", min: 0.5, max: 100) ?? d.HampelSigmas;
        var order = t.Number("lowpass_order", min: 1, max: 20) ?? d.LowPassOrder;
        var cutoff = IsNone(t, "lowpass_cutoff") ? null : t.Quantity("lowpass_cutoff", Dimension.Frequency, minSi: 1e-6);
        var mainsText = t.Choice("mains", MainsChoices, "none");
        double? mains = mainsText switch { "50 Hz" => 50.0, "60 Hz" => 60.0, _ => null };
        var q = t.Number("notch_q", min: 1, max: 1000) ?? d.NotchQ;
        var harmonics = t.Number("notch_harmonics", min: 1, max: 50) ?? d.NotchHarmonics;
        foreach (var (key, value) in new[] { ("hampel_half_window", halfWindow), ("lowpass_order", order), ("notch_harmonics", harmonics) })
        {
            if (value != Math.Floor(value))
            {
                t.Report(key, $"{key} must be a whole number");
            }
        }
        t.RejectUnknownKeys();
        return new ConditioningSpec(maxBridge, (int)halfWindow, sigmas, (int)order, cutoff, mains, q, (int)harmonics);
    }

    /// <summary>
    /// A channel's <c>limits</c> table: <c>rail_low</c>, <c>rail_high</c> (engineering or raw unit),
    /// <c>rail_tolerance</c>, <c>plausible_min</c>, <c>plausible_max</c>, <c>resolution</c> (engineering unit).
    /// </summary>
    public static ChannelLimits ReadLimits(TableReader? t, Dimension dimension, SensorSpec? sensor)
    {
        if (t is null)
        {
            return ChannelLimits.None;
        }
        var spread = dimension == Dimension.Temperature ? Dimension.TemperatureDifference : dimension;
        var low = Rail(t, "rail_low", dimension, sensor);
        var high = Rail(t, "rail_high", dimension, sensor);
        if (low is { } l && high is { } h)
        {
            if (l.Raw != h.Raw)
            {
                t.Report("rail_high", "write both rails in the same kind of unit: both engineering or both raw");
            }
            else if (h.Value <= l.Value)
            {
                t.Report("rail_high", "rail_high must be above rail_low");
            }
        }
        var tolerance = t.Quantity("rail_tolerance", spread, minSi: 0);
        var plausibleMin = t.Quantity("plausible_min", dimension);
        var plausibleMax = t.Quantity("plausible_max", dimension);
        if (plausibleMin is { } pMin && plausibleMax is { } pMax && pMax <= pMin)
        {
            t.Report("plausible_max", "plausible_max must be above plausible_min");
        }
        var resolution = t.Quantity("resolution", spread, minSi: 0);
        t.RejectUnknownKeys();
        return new ChannelLimits(low?.Value, high?.Value, (low ?? high)?.Raw ?? false, tolerance, plausibleMin, plausibleMax, resolution);
    }

    private static bool IsNone(TableReader t, string key) =>
        t.Node.TryGet(key, out var entry) && entry.Value is string text && text.Trim() == "none" && t.Has(key);

    /// <summary>A rail in the engineering unit (SI) or, for a non-thermocouple sensor, in a raw unit (as logged).</summary>
    private static (double Value, bool Raw)? Rail(TableReader t, string key, Dimension dimension, SensorSpec? sensor)
    {
        var text = t.String(key);
        if (text is null)
        {
            return null;
        }
        if (UnitText.TryToSi(text, dimension, out var si, out var engineeringError))
        {
            return (si, false);
        }
        if (sensor is not null and not ThermocoupleSensor and not DirectSensor)
        {
            foreach (var raw in RawDimensions)
            {
                if (UnitText.TryToSi(text, raw, out var rawSi, out _) && UnitText.TryUnitToSi(1.0, sensor.RawUnit, raw, out _, out _))
                {
                    // Back to the unit the logger writes (raw_unit), which is what the calibration takes.
                    return ((rawSi - sensor.RawToSi.Shift) / sensor.RawToSi.Scale, true);
                }
            }
        }
        t.Report(key, sensor is ThermocoupleSensor
            ? $"{engineeringError}; a thermocouple's rails are written as temperatures"
            : $"{engineeringError}, nor of the raw signal (V, A, ohm, Hz)");
        return null;
    }
}
