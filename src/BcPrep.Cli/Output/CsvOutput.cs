using BcPrep.Writing;

namespace BcPrep.Cli.Output;

/// <summary>CSV rows (RFC 4180 quoting, '\n' line ends); see <see cref="TabularOutput"/>.</summary>
/// <remarks>
/// `calibrate` writes tens of millions of numbers a day, so a number is formatted straight into one reusable character
/// buffer (<see cref="RoundTripNumber"/>: the same characters as <c>ToString("R", CultureInfo.InvariantCulture)</c>,
/// about five times faster than the runtime's conversion and without a string per number), and the buffer goes to
/// the writer once per block of rows.
/// </remarks>
public sealed class CsvOutput(TextWriter output) : TabularOutput
{
    /// <summary>Room for any double in "R" form and its separator.</summary>
    private const int NumberRoom = RoundTripNumber.MaxChars + 1;

    private char[] _text = new char[1 << 16];
    private int _length;
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
            Reserve(NumberRoom);
            _length += RoundTripNumber.Format(value, _text.AsSpan(_length));
        }
    }

    public override void Text(string value)
    {
        Separator();
        if (value.AsSpan().IndexOfAny(",\"\r\n") >= 0)
        {
            Append("\"");
            Append(value.Replace("\"", "\"\"", StringComparison.Ordinal));
            Append("\"");
        }
        else
        {
            Append(value);
        }
    }

    public override void Empty() => Separator();

    /// <summary>
    /// A writer for the same columns whose rows stay in its own buffer until <see cref="Append(CsvOutput)"/> moves
    /// them here: rows can be formatted on several threads, one part each, and written in order.
    /// </summary>
    public CsvOutput Part() => new(TextWriter.Null) { _columns = _columns };

    /// <summary>
    /// Writes what this writer holds, then the complete rows of <paramref name="part"/> (see <see cref="Part"/>),
    /// straight from the part's buffer, and empties it.
    /// </summary>
    public void Write(CsvOutput part)
    {
        ArgumentNullException.ThrowIfNull(part);
        if (part._cell != 0)
        {
            throw new InvalidOperationException("a part ends inside a row");
        }
        if (_cell != 0)
        {
            throw new InvalidOperationException("a part is written inside a row");
        }
        Flush();
        output.Write(part._text, 0, part._length);
        part._length = 0;
    }

    public override void EndRow()
    {
        if (_cell != _columns)
        {
            throw new InvalidOperationException($"a row has {_cell} cells but the header has {_columns}");
        }
        Append("\n");
        _cell = 0;
    }

    public override void Flush()
    {
        output.Write(_text, 0, _length);
        _length = 0;
    }

    private void Separator()
    {
        if (_cell++ > 0)
        {
            Reserve(1);
            _text[_length++] = ',';
        }
    }

    private void Append(ReadOnlySpan<char> chars)
    {
        Reserve(chars.Length);
        chars.CopyTo(_text.AsSpan(_length));
        _length += chars.Length;
    }

    /// <summary>Grows the buffer (never shrinks it) so that <paramref name="room"/> more characters fit.</summary>
    private void Reserve(int room)
    {
        if (_length + room > _text.Length)
        {
            Array.Resize(ref _text, Math.Max(2 * _text.Length, _length + room));
        }
    }
}
