namespace BcPrep.Pipeline;

/// <summary>
/// One calibrated row block written to an <see cref="IRowBlockStore"/>: how many rows, its first and last time, and
/// where the store put it. Counted references keep it readable: the kept rows hold one while the block is kept, and
/// each gathered window that reads it holds one until every channel of the window is loaded; at zero the store frees
/// it (a block in memory is reused, a temporary file is deleted once none of its blocks is left).
/// </summary>
internal sealed class StoredBlock
{
    private readonly IRowBlockStore _store;
    private int _references = 1;

    public StoredBlock(IRowBlockStore store, int columns, int count, double firstS, double lastS, object location)
    {
        _store = store;
        Columns = columns;
        Count = count;
        FirstS = firstS;
        LastS = lastS;
        Location = location;
    }

    /// <summary>Columns written: the times, then each channel.</summary>
    public int Columns { get; }

    public int Count { get; }

    public double FirstS { get; }

    public double LastS { get; }

    /// <summary>Where the store keeps the block; only the store that wrote it reads it.</summary>
    public object Location { get; }

    /// <summary>Takes one more reference; only while the caller already holds one, so a freed block is never revived.</summary>
    public void AddReference() => Interlocked.Increment(ref _references);

    /// <summary>Gives one reference back; the last one frees the block in its store.</summary>
    public void Release()
    {
        if (Interlocked.Decrement(ref _references) == 0)
        {
            _store.Free(this);
        }
    }
}
