namespace BcPrep.Pipeline;

/// <summary>
/// Kept row blocks in memory, the store of library use and of a run given no folder for temporary files. A freed
/// block's arrays are reused for the next rows, so a steady read allocates only as many blocks as it keeps at once.
/// </summary>
internal sealed class MemoryRowBlocks : IRowBlockStore
{
    /// <summary>
    /// Values (times and samples) kept at most: 12 M doubles, 96 MB, e.g. 45 min of 13 channels at 200 Hz or 11 min
    /// of 17 channels at 1 kHz. A window that starts before what is left is read again instead.
    /// </summary>
    public const long DefaultMaxKeptValues = 12_000_000;

    private readonly object _gate = new();
    private readonly Stack<double[][]> _free = new();
    private bool _disposed;

    public long MaxKeptValues => DefaultMaxKeptValues;

    public StoredBlock Write(double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        var columns = valuesSi.Count + 1;
        double[][]? arrays = null;
        lock (_gate)
        {
            if (_free.Count > 0 && _free.Peek().Length != columns)
            {
                _free.Clear(); // another logger's channel list: its blocks do not fit
            }
            if (_free.Count > 0 && _free.Peek()[0].Length >= count)
            {
                arrays = _free.Pop();
            }
        }
        arrays ??= [.. Enumerable.Range(0, columns).Select(_ => new double[Math.Max(count, timeS.Length)])];
        Array.Copy(timeS, arrays[0], count);
        for (var c = 0; c < valuesSi.Count; c++)
        {
            Array.Copy(valuesSi[c], arrays[c + 1], count);
        }
        return new StoredBlock(this, columns, count, timeS[0], timeS[count - 1], arrays);
    }

    public void Read(StoredBlock block, int column, int first, Span<double> into) =>
        ((double[][])block.Location)[column].AsSpan(first, into.Length).CopyTo(into);

    public void Free(StoredBlock block)
    {
        lock (_gate)
        {
            if (!_disposed)
            {
                _free.Push((double[][])block.Location);
            }
        }
    }

    /// <summary>No more rows will be written: lets go of the arrays kept for reuse and of each block as it is freed.</summary>
    public void Dispose()
    {
        lock (_gate)
        {
            _disposed = true;
            _free.Clear();
        }
    }
}
