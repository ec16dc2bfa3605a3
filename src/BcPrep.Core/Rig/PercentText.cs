using System.Globalization;

namespace BcPrep.Rig;

/// <summary>What a percentage written in an instrument specification is a percentage of.</summary>
public enum PercentBasis
{
    /// <summary>A bare number or "%": the key it is written under says what it is a fraction of.</summary>
    Unstated,
    /// <summary>"%FS": a fraction of the full scale (or span) the maker's specification refers to.</summary>
    FullScale,
    /// <summary>"%rdg": a fraction of the reading.</summary>
    Reading,
}

/// <summary>
/// Reads the percentages of data sheets: "0.25 %FS" (of full scale), "1 %rdg" (of reading) and plain "0.5 %".
/// The basis is kept so that a term cannot silently be applied to the wrong base (a %FS limit taken as a fraction
/// of reading is wrong by the ratio of full scale to reading, often a factor of ten).
/// </summary>
public static class PercentText
{
    private static readonly (string Suffix, PercentBasis Basis)[] Suffixes =
    [
        ("%FS", PercentBasis.FullScale), ("% FS", PercentBasis.FullScale), ("%F.S.", PercentBasis.FullScale),
        ("%rdg", PercentBasis.Reading), ("% rdg", PercentBasis.Reading), ("%reading", PercentBasis.Reading),
        ("% of reading", PercentBasis.Reading), ("%", PercentBasis.Unstated),
    ];

    /// <summary>
    /// Parses "value %FS", "value %rdg", "value %" or a bare number (taken as a fraction, basis unstated).
    /// Suffixes are matched without regard to case. Returns the fraction (0.25 %FS → 0.0025).
    /// </summary>
    /// <returns>False with a reason for text that is not a number followed by one of these suffixes.</returns>
    public static bool TryParse(string text, out double fraction, out PercentBasis basis, out string error)
    {
        fraction = double.NaN;
        basis = PercentBasis.Unstated;
        error = "";
        var trimmed = text.Trim();
        var number = trimmed;
        var isPercent = false;
        foreach (var (suffix, b) in Suffixes)
        {
            if (trimmed.EndsWith(suffix, StringComparison.OrdinalIgnoreCase))
            {
                number = trimmed[..^suffix.Length].Trim();
                basis = b;
                isPercent = true;
                break;
            }
        }
        if (!double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) || !double.IsFinite(value))
        {
            error = $"'{text}' is not a percentage (write e.g. \"0.25 %FS\" of full scale, \"1 %rdg\" of reading, or \"0.5 %\")";
            return false;
        }
        fraction = isPercent ? value / 100.0 : value;
        return true;
    }

    /// <summary>The suffix as written in messages and the manifest.</summary>
    public static string Symbol(PercentBasis basis) => basis switch
    {
        PercentBasis.FullScale => "%FS",
        PercentBasis.Reading => "%rdg",
        _ => "%",
    };
}
