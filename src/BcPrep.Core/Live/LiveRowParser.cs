using System.Globalization;
using System.Text;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Live;

/// <summary>
/// Turns the complete lines of a followed log into times and raw values of the wanted columns, with the rules of
/// <see cref="LogFileReader"/> (separator sniffed from the header unless the rig file sets it, decimal separator,
/// seconds or ISO-8601 times, blank and "NaN" cells as missing). A bad cell stops with its file, line and column.
/// Each file's header (line 1) is read again, so a logger that reorders columns in its next file is followed.
/// </summary>
public sealed class LiveRowParser
{
    private readonly LogFormat _format;
    private readonly IReadOnlyList<string> _columns;
    private readonly NumberFormatInfo _numbers;
    private readonly IsoTimestamp.InOrder _stamps = new();
    private char _separator;
    private int _timeIndex = -1;
    private int[] _indices = [];
    private string[] _header = [];

    public LiveRowParser(LogFormat format, IReadOnlyList<string> columns)
    {
        _format = format;
        _columns = columns;
        _numbers = new NumberFormatInfo { NumberDecimalSeparator = format.DecimalSeparator.ToString(), NumberGroupSeparator = "" };
    }

    /// <summary>Position of a wanted column in the raw values.</summary>
    public int ColumnOf(string column)
    {
        for (var i = 0; i < _columns.Count; i++)
        {
            if (_columns[i] == column)
            {
                return i;
            }
        }
        throw new ArgumentException($"column '{column}' was not asked for", nameof(column));
    }

    /// <summary>Reads a header line, or a data row into <paramref name="raw"/> (one value per wanted column); false for a header.</summary>
    public bool TryRow(FollowedLine line, double[] raw, out double timeS)
    {
        timeS = double.NaN;
        if (line.IsHeader)
        {
            ReadHeader(line);
            return false;
        }
        if (_timeIndex < 0)
        {
            throw Fail(line, null, "a row before any header");
        }
        var cells = line.Text.Split(_separator);
        if (cells.Length != _header.Length)
        {
            // Named at the first column the row lacks, or the first one it has beyond the header.
            var column = Math.Min(cells.Length, _header.Length);
            throw Fail(line, column, cells.Length < _header.Length
                ? $"the row has {cells.Length} fields but the header has {_header.Length}: it ends before column {column + 1} ('{_header[column]}'); a logger that was stopped mid-row?"
                : $"the row has {cells.Length} fields but the header has {_header.Length}: column {column + 1} is beyond the header");
        }
        timeS = ParseTime(line, cells[_timeIndex].Trim());
        for (var c = 0; c < _indices.Length; c++)
        {
            raw[c] = ParseCell(line, _indices[c], cells[_indices[c]].Trim());
        }
        return true;
    }

    private void ReadHeader(FollowedLine line)
    {
        _separator = _format.Separator ?? new[] { ',', ';', '\t' }
            .Where(c => !(c == ',' && _format.DecimalSeparator == ','))
            .OrderByDescending(c => line.Text.Count(ch => ch == c))
            .First();
        _header = line.Text.Split(_separator).Select(h => h.Trim()).ToArray();
        _timeIndex = Array.IndexOf(_header, _format.TimeColumn);
        if (_timeIndex < 0)
        {
            throw Fail(line, null, $"no time column '{_format.TimeColumn}' in the header");
        }
        _indices = _columns.Select(c => Array.IndexOf(_header, c)).ToArray();
        var missing = _columns.Where((_, i) => _indices[i] < 0).ToList();
        if (missing.Count > 0)
        {
            throw Fail(line, null, $"column(s) {string.Join(", ", missing.Select(m => $"'{m}'"))} named in the rig file not in the header");
        }
    }

    private double ParseTime(FollowedLine line, string cell)
    {
        if (_format.TimeFormat == TimeFormat.Seconds)
        {
            if (double.TryParse(cell, NumberStyles.Float, _numbers, out var s) && double.IsFinite(s))
            {
                return s;
            }
            throw Fail(line, _timeIndex, $"'{cell}' is not a time in seconds");
        }
        if (_stamps.TryParseSeconds(Encoding.UTF8.GetBytes(cell), out var t))
        {
            return t;
        }
        throw Fail(line, _timeIndex, $"'{cell}' is not an ISO-8601 time");
    }

    private double ParseCell(FollowedLine line, int index, string cell)
    {
        if (cell.Length == 0 || cell is "NaN" or "nan" or "NA")
        {
            return double.NaN;
        }
        if (double.TryParse(cell, NumberStyles.Float, _numbers, out var v) && double.IsFinite(v))
        {
            return v;
        }
        throw Fail(line, index, $"'{cell}' is not a number");
    }

    private BcPrepFailure Fail(FollowedLine line, int? index, string message) =>
        new(FailureKind.InputData, new SourceLocation(line.FileName, (int)Math.Min(line.LineNumber, int.MaxValue), index + 1,
            index is { } i && i < _header.Length ? _header[i] : null), message);
}
