namespace BcPrep.Pipeline;

/// <summary>
/// Where the rows kept back during the read are held (<see cref="RecentRows"/>): in memory
/// (<see cref="MemoryRowBlocks"/>), or in temporary files (<see cref="DiskRowBlocks"/>). A block is written once,
/// column by column (times, then each channel), and read back one column run at a time, from any thread.
/// </summary>
internal interface IRowBlockStore : IDisposable
{
    /// <summary>Values (times and samples) the kept rows may hold in this store before the oldest blocks go.</summary>
    long MaxKeptValues { get; }

    /// <summary>Stores the first <paramref name="count"/> rows; the block returned holds one reference.</summary>
    StoredBlock Write(double[] timeS, IReadOnlyList<double[]> valuesSi, int count);

    /// <summary>
    /// Reads rows <paramref name="first"/> onwards of one column (0: the times, 1 + c: channel c) into
    /// <paramref name="into"/>, which sets how many. The caller holds a reference to the block.
    /// </summary>
    void Read(StoredBlock block, int column, int first, Span<double> into);

    /// <summary>Called by the block when its last reference is given back.</summary>
    void Free(StoredBlock block);
}
