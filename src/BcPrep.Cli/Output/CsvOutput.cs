using System.Text;
using BcPrep.Writing;

namespace BcPrep.Cli.Output;

/// <summary>CSV rows (RFC 4180 quoting, '\n' line ends); see <see cref="TabularOutput"/>.</summary>
/// <remarks>
/// `calibrate` writes tens of millions of numbers a day, so a number is formatted straight into one reusable buffer
/// of UTF-8 bytes (<see cref="RoundTripNumber"/>: the same characters as <c>ToString("R", CultureInfo.InvariantCulture)</c>,
/// several times faster than the runtime's conversion and without a string per number), and the buffer goes out
/// once per block of rows. When the output is a UTF-8 <see cref="StreamWriter"/> without a byte-order mark (standard
/// output), the bytes go to its stream as they are, after whatever the writer still holds: the gigabyte of text a
/// long day makes is then neither widened to UTF-16 nor encoded back. Any other writer gets the decoded characters.
/// </remarks>
public sealed class CsvOutput(TextWriter output) : TabularOutput
{
    /// <summary>Room for any double in "R" form and its separator, and for the words the formatter moves.</summary>
    private const int NumberRoom = RoundTripNumber.AsciiRoom + 1;

    /// <summary>What one number of a row takes at most: its characters and a separator.</summary>
    private const int CellChars = RoundTripNumber.MaxChars + 1;

    private static readonly UTF8Encoding Utf8 = new(false);

    private readonly Stream? _bytesOut = output is StreamWriter { Encoding: UTF8Encoding encoding } writer && encoding.Preamble.Length == 0 ? writer.BaseStream : null;
    private byte[] _text = new byte[1 << 16];
    private char[] _chars = [];
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
            _length += RoundTripNumber.FormatAscii(value, _text.AsSpan(_length));
        }
    }

    /// <summary>
    /// A whole row of numbers, as <see cref="Number"/> for each cell and <see cref="EndRow"/> (a non-finite value is
    /// an empty cell), with one check of room and columns for the row instead of one per cell.
    /// </summary>
    public void Row(ReadOnlySpan<double> cells)
    {
        if (_cell != 0)
        {
            throw new InvalidOperationException("a row is written inside a row");
        }
        if (cells.Length != _columns)
        {
            throw new InvalidOperationException($"a row has {cells.Length} cells but the header has {_columns}");
        }
        Reserve((cells.Length * CellChars) + NumberRoom);
        var text = _text.AsSpan();
        var length = _length;
        for (var i = 0; i < cells.Length; i++)
        {
            if (i > 0)
            {
                text[length++] = (byte)',';
            }
            if (double.IsFinite(cells[i]))
            {
                length += RoundTripNumber.FormatAscii(cells[i], text[length..]);
            }
        }
        text[length++] = (byte)'\n';
        _length = length;
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
    /// A writer for the same columns whose rows stay in its own buffer until <see cref="Write(CsvOutput)"/> moves
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
        WriteOut(part._text, part._length);
        part._length = 0;
    }

    public override void EndRow()
    {
        if (_cell != _columns)
        {
            throw new InvalidOperationException($"a row has {_cell} cells but the header has {_columns}");
        }
        Reserve(1);
        _text[_length++] = (byte)'\n';
        _cell = 0;
    }

    public override void Flush()
    {
        WriteOut(_text, _length);
        _length = 0;
    }

    /// <summary>Whole rows only, so no character is split between two writes.</summary>
    private void WriteOut(byte[] bytes, int length)
    {
        if (length == 0)
        {
            return;
        }
        if (_bytesOut is not null)
        {
            // What the writer still holds (text written to it directly) goes first.
            output.Flush();
            _bytesOut.Write(bytes, 0, length);
            return;
        }
        var count = Utf8.GetCharCount(bytes, 0, length);
        if (_chars.Length < count)
        {
            _chars = new char[Math.Max(count, 2 * _chars.Length)];
        }
        Utf8.GetChars(bytes, 0, length, _chars, 0);
        output.Write(_chars, 0, count);
    }

    private void Separator()
    {
        if (_cell++ > 0)
        {
            Reserve(1);
            _text[_length++] = (byte)',';
        }
    }

    private void Append(string chars)
    {
        Reserve(Utf8.GetMaxByteCount(chars.Length));
        _length += Utf8.GetBytes(chars, _text.AsSpan(_length));
    }

    /// <summary>Grows the buffer (never shrinks it) so that <paramref name="room"/> more bytes fit.</summary>
    private void Reserve(int room)
    {
        if (_length + room > _text.Length)
        {
            Array.Resize(ref _text, Math.Max(2 * _text.Length, _length + room));
        }
    }
}
