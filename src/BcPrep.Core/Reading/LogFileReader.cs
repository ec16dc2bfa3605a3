using System.Globalization;
using System.Runtime.CompilerServices;
using System.Text;
using BcPrep.Rig;
using CsvHelper;

namespace BcPrep.Reading;

/// <summary>
/// Streams one delimited log file in blocks of rows, keeping only the time column and the requested columns.
/// Memory does not grow with the file. Every bad cell stops the read with file, line and column named.
/// </summary>
public sealed class LogFileReader : IDisposable
{
    /// <summary>Longest record accepted (bytes): guards against a file that is one enormous line.</summary>
    public const int MaxRecordBytes = 1 << 20;

    /// <summary>
    /// Longest stretch of time one log may cover (s): 48 h. The per-second block means and the detection arrays grow
    /// with the time covered, not with the rows, so a logger clock glitch (a row dated a century later) would
    /// otherwise make memory grow without bound. Common practice: a test day is hours long; a longer run is split.
    /// </summary>
    public const double MaxDaySpanS = 48 * 3600.0;

    private readonly LogInput _input;
    private readonly LogFormat _format;
    private readonly char _separator;
    private CsvReader _csv;
    private long _byteBase;
    private long _lineBase;
    private readonly NumberFormatInfo _numbers;
    private readonly byte _decimalSeparator;
    private readonly int _timeIndex;
    private readonly int[] _columnIndices;
    private readonly string[] _columnNames;
    private readonly int _headerCount;
    private double _lastTime = double.NegativeInfinity;
    private readonly IsoTimestamp.InOrder _stamps = new();
    private long _lastLine;
    private double _firstTime = double.NaN;
    private long _firstLine;

    public LogFileReader(LogInput input, LogFormat format, IReadOnlyList<string> columns)
    {
        _input = input;
        _format = format;
        _numbers = new NumberFormatInfo { NumberDecimalSeparator = format.DecimalSeparator.ToString(), NumberGroupSeparator = "" };
        // A separator outside ASCII never matches a single UTF-8 byte, so such a format always takes the general parser.
        _decimalSeparator = format.DecimalSeparator < 0x80 ? (byte)format.DecimalSeparator : (byte)0;
        var stream = input.Open();
        CanSeek = stream is not CheckedGzipStream && !StartsWithUtf16Mark(input);
        _separator = format.Separator ?? SniffSeparator(stream, format.DecimalSeparator);
        _csv = CsvReader.Create(stream, Options(hasHeader: true), leaveOpen: false);
        string[] header;
        try
        {
            header = _csv.Headers.Select(h => h.Trim()).ToArray();
        }
        catch (Exception e) when (e is CsvFormatException or InvalidDataException or DecoderFallbackException)
        {
            _csv.Dispose();
            throw Fail(1, null, "the header row cannot be read: " + e.Message);
        }
        if (header.Length == 0 || header.All(string.IsNullOrWhiteSpace))
        {
            _csv.Dispose();
            throw Fail(1, null, "the file is empty: no header row");
        }
        Header = header;
        _headerCount = header.Length;
        if (DuplicateColumn(header) is { } duplicate)
        {
            _csv.Dispose();
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(input.DisplayName, 1, duplicate.Second + 1, header[duplicate.First]),
                $"'{header[duplicate.First]}' appears twice in the header (columns {duplicate.First + 1} and {duplicate.Second + 1}): which one is the channel is a guess, so rename or remove one");
        }
        _timeIndex = Array.IndexOf(header, format.TimeColumn);
        if (_timeIndex < 0)
        {
            _csv.Dispose();
            throw Fail(1, null, $"no time column '{format.TimeColumn}' in the header ({string.Join(", ", header.Take(8))}{(header.Length > 8 ? ", …" : "")})");
        }
        _columnNames = columns.ToArray();
        _columnIndices = columns.Select(c => Array.IndexOf(header, c)).ToArray();
        var missing = _columnNames.Where((_, i) => _columnIndices[i] < 0).ToList();
        if (missing.Count > 0)
        {
            _csv.Dispose();
            throw Fail(1, null, $"column{(missing.Count > 1 ? "s" : "")} {string.Join(", ", missing.Select(m => $"'{m}'"))} named in the rig file {(missing.Count > 1 ? "are" : "is")} not in the header");
        }
    }

    public IReadOnlyList<string> Header { get; }

    public string Name => _input.DisplayName;

    /// <summary>Bytes of the (decompressed) log read so far: where the current record starts.</summary>
    public long BytesRead => _byteBase + _csv.ByteOffset;

    /// <summary>
    /// Whether <see cref="SeekTo"/> works: a plain file whose byte offsets are file positions (not gzip, whose
    /// offsets count decompressed bytes, nor UTF-16, whose offsets count its UTF-8 form).
    /// </summary>
    public bool CanSeek { get; }

    /// <summary>Line number of the last row read (0 before any).</summary>
    public long LastLine => _lastLine;

    /// <summary>
    /// Continues reading at a row recorded earlier from <see cref="LogBlock.FirstByteOffset"/> and its line (the
    /// header is not read again; column positions stay those of the header).
    /// </summary>
    public void SeekTo(long byteOffset, long lineNumber)
    {
        if (!CanSeek)
        {
            throw new InvalidOperationException("this log cannot be read from an offset");
        }
        _csv.Dispose();
        var stream = _input.OpenRaw();
        stream.Seek(byteOffset, SeekOrigin.Begin);
        _csv = CsvReader.Create(stream, Options(hasHeader: false), leaveOpen: false);
        _byteBase = byteOffset;
        _lineBase = lineNumber - 1;
        _lastTime = double.NegativeInfinity;
    }

    private CsvReaderOptions Options(bool hasHeader) => new()
    {
        Separator = _separator,
        HasHeader = hasHeader,
        TrackLineNumbers = true,
        MaxRecordSize = MaxRecordBytes,
        FormatProvider = _numbers,
    };

    private static bool StartsWithUtf16Mark(LogInput input)
    {
        using var file = input.OpenRaw(FileOptions.None);
        Span<byte> mark = stackalloc byte[2];
        return file.ReadAtLeast(mark, 2, throwOnEndOfStream: false) == 2 && ((mark[0] == 0xFF && mark[1] == 0xFE) || (mark[0] == 0xFE && mark[1] == 0xFF));
    }

    /// <summary>Reads header names only (to group files by logger before reading them).</summary>
    public static IReadOnlyList<string> ReadHeader(LogInput input, LogFormat format)
    {
        using var reader = new LogFileReader(input, format, []);
        return reader.Header;
    }

    /// <summary>Fills <paramref name="block"/> with up to its capacity of rows; false at end of file.</summary>
    public bool ReadBlock(LogBlock block)
    {
        var n = 0;
        while (n < block.Capacity && Next())
        {
            var line = _lineBase + _csv.LineNumber;
            if (n == 0)
            {
                block.FirstByteOffset = BytesRead;
            }
            if (_csv.FieldCount != _headerCount)
            {
                throw Fail(line, null, $"the row has {_csv.FieldCount} fields but the header has {_headerCount}");
            }
            var time = ParseTime(line);
            if (!(time > _lastTime))
            {
                var what = time == _lastTime ? "repeats" : "goes back from";
                throw Fail(line, _timeIndex, $"the time {Format(time)} {what} the previous row's {Format(_lastTime)} (line {_lastLine}): timestamps must increase");
            }
            if (double.IsNaN(_firstTime))
            {
                _firstTime = time;
                _firstLine = line;
            }
            else if (time - _firstTime > MaxDaySpanS)
            {
                throw Fail(line, _timeIndex,
                    $"the time '{Truncate(Encoding.UTF8.GetString(_csv.GetSpan(_timeIndex)))}' lies {Hours(time - _firstTime)} h after the file's first row (line {_firstLine}) and {Hours(time - _lastTime)} h after the previous row (line {_lastLine}); a log may span at most {Hours(MaxDaySpanS)} h (a logger clock glitch?)");
            }
            _lastTime = time;
            _lastLine = line;
            block.TimeS[n] = time;
            block.LineNumbers[n] = line;
            for (var c = 0; c < _columnIndices.Length; c++)
            {
                block.Columns[c][n] = ParseCell(_columnIndices[c], line);
            }
            n++;
        }
        block.Count = n;
        return n > 0;
    }

    public void Dispose() => _csv.Dispose();

    private bool Next()
    {
        try
        {
            return _csv.Read();
        }
        catch (CsvFormatException e)
        {
            // Before the first row the header is line 1, so the record that failed starts on line 2 at the earliest.
            throw Fail(Math.Max(_lastLine, 1) + 1, null, "malformed row: " + e.Message);
        }
        catch (Exception e) when (e is InvalidDataException or IOException)
        {
            throw Fail(Math.Max(_lastLine, 1) + 1, null, "the file cannot be read: " + e.Message);
        }
    }

    private double ParseCell(int index, long line)
    {
        // A logger's plain decimals take the exact fast path (the same bits as the parsers below, see ShortDecimal).
        if (_decimalSeparator != 0 && ShortDecimal.TryParse(_csv.GetSpan(index), _decimalSeparator, out var value))
        {
            return value;
        }
        return ParseCellGenerally(index, line);
    }

    /// <summary>
    /// Any other cell. Kept out of <see cref="ParseCell"/>, which runs for every cell: with CsvHelper's parser inlined
    /// there, every call paid for the larger method's set-up although nearly every cell takes the fast path.
    /// </summary>
    [MethodImpl(MethodImplOptions.NoInlining)]
    private double ParseCellGenerally(int index, long line)
    {
        // CsvHelper's own number parser is about three times faster than double.TryParse on the UTF-8 span.
        if (_csv.TryParse<double>(index, out var value))
        {
            if (double.IsFinite(value))
            {
                return value;
            }
            if (double.IsInfinity(value))
            {
                throw Fail(line, index, "infinite value: a logger writes this for an overflow, which is no measurement");
            }
        }
        var span = _csv.GetSpan(index);
        if (IsBlank(span))
        {
            return double.NaN;
        }
        if (double.TryParse(span, NumberStyles.Float, _numbers, out value) && double.IsFinite(value))
        {
            return value;
        }
        throw Fail(line, index, $"'{Truncate(Encoding.UTF8.GetString(span))}' is not a number");
    }

    private double ParseTime(long line)
    {
        if (_format.TimeFormat == TimeFormat.Seconds)
        {
            if (_csv.TryParse<double>(_timeIndex, out var seconds) && double.IsFinite(seconds))
            {
                return seconds;
            }
            var span = _csv.GetSpan(_timeIndex);
            if (double.TryParse(span, NumberStyles.Float, _numbers, out seconds) && double.IsFinite(seconds))
            {
                return seconds;
            }
            throw Fail(line, _timeIndex, $"'{Truncate(Encoding.UTF8.GetString(span))}' is not a time in seconds");
        }
        var stamp = _csv.GetSpan(_timeIndex);
        if (_stamps.TryParseSeconds(stamp, out var time))
        {
            return time;
        }
        throw Fail(line, _timeIndex, $"'{Truncate(Encoding.UTF8.GetString(stamp))}' is not an ISO-8601 time");
    }

    private static bool IsBlank(ReadOnlySpan<byte> span)
    {
        var trimmed = span.Trim((byte)' ');
        return trimmed.Length == 0 || trimmed.SequenceEqual("NaN"u8) || trimmed.SequenceEqual("nan"u8) || trimmed.SequenceEqual("NA"u8);
    }

    private BcPrepFailure Fail(long line, int? fieldIndex, string message)
    {
        var key = fieldIndex is { } i && Header is { } h && i < h.Count ? h[i] : null;
        return new BcPrepFailure(FailureKind.InputData, new SourceLocation(_input.DisplayName, (int)Math.Min(line, int.MaxValue), fieldIndex + 1, key), message);
    }

    private static char SniffSeparator(Stream stream, char decimalSeparator)
    {
        // Count candidates in the first line; a decimal comma rules the comma out.
        if (!stream.CanSeek)
        {
            return decimalSeparator == ',' ? ';' : ',';
        }
        var buffer = new byte[4096];
        var n = stream.Read(buffer, 0, buffer.Length);
        stream.Seek(0, SeekOrigin.Begin);
        var firstLine = Encoding.UTF8.GetString(buffer, 0, n).Split('\n')[0];
        var counts = new[] { ',', ';', '\t' }
            .Where(c => !(c == ',' && decimalSeparator == ','))
            .Select(c => (Separator: c, Count: firstLine.Count(ch => ch == c)))
            .OrderByDescending(x => x.Count)
            .ToList();
        return counts[0].Count > 0 ? counts[0].Separator : ',';
    }

    /// <summary>The first pair of equal non-blank header names (0-based column indices), or null.</summary>
    private static (int First, int Second)? DuplicateColumn(string[] header)
    {
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < header.Length; i++)
        {
            if (header[i].Length == 0)
            {
                continue;
            }
            if (seen.TryGetValue(header[i], out var first))
            {
                return (first, i);
            }
            seen[header[i]] = i;
        }
        return null;
    }

    public static string Hours(double seconds) => (seconds / 3600).ToString(seconds < 36000 ? "0.##" : "0", CultureInfo.InvariantCulture);

    private static string Format(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Truncate(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
