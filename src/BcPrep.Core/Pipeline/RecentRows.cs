namespace BcPrep.Pipeline;

/// <summary>
/// Keeps the latest calibrated row blocks of one logger, so that a window found after its rows have streamed past can
/// still be gathered without reading the log again. The blocks go to a store (<see cref="IRowBlockStore"/>): memory,
/// or temporary files when the caller names a folder for them. What is kept is bounded by the store's
/// <see cref="IRowBlockStore.MaxKeptValues"/> (the oldest blocks go first), and by <see cref="DropBefore"/>.
/// </summary>
internal sealed class RecentRows
{
    /// <summary>Values kept at most in memory (96 MB): <see cref="MemoryRowBlocks.DefaultMaxKeptValues"/>.</summary>
    public const long MaxKeptValues = MemoryRowBlocks.DefaultMaxKeptValues;

    private readonly IRowBlockStore _store;
    private readonly long _maxKeptValues;
    private readonly Queue<StoredBlock> _kept = new();
    private long _keptValues;
    private IReadOnlyList<string> _channels = [];
    private double _droppedThroughS = double.NegativeInfinity;
    private double _newestS = double.NegativeInfinity;
    private double[] _searchTimes = [];

    /// <param name="store">Where the blocks are kept; in memory when null. Released (disposed) by <see cref="Release"/>.</param>
    /// <param name="maxKeptValues">Values kept at most; the store's own bound by default.</param>
    public RecentRows(IRowBlockStore? store = null, long? maxKeptValues = null)
    {
        _store = store ?? new MemoryRowBlocks();
        _maxKeptValues = maxKeptValues ?? _store.MaxKeptValues;
    }

    /// <summary>Window channels loaded and not yet reduced, now and at most (a check that windows are loaded one channel at a time).</summary>
    public LoadedChannels Loaded { get; } = new();

    public void Add(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        if (count == 0)
        {
            return;
        }
        if (!ReferenceEquals(channels, _channels) && !channels.SequenceEqual(_channels, StringComparer.Ordinal))
        {
            // Another channel list is another logger: what was kept cannot be replayed beside it.
            DropBefore(double.PositiveInfinity);
            _channels = [.. channels];
        }
        _kept.Enqueue(_store.Write(timeS, valuesSi, count));
        _keptValues += (long)count * (_channels.Count + 1);
        _newestS = timeS[count - 1];
        while (_keptValues > _maxKeptValues && _kept.Count > 1)
        {
            DropOldest();
        }
    }

    private void DropOldest()
    {
        var dropped = _kept.Dequeue();
        _keptValues -= (long)dropped.Count * dropped.Columns;
        _droppedThroughS = dropped.LastS;
        // A gathered window that still reads the block holds its own reference: the block is freed after its load.
        dropped.Release();
    }

    /// <summary>True when every row from <paramref name="window"/>'s start to past its end is kept.</summary>
    public bool Covers(TimeWindow window) => _droppedThroughS < window.StartS && _newestS > window.EndS;

    /// <summary>No row will follow: a window reaching past the last row is covered all the same.</summary>
    public void Complete() => _newestS = double.PositiveInfinity;

    /// <summary>
    /// Lets go of every kept row and of the store: nothing more will be gathered. Windows already gathered still load
    /// their channels; the store frees their blocks as they finish.
    /// </summary>
    public void Release()
    {
        DropBefore(double.PositiveInfinity);
        _store.Dispose();
    }

    /// <summary>Drops the blocks whose last row lies before <paramref name="timeS"/>.</summary>
    public void DropBefore(double timeS)
    {
        while (_kept.Count > 0 && _kept.Peek().LastS < timeS)
        {
            DropOldest();
        }
    }

    /// <summary>
    /// The kept rows inside <paramref name="window"/> (start ≤ t ≤ end), as a window collector would gather them, to be
    /// loaded one channel at a time when its statistics start (<see cref="GatheredWindow"/>). The blocks it reads stay
    /// in the store until every channel is loaded.
    /// </summary>
    public GatheredWindow Gather(TimeWindow window)
    {
        var runs = new List<GatheredWindow.Run>();
        foreach (var kept in _kept)
        {
            if (kept.LastS < window.StartS || kept.FirstS > window.EndS)
            {
                continue;
            }
            int first = 0, end = kept.Count;
            if (kept.FirstS < window.StartS || kept.LastS > window.EndS)
            {
                // A block the window starts or ends in: the same search over its times as the collector makes.
                if (_searchTimes.Length < kept.Count)
                {
                    _searchTimes = new double[kept.Count];
                }
                var times = _searchTimes.AsSpan(0, kept.Count);
                _store.Read(kept, 0, 0, times);
                first = SortedSearch.FirstAtOrAfter(times, window.StartS);
                end = SortedSearch.FirstAfter(times, window.EndS);
            }
            if (end > first)
            {
                kept.AddReference();
                runs.Add(new GatheredWindow.Run(kept, first, end));
            }
        }
        return new GatheredWindow(_store, _channels, runs, Loaded);
    }

    /// <summary>
    /// Hands over each channel's kept samples inside <paramref name="window"/> at once, in exactly sized arrays; the
    /// channels share one array of times, which nobody writes to.
    /// </summary>
    public void Gather(TimeWindow window, Action<string, double[], double[]> onChannel)
    {
        foreach (var channel in Gather(window).Channels)
        {
            channel.Reduce((times, values) =>
            {
                // Each channel's own array, as a collector hands over: the loaded values are the thread's scratch.
                onChannel(channel.Name, times, values.ToArray());
                return 0;
            });
        }
    }
}
