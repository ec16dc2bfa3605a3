using System.Globalization;
using System.Text;

namespace BcPrep.Cli.Output;

/// <summary>CSV rows (RFC 4180 quoting, '\n' line ends); see <see cref="TabularOutput"/>.</summary>
public sealed class CsvOutput(TextWriter output) : TabularOutput
{
    private readonly StringBuilder _text = new(1 << 16);
    private int _columns;
    private int _cell;

    public override void Header(IReadOnlyList<string> columns)
    {
        _columns = columns.Count;
        foreach (var column in columns)
        {
            Text(column);
        }
        EndRow();
    }

    public override void Number(double value)
    {
        Separator();
        if (double.IsFinite(value))
        {
            _text.Append(value.ToString("R", CultureInfo.InvariantCulture));
        }
    }

    public override void Text(string value)
    {
        Separator();
        if (value.AsSpan().IndexOfAny(",\"\r\n") >= 0)
        {
            _text.Append('"').Append(value.Replace("\"", "\"\"", StringComparison.Ordinal)).Append('"');
        }
        else
        {
            _text.Append(value);
        }
    }

    public override void Empty() => Separator();

    public override void EndRow()
    {
        if (_cell != _columns)
        {
            throw new InvalidOperationException($"a row has {_cell} cells but the header has {_columns}");
        }
        _text.Append('\n');
        _cell = 0;
    }

    public override void Flush()
    {
        output.Write(_text);
        _text.Clear();
    }

    private void Separator()
    {
        if (_cell++ > 0)
        {
            _text.Append(',');
        }
    }
}
