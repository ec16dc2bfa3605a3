using System.Globalization;
using UnitsNet;
using UnitsNet.Units;

namespace BcPrep.Rig;

/// <summary>
/// Converts a number written with its unit ("52.5 mm", "20 degC", "4 inH2O") to SI. Parsing is UnitsNet's; this
/// class only adds the ASCII spellings people type (degC, um, ohm) and names the SI unit of each dimension. The
/// common units skip UnitsNet's start-up (<see cref="CommonUnits"/>, held to UnitsNet bit for bit by a test).
/// </summary>
public static class UnitText
{
    private static readonly (string Typed, string UnitsNet)[] Aliases =
    [
        ("degC", "°C"), ("deg C", "°C"), ("degF", "°F"), ("deg F", "°F"), ("um", "µm"), ("ohm", "Ω"), ("Ohm", "Ω"),
        ("kohm", "kΩ"), ("inH₂O", "inH2O"), ("mmH₂O", "mmH2O"),
    ];

    /// <summary>The SI unit symbol of each dimension, as written in output headers.</summary>
    public static string SiSymbol(Dimension dimension) => dimension switch
    {
        Dimension.Dimensionless => "1",
        Dimension.Length => "m",
        Dimension.Pressure => "Pa",
        Dimension.Temperature => "K",
        Dimension.TemperatureDifference => "K",
        Dimension.Voltage => "V",
        Dimension.Current => "A",
        Dimension.Resistance => "ohm",
        Dimension.MassFlow => "kg/s",
        Dimension.Duration => "s",
        Dimension.Frequency => "Hz",
        Dimension.Power => "W",
        _ => throw new ArgumentOutOfRangeException(nameof(dimension)),
    };

    /// <summary>Parses "value unit" and returns the value in the SI unit of <paramref name="dimension"/>.</summary>
    /// <returns>False with a reason when the text has no unit, an unknown unit, or a unit of another dimension.</returns>
    public static bool TryToSi(string text, Dimension dimension, out double valueSi, out string error)
    {
        valueSi = double.NaN;
        error = "";
        var trimmed = text.Trim();
        if (dimension == Dimension.Dimensionless)
        {
            return TryDimensionless(trimmed, out valueSi, out error);
        }
        var (number, unit) = Split(trimmed);
        if (number is null || !double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out var value))
        {
            error = $"'{text}' does not start with a number (write it as \"value unit\", e.g. \"{Example(dimension)}\")";
            return false;
        }
        if (!double.IsFinite(value))
        {
            error = $"'{text}': the number is beyond the range of a double (about 1.8e308)";
            return false;
        }
        if (unit.Length == 0)
        {
            error = $"'{text}' has no unit (write e.g. \"{Example(dimension)}\")";
            return false;
        }
        unit = Canonical(unit);
        if (dimension == Dimension.TemperatureDifference)
        {
            return TryTemperatureDifference(value, unit, text, out valueSi, out error);
        }
        if (CommonUnits.TryToSi(value, unit, dimension, out valueSi))
        {
            return true;
        }
        var (quantityType, siUnit) = Target(dimension);
        if (CommonUnits.BelongsElsewhere(unit, dimension)
            || !Quantity.TryParse(CultureInfo.InvariantCulture, quantityType, $"{value.ToString("R", CultureInfo.InvariantCulture)} {unit}", out var quantity))
        {
            valueSi = double.NaN;
            error = $"'{unit}' in '{text}' is not a unit of {Describe(dimension)} (e.g. \"{Example(dimension)}\")";
            return false;
        }
        valueSi = quantity.As(siUnit);
        return true;
    }

    /// <summary>Converts a value given in the named unit (for calibration coefficients written in user units).</summary>
    public static bool TryUnitToSi(double value, string unit, Dimension dimension, out double valueSi, out string error) =>
        TryToSi(value.ToString("R", CultureInfo.InvariantCulture) + " " + unit, dimension, out valueSi, out error);

    private static bool TryDimensionless(string text, out double value, out string error)
    {
        error = "";
        var isPercent = text.EndsWith('%');
        var number = isPercent ? text[..^1].Trim() : text;
        if (!double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out value))
        {
            error = $"'{text}' is not a number or a percentage";
            return false;
        }
        if (isPercent)
        {
            value /= 100.0;
        }
        return true;
    }

    private static bool TryTemperatureDifference(double value, string unit, string text, out double valueSi, out string error)
    {
        error = "";
        // A difference has no offset, so only the scale of each temperature unit matters.
        valueSi = unit switch
        {
            "K" or "°C" => value,
            "mK" => value * 1e-3,
            "°F" or "°R" => value * 5.0 / 9.0,
            _ => double.NaN,
        };
        if (double.IsNaN(valueSi))
        {
            error = $"'{unit}' in '{text}' is not a unit of temperature difference (K, mK, degC, degF)";
            return false;
        }
        return true;
    }

    private static (string? Number, string Unit) Split(string text)
    {
        var i = 0;
        while (i < text.Length && (char.IsDigit(text[i]) || text[i] is '.' or '-' or '+' or 'e' or 'E'))
        {
            // 'e' only counts as part of the number when an exponent digit follows.
            if (text[i] is 'e' or 'E' && (i + 1 >= text.Length || !(char.IsDigit(text[i + 1]) || text[i + 1] is '-' or '+')))
            {
                break;
            }
            i++;
        }
        return i == 0 ? (null, text) : (text[..i], text[i..].Trim());
    }

    private static string Canonical(string unit)
    {
        foreach (var (typed, canonical) in Aliases)
        {
            if (unit == typed)
            {
                return canonical;
            }
        }
        return unit;
    }

    internal static (Type QuantityType, Enum SiUnit) Target(Dimension dimension) => dimension switch
    {
        Dimension.Length => (typeof(Length), LengthUnit.Meter),
        Dimension.Pressure => (typeof(Pressure), PressureUnit.Pascal),
        Dimension.Temperature => (typeof(Temperature), TemperatureUnit.Kelvin),
        Dimension.Voltage => (typeof(ElectricPotential), ElectricPotentialUnit.Volt),
        Dimension.Current => (typeof(ElectricCurrent), ElectricCurrentUnit.Ampere),
        Dimension.Resistance => (typeof(ElectricResistance), ElectricResistanceUnit.Ohm),
        Dimension.MassFlow => (typeof(MassFlow), MassFlowUnit.KilogramPerSecond),
        Dimension.Duration => (typeof(Duration), DurationUnit.Second),
        Dimension.Frequency => (typeof(Frequency), FrequencyUnit.Hertz),
        Dimension.Power => (typeof(Power), PowerUnit.Watt),
        _ => throw new ArgumentOutOfRangeException(nameof(dimension)),
    };

    private static string Describe(Dimension dimension) => dimension switch
    {
        Dimension.MassFlow => "mass flow",
        Dimension.TemperatureDifference => "temperature difference",
        _ => dimension.ToString().ToLowerInvariant(),
    };

    private static string Example(Dimension dimension) => dimension switch
    {
        Dimension.Length => "52.5 mm",
        Dimension.Pressure => "101.3 kPa",
        Dimension.Temperature => "20 degC",
        Dimension.TemperatureDifference => "0.5 K",
        Dimension.Voltage => "10 mV",
        Dimension.Current => "4 mA",
        Dimension.Resistance => "100 ohm",
        Dimension.MassFlow => "0.02 kg/s",
        Dimension.Duration => "10 min",
        Dimension.Frequency => "50 Hz",
        Dimension.Power => "2 kW",
        _ => "1",
    };
}
