namespace BcPrep.Pipeline;

/// <summary>
/// A window's kept rows, loaded one channel at a time: the statistics thread that takes a channel loads its samples
/// (and the window's times, loaded once and shared by its channels while any of them is unfinished) when it starts,
/// and lets them go when it is done, so that only the channels being reduced are in memory, not the whole window
/// (17 channels of a 17 min window at 1 kHz are 140 MB). The samples are those the collector would gather, in the
/// same order; the blocks they come from stay in the store until every channel is finished, so that a channel whose
/// reduction fails can be loaded again (<see cref="LoadAgain"/>).
/// </summary>
internal sealed class GatheredWindow
{
    private readonly IRowBlockStore _store;
    private readonly IReadOnlyList<Run> _runs;
    private readonly LoadedChannels _loaded;
    private readonly object _gate = new();
    private readonly int _count;
    private double[]? _timesS;
    private int _unfinished;

    /// <param name="store">The store the blocks are in.</param>
    /// <param name="channels">The channels, in the order of the blocks' columns after the times.</param>
    /// <param name="runs">Each block's rows inside the window, in time order; each holds a reference to its block, given back once every channel is finished.</param>
    /// <param name="loaded">Counts the channels loaded and not yet reduced.</param>
    public GatheredWindow(IRowBlockStore store, IReadOnlyList<string> channels, IReadOnlyList<Run> runs, LoadedChannels loaded)
    {
        _store = store;
        _runs = runs;
        _loaded = loaded;
        _count = runs.Sum(r => r.End - r.First);
        _unfinished = channels.Count;
        Channels = [.. channels.Select((name, c) => new GatheredChannel(this, name, c))];
        if (channels.Count == 0)
        {
            ReleaseRuns();
        }
    }

    /// <summary>One block's rows [First, End) inside the window.</summary>
    public sealed record Run(StoredBlock Block, int First, int End);

    public IReadOnlyList<GatheredChannel> Channels { get; }

    /// <summary>Samples per channel.</summary>
    public int Count => _count;

    /// <summary>
    /// Loads channel <paramref name="channel"/> and the window's times; each channel is loaded once. The values are
    /// the calling thread's scratch, valid until its next load: a caller that keeps them copies them, and may write over
    /// them (<see cref="GatheredChannel"/>).
    /// </summary>
    internal (double[] TimesS, Memory<double> Values) Load(int channel)
    {
        double[] times;
        lock (_gate)
        {
            times = _timesS ??= ReadColumn(0, GC.AllocateUninitializedArray<double>(_count));
        }
        // The values go into the thread's scratch, of the longest window's length so far, handed on as the first
        // Count elements: a fresh 8 MB array per channel of a 17-minute window at 1 kHz was large-object garbage
        // that piled up between full collections, and so was an array of each new window's exact length (every
        // window has its own; on the 8 h day at 1 kHz, two threads × about 20 windows × 10 MB). The reduction runs
        // on this thread and keeps no reference to it.
        var scratch = ThreadScratch.Rent(ScratchSlots.LoadedValues, _count);
        ReadColumn(channel + 1, scratch);
        _loaded.Add();
        return (times, scratch.AsMemory(0, _count));
    }

    /// <summary>
    /// Channel <paramref name="channel"/>'s samples loaded again, into an array of their own, for a channel whose
    /// reduction failed after writing over its loaded samples; only before that channel is finished.
    /// </summary>
    internal double[] LoadAgain(int channel) => ReadColumn(channel + 1, GC.AllocateUninitializedArray<double>(_count));

    /// <summary>
    /// Windows of at least this many samples (4 MB of times; 8.7 min at 1 kHz) are followed by a full collection
    /// when their last channel is done (<see cref="Finish"/>).
    /// </summary>
    internal const int CollectFrom = 1 << 19;

    /// <summary>A channel loaded (or failed to load) is done with: the times and the blocks go with the last one.</summary>
    internal void Finish(bool loaded)
    {
        if (loaded)
        {
            _loaded.Remove();
        }
        bool last;
        lock (_gate)
        {
            last = --_unfinished == 0;
            if (last)
            {
                _timesS = null;
                ReleaseRuns();
            }
        }
        if (last && _count >= CollectFrom)
        {
            // The window's times (about 10 MB for 20 minutes at 1 kHz), made for it alone, are large-object garbage
            // now, as are any statistics arrays its channels outgrew; only a full collection frees them, and the
            // collector put that off until its large-object budget ran out, so on the 8 h 1 kHz day two or three
            // windows' worth stayed at the run's peak. One blocking collection per long window (a few an hour) of a
            // heap of a few thousand objects, mostly number arrays, is brief: measured 15-25 MB lower peak on that
            // day, no CPU time to see.
            GC.Collect();
        }
    }

    private double[] ReadColumn(int column, double[] into)
    {
        if (_count == 0)
        {
            return [];
        }
        var at = 0;
        foreach (var run in _runs)
        {
            _store.Read(run.Block, column, run.First, into.AsSpan(at, run.End - run.First));
            at += run.End - run.First;
        }
        return into;
    }

    private void ReleaseRuns()
    {
        foreach (var run in _runs)
        {
            run.Block.Release();
        }
    }
}
