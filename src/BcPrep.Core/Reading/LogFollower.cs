using System.Text;

namespace BcPrep.Reading;

/// <summary>One complete line of a followed log: its file, its 1-based line number there (1 = the header), its text.</summary>
public sealed record FollowedLine(string FileName, long LineNumber, string Text)
{
    public bool IsHeader => LineNumber == 1;
}

/// <summary>
/// Follows the log files a logger is still writing in one folder, by polling. Each <see cref="Poll"/> returns the
/// lines completed since the last one, in order, each exactly once. A line is complete when its newline has been
/// written: a partly written last line is held back (only its bytes, at most <see cref="LogFileReader.MaxRecordBytes"/>)
/// until the rest arrives. When a file whose name sorts after the current one appears (the logger has started a new
/// file), the current file is read to its end once more and the follower moves on; a last line without newline in a
/// file the logger has left is complete then, because nothing will be appended to it.
/// </summary>
/// <remarks>
/// The logger is never hindered: every read opens the file for reading only, shares read, write and delete, and
/// closes it again before <see cref="Poll"/> returns. Memory is the held-back fragment and the lines of one poll, not
/// the day. Files are taken in ordinal name order, which is time order for the usual date-and-counter names of a
/// logger ("common practice"; a logger that names files otherwise must be given them in order to <c>process</c>).
/// </remarks>
public sealed class LogFollower
{
    private readonly string _folder;
    private readonly string _pattern;
    private readonly List<byte> _fragment = new();
    private string? _current;
    private long _offset;
    private long _line;

    /// <param name="folder">Folder the logger writes into.</param>
    /// <param name="pattern">File name pattern of the logger's files, e.g. "*.csv".</param>
    /// <param name="firstFile">File to start with (its name); null starts with the first file in name order.</param>
    public LogFollower(string folder, string pattern, string? firstFile = null)
    {
        _folder = folder;
        _pattern = pattern;
        _current = firstFile is null ? null : Path.GetFileName(firstFile);
    }

    /// <summary>The file being followed (full path), or null before the logger has written any.</summary>
    public string? CurrentFile => _current is null ? null : Path.Combine(_folder, _current);

    /// <summary>Bytes of the current file that end in a complete line (the rest is a line still being written).</summary>
    public long CompleteBytes => _offset - _fragment.Count;

    /// <summary>
    /// Most bytes one <see cref="Poll"/> reads (8 MiB): a follower started late, or fallen behind, takes the backlog in
    /// pieces, so that memory holds one piece of lines, not the backlog.
    /// </summary>
    public const int MaxPollBytes = 8 << 20;

    /// <summary>Whether the last <see cref="Poll"/> stopped at <see cref="MaxPollBytes"/> with more already written.</summary>
    public bool HasMore { get; private set; }

    /// <summary>Files read so far, in order (full paths), including the current one.</summary>
    public IReadOnlyList<string> Files => _files;

    private readonly List<string> _files = new();

    /// <summary>Reads what was completed since the last call; empty when nothing new.</summary>
    /// <exception cref="BcPrepFailure">A followed file shrank or vanished, or a line exceeds the longest record accepted.</exception>
    public IReadOnlyList<FollowedLine> Poll()
    {
        var lines = new List<FollowedLine>();
        if (_current is null)
        {
            _current = Candidates().FirstOrDefault();
            if (_current is null)
            {
                return lines;
            }
            StartFile();
        }
        while (true)
        {
            // Look for a newer file before reading, so that the rest of the current one is known to be final.
            var next = Candidates().FirstOrDefault(name => string.CompareOrdinal(name, _current) > 0);
            HasMore = !ReadNew(lines, finished: next is not null);
            if (next is null || HasMore)
            {
                return lines;
            }
            _current = next;
            StartFile();
        }
    }

    private void StartFile()
    {
        _offset = 0;
        _line = 0;
        _fragment.Clear();
        _files.Add(Path.Combine(_folder, _current!));
    }

    private IEnumerable<string> Candidates() =>
        Directory.EnumerateFiles(_folder, _pattern).Select(Path.GetFileName).OfType<string>().Order(StringComparer.Ordinal);

    /// <summary>Reads what is new of the current file, at most <see cref="MaxPollBytes"/>; true when it reached the file's end.</summary>
    private bool ReadNew(List<FollowedLine> lines, bool finished)
    {
        var path = Path.Combine(_folder, _current!);
        FileStream stream;
        try
        {
            stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete, 1 << 16);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(path), $"the followed log cannot be read any more: {e.Message}");
        }
        bool reachedEnd;
        using (stream)
        {
            if (stream.Length < _offset)
            {
                throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(path),
                    $"the followed log shrank from {_offset} to {stream.Length} bytes: it was rewritten, so rows already reported may have changed");
            }
            stream.Seek(_offset, SeekOrigin.Begin);
            var buffer = new byte[1 << 16];
            var end = Math.Min(stream.Length, _offset + MaxPollBytes);
            int n;
            while (_offset < end && (n = stream.Read(buffer, 0, (int)Math.Min(buffer.Length, end - _offset))) > 0)
            {
                _offset += n;
                var start = 0;
                for (var i = 0; i < n; i++)
                {
                    if (buffer[i] != (byte)'\n')
                    {
                        continue;
                    }
                    Emit(lines, path, buffer.AsSpan(start, i - start));
                    start = i + 1;
                }
                Hold(path, buffer.AsSpan(start, n - start));
            }
            reachedEnd = _offset >= stream.Length;
        }
        if (!reachedEnd)
        {
            return false;
        }
        if (finished && _fragment.Count > 0)
        {
            Emit(lines, path, []);
        }
        return true;
    }

    private void Hold(string path, ReadOnlySpan<byte> bytes)
    {
        if (_fragment.Count + bytes.Length > LogFileReader.MaxRecordBytes)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(path, (int)Math.Min(_line + 1, int.MaxValue)),
                $"the line is longer than {LogFileReader.MaxRecordBytes} bytes without a line end: this is no log row");
        }
        foreach (var b in bytes)
        {
            _fragment.Add(b);
        }
    }

    private void Emit(List<FollowedLine> lines, string path, ReadOnlySpan<byte> tail)
    {
        Hold(path, tail);
        var bytes = System.Runtime.InteropServices.CollectionsMarshal.AsSpan(_fragment);
        if (bytes.Length > 0 && bytes[^1] == (byte)'\r')
        {
            bytes = bytes[..^1];
        }
        _line++;
        var text = Encoding.UTF8.GetString(bytes);
        if (_line == 1 && text.Length > 0 && text[0] == '\uFEFF')
        {
            text = text[1..];
        }
        _fragment.Clear();
        lines.Add(new FollowedLine(Path.GetFileName(path), _line, text));
    }
}
