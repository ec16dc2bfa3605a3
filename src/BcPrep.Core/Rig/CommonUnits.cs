namespace BcPrep.Rig;

/// <summary>
/// The units rig files mostly use, converted to SI without UnitsNet: the first unit UnitsNet parses builds its whole
/// catalogue of quantities and abbreviations, about a tenth of a second (more on a loaded machine) before a run can
/// start reading its logs. Each entry is the same single operation UnitsNet 5 applies for that unit (a product by
/// the unit's factor, or the Celsius offset), so the results are UnitsNet's bit for bit; a test holds every entry
/// to UnitsNet over values of all magnitudes. Any unit not listed here goes to UnitsNet as before (power too: UnitsNet
/// holds it in decimal, whose rounding a double product does not repeat).
/// </summary>
internal static class CommonUnits
{
    private static readonly Dictionary<(Dimension, string), Func<double, double>> Conversions = new()
    {
        [(Dimension.Length, "m")] = x => x,
        [(Dimension.Length, "mm")] = x => x * 1e-3,
        [(Dimension.Length, "cm")] = x => x * 1e-2,
        [(Dimension.Length, "µm")] = x => x * 1e-6,
        [(Dimension.Length, "km")] = x => x * 1e3,
        [(Dimension.Pressure, "Pa")] = x => x,
        [(Dimension.Pressure, "hPa")] = x => x * 1e2,
        [(Dimension.Pressure, "kPa")] = x => x * 1e3,
        [(Dimension.Pressure, "MPa")] = x => x * 1e6,
        [(Dimension.Pressure, "mbar")] = x => x * 1e5 * 1e-3, // UnitsNet's order: the bar's factor, then the prefix
        [(Dimension.Pressure, "bar")] = x => x * 1e5,
        [(Dimension.Temperature, "K")] = x => x,
        [(Dimension.Temperature, "°C")] = x => x + 273.15,
        [(Dimension.Voltage, "V")] = x => x,
        [(Dimension.Voltage, "mV")] = x => x * 1e-3,
        [(Dimension.Voltage, "µV")] = x => x * 1e-6,
        [(Dimension.Voltage, "kV")] = x => x * 1e3,
        [(Dimension.Current, "A")] = x => x,
        [(Dimension.Current, "mA")] = x => x * 1e-3,
        [(Dimension.Current, "µA")] = x => x * 1e-6,
        [(Dimension.Resistance, "Ω")] = x => x,
        [(Dimension.Resistance, "kΩ")] = x => x * 1e3,
        [(Dimension.Resistance, "mΩ")] = x => x * 1e-3,
        [(Dimension.MassFlow, "kg/s")] = x => x,
        [(Dimension.Duration, "s")] = x => x,
        [(Dimension.Duration, "ms")] = x => x * 1e-3,
        [(Dimension.Duration, "min")] = x => x * 60,
        [(Dimension.Duration, "h")] = x => x * 3600,
        [(Dimension.Frequency, "Hz")] = x => x,
        [(Dimension.Frequency, "kHz")] = x => x * 1e3,
    };

    /// <summary>The (dimension, unit) pairs converted here, for the test that holds them to UnitsNet.</summary>
    internal static IEnumerable<(Dimension Dimension, string Unit)> Listed => Conversions.Keys;

    /// <summary>
    /// True when <paramref name="unit"/> is listed for another dimension only, so that UnitsNet would refuse it for
    /// <paramref name="dimension"/> (a test checks each such pair against UnitsNet): a rig's "mA" tried as a voltage
    /// before a current needs no UnitsNet either.
    /// </summary>
    public static bool BelongsElsewhere(string unit, Dimension dimension) =>
        !Conversions.ContainsKey((dimension, unit)) && !ReadElsewhereToo.Contains((dimension, unit)) && Conversions.Keys.Any(k => k.Item2 == unit);

    /// <summary>Listed units that UnitsNet also reads as another dimension: Ångström, petaampere, hand, minute.</summary>
    internal static readonly HashSet<(Dimension, string)> ReadElsewhereToo =
        [(Dimension.Length, "A"), (Dimension.Current, "Pa"), (Dimension.Length, "h"), (Dimension.Duration, "m")];

    /// <summary>
    /// <paramref name="value"/> in <paramref name="unit"/> (already in UnitsNet's spelling, see
    /// <see cref="UnitText"/>'s aliases) in the SI unit of <paramref name="dimension"/>; false when the unit is not listed.
    /// </summary>
    public static bool TryToSi(double value, string unit, Dimension dimension, out double valueSi)
    {
        if (Conversions.TryGetValue((dimension, unit), out var convert))
        {
            valueSi = convert(value);
            return true;
        }
        valueSi = double.NaN;
        return false;
    }
}
