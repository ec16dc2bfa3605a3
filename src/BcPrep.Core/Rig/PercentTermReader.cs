using System.Globalization;

namespace BcPrep.Rig;

/// <summary>
/// Reads the percentage part of an uncertainty term so that "%FS" and "%rdg" can only be used where they mean
/// what they say: a "%FS" value needs the full scale it refers to and makes a span term; a "%rdg" value makes a
/// reading term. A bare "%" is accepted only when the term's <c>kind</c> states the base.
/// </summary>
internal static class PercentTermReader
{
    /// <summary>
    /// The term's kind: the <c>kind</c> key when written; otherwise "span" for a "%FS" value, "reading" for a
    /// "%rdg" value, and "absolute" for anything else. Null (problem recorded) for a bare "%" without a kind.
    /// </summary>
    public static string? InferKind(TableReader t)
    {
        if (t.Has("kind") || !t.Node.TryGet("value", out var entry) || entry.Value is not string text || !text.Contains('%', StringComparison.Ordinal))
        {
            return null;
        }
        if (!PercentText.TryParse(text, out _, out var basis, out _))
        {
            return null;
        }
        switch (basis)
        {
            case PercentBasis.FullScale:
                return "span";
            case PercentBasis.Reading:
                return "reading";
            default:
                t.AcceptAllKeys();
                t.Report("value", $"'{text}' does not say what it is a percentage of: write \"%FS\" (with full_scale = \"...\") or \"%rdg\", or give kind = \"span\" or \"reading\"");
                return "";
        }
    }

    /// <summary>
    /// The fraction written under <paramref name="key"/>, which must be "%", a bare fraction, or carry the basis
    /// <paramref name="expected"/>. Range 0 to 1 (0 to 100 %). Null with a problem recorded otherwise.
    /// </summary>
    public static double? Fraction(TableReader t, string key, PercentBasis expected)
    {
        if (!t.Has(key))
        {
            t.Report(key, $"required key '{key}' is missing (e.g. {key} = \"{(expected == PercentBasis.FullScale ? "0.25 %FS" : "1 %rdg")}\")");
            return null;
        }
        t.Node.TryGet(key, out var entry);
        string text;
        if (entry.Value is double bare)
        {
            text = bare.ToString("R", CultureInfo.InvariantCulture);
        }
        else if (entry.Value is string s)
        {
            text = s;
        }
        else
        {
            t.Report(key, "expected a percentage in quotes, e.g. \"0.25 %FS\"");
            return null;
        }
        if (!PercentText.TryParse(text, out var fraction, out var basis, out var error))
        {
            t.Report(key, error);
            return null;
        }
        if (basis != PercentBasis.Unstated && basis != expected)
        {
            var hint = basis == PercentBasis.FullScale
                ? "a %FS limit is a fraction of full scale: use kind = \"span\" with full_scale = \"...\""
                : "a %rdg limit is a fraction of the reading: use kind = \"reading\"";
            t.Report(key, $"'{text}' does not fit this term: {hint}");
            return null;
        }
        if (fraction is < 0 or > 1)
        {
            t.Report(key, $"'{text}' is out of range: must be between 0 and 100 %");
            return null;
        }
        return fraction;
    }

    /// <summary>
    /// The full scale of a span term, written as <c>span</c> or <c>full_scale</c> (one of them, not both), in the
    /// SI unit of <paramref name="dimension"/>.
    /// </summary>
    public static double? FullScale(TableReader t, Dimension dimension)
    {
        var hasSpan = t.Has("span");
        var hasFullScale = t.Has("full_scale");
        if (hasSpan && hasFullScale)
        {
            t.Report("full_scale", "give either span or full_scale, not both (they name the same range)");
            return null;
        }
        if (!hasSpan && !hasFullScale)
        {
            t.Report("full_scale", "a fraction-of-span term needs the range it refers to: full_scale = \"5 kPa\" (or span = \"5 kPa\")");
            return null;
        }
        return t.Quantity(hasSpan ? "span" : "full_scale", dimension, required: true, minSi: 0);
    }
}
