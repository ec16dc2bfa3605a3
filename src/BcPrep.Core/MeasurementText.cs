using System.Globalization;
using System.Text;

namespace BcPrep;

/// <summary>
/// Numbers for a person to read (the report, the status line, messages), never for a data file: data files keep
/// full round-trip precision. A result is written as JCGM 100 7.2.6 asks: the uncertainty with at most two
/// significant digits (here always two) and the value rounded to the same decimal place, so "26655.4 ± 398"
/// reads "26 660 ± 400". Plain decimals are used for ordinary magnitudes; only a number that would need more than
/// nine integer digits or more than six decimals is written with a power of ten, "(2.534 ± 0.011) × 10⁻⁹". The
/// integer part of a number of five digits or more is grouped in threes (SI Brochure 5.4.4) by a narrow no-break
/// space, so a value never breaks across lines; the decimal marker is a point whatever the culture.
/// Ties round away from zero (common practice for reported values).
/// </summary>
public static class MeasurementText
{
    /// <summary>The group separator: U+202F narrow no-break space.</summary>
    public const string GroupSeparator = "\u202F";

    // Beyond these a plain decimal is too long to read: 10⁹ and up, or a rounding place below 10⁻⁶.
    private const int MaxIntegerDigits = 9;
    private const int MaxDecimals = 6;

    /// <summary>
    /// "value ± U" with U to two significant digits and the value to the same decimal place. A U of 0 (an exact
    /// value) keeps six significant digits of the value; a missing U (NaN) gives the value alone with six; a
    /// missing value gives "–".
    /// </summary>
    public static string WithUncertainty(double value, double uncertainty)
    {
        if (!double.IsFinite(value))
        {
            return "–";
        }
        if (!double.IsFinite(uncertainty) || uncertainty < 0)
        {
            return Number(value, 6);
        }
        if (uncertainty == 0)
        {
            return Number(value, 6) + " ± 0";
        }
        var (valueText, uncertaintyText, exponent) = Rounded(value, uncertainty);
        return exponent == 0 ? $"{valueText} ± {uncertaintyText}" : $"({valueText} ± {uncertaintyText}) × 10{Superscript(exponent)}";
    }

    /// <summary>
    /// The value and the uncertainty as <see cref="WithUncertainty"/> rounds them, as two texts with a shared
    /// power of ten (0 for plain decimals), for a layout that puts them apart ("y = 7.90, u_c = 0.11").
    /// </summary>
    public static (string Value, string Uncertainty, int Exponent) Rounded(double value, double uncertainty)
    {
        if (!double.IsFinite(value) || !double.IsFinite(uncertainty) || uncertainty <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(uncertainty), uncertainty, "needs a finite value and a positive finite uncertainty");
        }
        // The decimal place of U's second significant digit; recomputed once when rounding carries U to a new digit (99.6 → 100).
        var place = (int)Math.Floor(Math.Log10(uncertainty)) - 1;
        var roundedU = RoundAt(uncertainty, place);
        if (roundedU >= Math.Pow(10, place + 2))
        {
            place++;
            roundedU = RoundAt(uncertainty, place);
        }
        var roundedValue = RoundAt(value, place);
        var largest = Math.Max(Math.Abs(roundedValue), roundedU);
        var exponent = 0;
        if (-place > MaxDecimals || largest >= Math.Pow(10, MaxIntegerDigits))
        {
            // Scientific form: a power of ten that is a multiple of 3, so the prefix-like steps of SI are kept.
            exponent = 3 * (int)Math.Floor(Math.Floor(Math.Log10(largest)) / 3);
        }
        var decimals = Math.Max(0, exponent - place);
        return (Decimal(roundedValue / Math.Pow(10, exponent), decimals), Decimal(roundedU / Math.Pow(10, exponent), decimals), exponent);
    }

    /// <summary>
    /// A number without an uncertainty, to <paramref name="significantDigits"/> significant digits, trailing zeros
    /// dropped; "–" for NaN or infinity. <paramref name="grouped"/> false leaves the digits ungrouped, for a message
    /// about a value the person types into a file ("must be between 3 and 10000").
    /// </summary>
    public static string Number(double value, int significantDigits = 4, bool grouped = true)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(significantDigits, 1);
        if (!double.IsFinite(value))
        {
            return "–";
        }
        if (value == 0)
        {
            return "0";
        }
        var place = (int)Math.Floor(Math.Log10(Math.Abs(value))) - significantDigits + 1;
        var rounded = RoundAt(value, place);
        if (rounded != 0 && Math.Abs(rounded) >= Math.Pow(10, place + significantDigits))
        {
            place++;
            rounded = RoundAt(value, place);
        }
        if (-place > MaxDecimals || Math.Abs(rounded) >= Math.Pow(10, MaxIntegerDigits))
        {
            var exponent = (int)Math.Floor(Math.Log10(Math.Abs(rounded)));
            var mantissa = TrimZeros(Decimal(rounded / Math.Pow(10, exponent), Math.Max(0, exponent - place), grouped));
            return $"{mantissa} × 10{Superscript(exponent)}";
        }
        return TrimZeros(Decimal(rounded, Math.Max(0, -place), grouped));
    }

    /// <summary><paramref name="value"/> rounded to a multiple of 10^<paramref name="place"/>, ties away from zero, computed in decimal where it fits so that 0.125 stays 0.125.</summary>
    private static double RoundAt(double value, int place)
    {
        if (place <= 0 && place >= -20 && Math.Abs(value) < 7.9e27)
        {
            return (double)Math.Round((decimal)value, -place, MidpointRounding.AwayFromZero);
        }
        var scale = Math.Pow(10, place);
        return Math.Round(value / scale, MidpointRounding.AwayFromZero) * scale;
    }

    /// <summary>Fixed-point text with the integer part grouped in threes from five digits up, and no "-0".</summary>
    private static string Decimal(double value, int decimals, bool grouped = true)
    {
        var text = value.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        if (text.TrimStart('-').All(c => c is '0' or '.'))
        {
            text = text.TrimStart('-');
        }
        var negative = text.StartsWith('-');
        var digits = negative ? text[1..] : text;
        var point = digits.IndexOf('.');
        var integer = point < 0 ? digits : digits[..point];
        var rest = point < 0 ? "" : digits[point..];
        if (grouped && integer.Length >= 5)
        {
            var groups = new StringBuilder();
            for (var i = 0; i < integer.Length; i++)
            {
                if (i > 0 && (integer.Length - i) % 3 == 0)
                {
                    groups.Append(GroupSeparator);
                }
                groups.Append(integer[i]);
            }
            integer = groups.ToString();
        }
        return (negative ? "-" : "") + integer + rest;
    }

    private static string TrimZeros(string text) => text.Contains('.') ? text.TrimEnd('0').TrimEnd('.') : text;

    private static string Superscript(int exponent) =>
        string.Concat(exponent.ToString(CultureInfo.InvariantCulture).Select(c => c switch
        {
            '-' => '⁻',
            '0' => '⁰', '1' => '¹', '2' => '²', '3' => '³', '4' => '⁴',
            '5' => '⁵', '6' => '⁶', '7' => '⁷', '8' => '⁸', _ => '⁹',
        }));
}
