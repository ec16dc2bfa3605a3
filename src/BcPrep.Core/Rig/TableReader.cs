using System.Globalization;

namespace BcPrep.Rig;

/// <summary>
/// Reads typed values from one located TOML table, recording a problem (with line and key) for every missing,
/// mistyped or unknown key instead of stopping at the first, so a rig file's mistakes are all reported at once.
/// </summary>
public sealed class TableReader
{
    private readonly TomlTableNode _table;
    private readonly List<Problem> _problems;
    private readonly HashSet<string> _known = new(StringComparer.Ordinal);

    public TableReader(TomlTableNode table, List<Problem> problems)
    {
        _table = table;
        _problems = problems;
    }

    public TomlTableNode Node => _table;

    public SourceLocation Location => _table.Location with { Key = _table.Path };

    public bool Has(string key)
    {
        _known.Add(key);
        return _table.TryGet(key, out _);
    }

    public SourceLocation LocationOf(string key)
    {
        _known.Add(key);
        return _table.TryGet(key, out var entry) ? entry.Location : Location with { Key = Path(key) };
    }

    public void Report(string key, string message) => _problems.Add(new Problem(LocationOf(key), message));

    public string? String(string key, bool required = false)
    {
        var entry = Get(key, required);
        if (entry is null)
        {
            return null;
        }
        if (entry.Value is string text)
        {
            return text;
        }
        _problems.Add(new Problem(entry.Location, $"expected a text value in quotes, found {Describe(entry.Value)}"));
        return null;
    }

    public string Choice(string key, IReadOnlyList<string> allowed, string fallback) => TryChoice(key, allowed, fallback) ?? fallback;

    /// <summary>The value of the chosen word, the fallback when the key is absent, or the fallback (problem recorded) when it is not allowed.</summary>
    public T Choice<T>(string key, RigSpelling<T> spelling, T fallback)
        where T : struct, Enum
    {
        ArgumentNullException.ThrowIfNull(spelling);
        return TryChoice(key, spelling.Words, spelling.WordOf(fallback)) is { } word ? spelling.ValueOf(word) : fallback;
    }

    /// <summary>The chosen word, the fallback when the key is absent, or null (problem recorded) when it is not allowed.</summary>
    public string? TryChoice(string key, IReadOnlyList<string> allowed, string fallback)
    {
        var text = String(key);
        if (text is null)
        {
            return fallback;
        }
        if (allowed.Contains(text))
        {
            return text;
        }
        _problems.Add(new Problem(LocationOf(key), $"'{text}' is not one of: {string.Join(", ", allowed)}{Suggest(text, allowed)}"));
        return null;
    }

    /// <summary>Stops unknown-key reports for this table (after a mistake that makes the rest unreadable).</summary>
    public void AcceptAllKeys()
    {
        foreach (var key in _table.Keys)
        {
            _known.Add(key);
        }
    }

    public double? Number(string key, bool required = false, double? min = null, double? max = null)
    {
        var entry = Get(key, required);
        if (entry is null)
        {
            return null;
        }
        if (entry.Value is not double value)
        {
            _problems.Add(new Problem(entry.Location, $"expected a number, found {Describe(entry.Value)}"));
            return null;
        }
        return CheckRange(entry, value, min, max, "");
    }

    /// <summary>A whole number (a count) within [min, max]; a fraction is reported, never rounded.</summary>
    public int? Integer(string key, bool required = false, int? min = null, int? max = null)
    {
        var value = Number(key, required, min, max);
        if (value is { } v && v != Math.Floor(v))
        {
            Report(key, $"{v.ToString(CultureInfo.InvariantCulture)} is not a whole number: a count cannot be fractional");
            return null;
        }
        return value is { } whole ? (int)whole : null;
    }

    public bool Bool(string key, bool fallback)
    {
        var entry = Get(key, false);
        if (entry is null)
        {
            return fallback;
        }
        if (entry.Value is bool value)
        {
            return value;
        }
        _problems.Add(new Problem(entry.Location, $"expected true or false, found {Describe(entry.Value)}"));
        return fallback;
    }

    /// <summary>A quantity written with its unit ("52.5 mm"), returned in SI.</summary>
    public double? Quantity(string key, Dimension dimension, bool required = false, double? minSi = null, double? maxSi = null)
    {
        var entry = Get(key, required);
        if (entry is null)
        {
            return null;
        }
        if (entry.Value is double bare)
        {
            if (dimension == Dimension.Dimensionless)
            {
                return CheckRange(entry, bare, minSi, maxSi, "");
            }
            _problems.Add(new Problem(entry.Location, $"{bare.ToString(CultureInfo.InvariantCulture)} has no unit: write it in quotes with its unit, e.g. \"{bare.ToString(CultureInfo.InvariantCulture)} {UnitText.SiSymbol(dimension)}\""));
            return null;
        }
        if (entry.Value is not string text)
        {
            _problems.Add(new Problem(entry.Location, $"expected a quantity with its unit in quotes, found {Describe(entry.Value)}"));
            return null;
        }
        if (!UnitText.TryToSi(text, dimension, out var si, out var error))
        {
            _problems.Add(new Problem(entry.Location, error));
            return null;
        }
        // A dimensionless SI value has no symbol to print ("1.5", not "1.5 1").
        return CheckRange(entry, si, minSi, maxSi, dimension == Dimension.Dimensionless ? "" : " " + UnitText.SiSymbol(dimension));
    }

    public TableReader? Table(string key, bool required = false)
    {
        var entry = Get(key, required);
        if (entry is null)
        {
            return null;
        }
        if (entry.Value is TomlTableNode node)
        {
            return new TableReader(node, _problems);
        }
        _problems.Add(new Problem(entry.Location, $"expected a table, found {Describe(entry.Value)}"));
        return null;
    }

    public IReadOnlyList<TableReader> Tables(string key)
    {
        var entry = Get(key, false);
        if (entry is null)
        {
            return [];
        }
        switch (entry.Value)
        {
            case List<TomlTableNode> list:
                return list.Select(n => new TableReader(n, _problems)).ToList();
            case List<TomlEntry> items when items.All(i => i.Value is TomlTableNode):
                return items.Select(i => new TableReader((TomlTableNode)i.Value, _problems)).ToList();
            default:
                _problems.Add(new Problem(entry.Location, $"expected a list of tables ([[{key}]] or [{{...}}, ...]), found {Describe(entry.Value)}"));
                return [];
        }
    }

    public IReadOnlyList<TomlEntry>? Array(string key, bool required = false)
    {
        var entry = Get(key, required);
        if (entry is null)
        {
            return null;
        }
        if (entry.Value is List<TomlEntry> items)
        {
            return items;
        }
        _problems.Add(new Problem(entry.Location, $"expected an array [..], found {Describe(entry.Value)}"));
        return null;
    }

    /// <summary>Reports every key of this table that no reader asked for, with the closest known key as a hint.</summary>
    public void RejectUnknownKeys()
    {
        foreach (var key in _table.Keys)
        {
            if (!_known.Contains(key))
            {
                _table.TryGet(key, out var entry);
                _problems.Add(new Problem(entry.Location, $"unknown key '{key}'{Suggest(key, _known)}"));
            }
        }
    }

    private TomlEntry? Get(string key, bool required)
    {
        _known.Add(key);
        if (_table.TryGet(key, out var entry))
        {
            return entry;
        }
        if (required)
        {
            _problems.Add(new Problem(Location with { Key = Path(key) }, $"required key '{key}' is missing from [{(_table.Path.Length == 0 ? "top level" : _table.Path)}]"));
        }
        return null;
    }

    // Six significant digits, ungrouped as the person types them, never E-notation ("2 × 10⁻⁶", not "2E-06").
    private static string Plain(double value) => MeasurementText.Number(value, 6, grouped: false);

    private double? CheckRange(TomlEntry entry, double value, double? min, double? max, string unit)
    {
        if (!double.IsFinite(value))
        {
            _problems.Add(new Problem(entry.Location, "must be a finite number"));
            return null;
        }
        if (value < min || value > max)
        {
            var range = (min, max) switch
            {
                ({ } lo, { } hi) => $"between {Plain(lo)} and {Plain(hi)}{unit}",
                ({ } lo, null) => $"at least {Plain(lo)}{unit}",
                (null, { } hi) => $"at most {Plain(hi)}{unit}",
                _ => "",
            };
            _problems.Add(new Problem(entry.Location, $"{Plain(value)}{unit} is out of range: must be {range}"));
            return null;
        }
        return value;
    }

    private string Path(string key) => _table.Path.Length == 0 ? key : _table.Path + "." + key;

    private static string Describe(object value) => value switch
    {
        string s => $"text \"{s}\"",
        double d => $"number {d.ToString(CultureInfo.InvariantCulture)}",
        bool b => b ? "true" : "false",
        TomlTableNode => "a table",
        List<TomlTableNode> => "an array of tables",
        List<TomlEntry> => "an array",
        _ => value.GetType().Name,
    };

    internal static string Suggest(string typed, IEnumerable<string> known)
    {
        var best = known.Select(k => (Key: k, Distance: EditDistance(typed, k)))
            .Where(c => c.Distance <= Math.Max(2, typed.Length / 3))
            .OrderBy(c => c.Distance).ThenBy(c => c.Key, StringComparer.Ordinal)
            .FirstOrDefault();
        return best.Key is null ? "" : $" (did you mean '{best.Key}'?)";
    }

    private static int EditDistance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++)
        {
            previous[j] = j;
        }
        for (var i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + cost);
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
