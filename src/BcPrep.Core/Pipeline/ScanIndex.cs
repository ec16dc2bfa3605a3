using BcPrep.Reading;

namespace BcPrep.Pipeline;

/// <summary>
/// Where each block of rows starts in its file (first time, byte offset, line), recorded during the first pass so
/// that the second pass can seek straight to the detected windows instead of parsing the whole day again. A few
/// bytes per 8192 rows, whatever the size of the day.
/// </summary>
public sealed class ScanIndex
{
    private readonly Dictionary<string, List<(double TimeS, long Offset, long Line)>> _blocks = new(StringComparer.Ordinal);
    private readonly HashSet<string> _unseekable = new(StringComparer.Ordinal);
    private int _seeks;

    /// <summary>How many times a later pass jumped over blocks it did not need.</summary>
    public int Seeks => Volatile.Read(ref _seeks);

    internal void CountSeek() => Interlocked.Increment(ref _seeks);

    internal void Record(LogInput file, LogBlock block, bool canSeek)
    {
        if (!canSeek)
        {
            _unseekable.Add(file.Path);
            return;
        }
        if (!_blocks.TryGetValue(file.Path, out var list))
        {
            list = [];
            _blocks[file.Path] = list;
        }
        list.Add((block.TimeS[0], block.FirstByteOffset, block.LineNumbers[0]));
    }

    /// <summary>The blocks of a file in order, or null when the file must be read from its start.</summary>
    internal IReadOnlyList<(double TimeS, long Offset, long Line)>? Blocks(LogInput file) =>
        _unseekable.Contains(file.Path) ? null : _blocks.GetValueOrDefault(file.Path);
}
