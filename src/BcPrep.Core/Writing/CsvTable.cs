using System.Globalization;
using System.Text;

namespace BcPrep.Writing;

/// <summary>
/// A CSV table of our own layout: optional '#' comment lines (conventions, provenance), one header row whose
/// names carry their units in brackets, then rows. Numbers are written round-trippable in invariant culture.
/// </summary>
public sealed class CsvTable
{
    private readonly List<string> _comments = [];
    private readonly List<string> _header;
    private readonly List<string[]> _rows = [];

    public CsvTable(IEnumerable<string> header) => _header = header.ToList();

    public int ColumnCount => _header.Count;

    public CsvTable Comment(string text)
    {
        _comments.Add(text);
        return this;
    }

    public void Add(params object?[] cells)
    {
        if (cells.Length != _header.Count)
        {
            throw new ArgumentException($"row has {cells.Length} cells, header {_header.Count}", nameof(cells));
        }
        _rows.Add(cells.Select(Format).ToArray());
    }

    /// <summary>Appends the rows of a table with the same header (to stack per-point tables under one header); comments are not copied.</summary>
    public CsvTable Append(CsvTable other)
    {
        ArgumentNullException.ThrowIfNull(other);
        if (!other._header.SequenceEqual(_header, StringComparer.Ordinal))
        {
            throw new ArgumentException("tables with different headers cannot be stacked", nameof(other));
        }
        _rows.AddRange(other._rows);
        return this;
    }

    public static string Number(double value) => double.IsFinite(value) ? value.ToString("R", CultureInfo.InvariantCulture) : "";

    public static string Escape(string text) =>
        text.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : text;

    public override string ToString()
    {
        var text = new StringBuilder();
        foreach (var comment in _comments)
        {
            text.Append("# ").Append(comment).Append('\n');
        }
        text.Append(string.Join(',', _header.Select(Escape))).Append('\n');
        foreach (var row in _rows)
        {
            text.Append(string.Join(',', row)).Append('\n');
        }
        return text.ToString();
    }

    private static string Format(object? cell) => cell switch
    {
        null => "",
        double d => Number(d),
        int i => i.ToString(CultureInfo.InvariantCulture),
        long l => l.ToString(CultureInfo.InvariantCulture),
        bool b => b ? "pass" : "warn",
        string s => Escape(s),
        _ => Escape(Convert.ToString(cell, CultureInfo.InvariantCulture) ?? ""),
    };
}
