namespace BcPrep.Pipeline;

/// <summary>
/// Keeps copies of the latest calibrated row blocks of one logger, so that a window found after its rows have
/// streamed past can still be gathered without reading the log again. Memory is what the kept span of time holds,
/// at most <see cref="MaxKeptValues"/> values (the oldest blocks go first); blocks dropped are reused for the next rows.
/// </summary>
internal sealed class RecentRows
{
    /// <summary>
    /// Values (times and samples) kept at most: 12 M doubles, 96 MB, e.g. 45 min of 13 channels at 200 Hz or 11 min
    /// of 17 channels at 1 kHz. A window that starts before what is left is read again instead.
    /// </summary>
    public const long MaxKeptValues = 12_000_000;

    private readonly long _maxKeptValues;
    private long _keptValues;

    /// <param name="maxKeptValues">Values kept at most; <see cref="MaxKeptValues"/> by default.</param>
    public RecentRows(long maxKeptValues = MaxKeptValues)
    {
        _maxKeptValues = maxKeptValues;
    }
    private readonly Queue<Kept> _kept = new();
    private readonly Stack<Kept> _free = new();
    private IReadOnlyList<string> _channels = [];
    private double _droppedThroughS = double.NegativeInfinity;
    private double _newestS = double.NegativeInfinity;

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
            _free.Clear();
            _channels = [.. channels];
        }
        var kept = _free.Count > 0 && _free.Peek().Capacity >= count ? _free.Pop() : new Kept(channels.Count, Math.Max(count, timeS.Length));
        kept.Count = count;
        Array.Copy(timeS, kept.TimeS, count);
        for (var c = 0; c < channels.Count; c++)
        {
            Array.Copy(valuesSi[c], kept.ValuesSi[c], count);
        }
        _kept.Enqueue(kept);
        _keptValues += Values(kept);
        _newestS = timeS[count - 1];
        while (_keptValues > _maxKeptValues && _kept.Count > 1)
        {
            DropOldest();
        }
    }

    private long Values(Kept kept) => (long)kept.Count * (_channels.Count + 1);

    private void DropOldest()
    {
        var dropped = _kept.Dequeue();
        _keptValues -= Values(dropped);
        _droppedThroughS = dropped.LastS;
        _free.Push(dropped);
    }

    /// <summary>True when every row from <paramref name="window"/>'s start to past its end is kept.</summary>
    public bool Covers(TimeWindow window) => _droppedThroughS < window.StartS && _newestS > window.EndS;

    /// <summary>No row will follow: a window reaching past the last row is covered all the same.</summary>
    public void Complete() => _newestS = double.PositiveInfinity;

    /// <summary>Lets go of every kept row and of the blocks kept for reuse: nothing more will be gathered.</summary>
    public void Release()
    {
        DropBefore(double.PositiveInfinity);
        _free.Clear();
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
    /// Hands over each channel's kept samples inside <paramref name="window"/> (start ≤ t ≤ end), as a window
    /// collector would, in exactly sized arrays; the channels share one array of times, which nobody writes to.
    /// </summary>
    public void Gather(TimeWindow window, Action<string, double[], double[]> onChannel)
    {
        var runs = new List<(Kept Block, int First, int End)>();
        var count = 0;
        foreach (var kept in _kept)
        {
            var times = kept.TimeS.AsSpan(0, kept.Count);
            var first = SortedSearch.FirstAtOrAfter(times, window.StartS);
            var end = SortedSearch.FirstAfter(times, window.EndS);
            if (end > first)
            {
                runs.Add((kept, first, end));
                count += end - first;
            }
        }
        var timesS = new double[count];
        var at = 0;
        foreach (var (block, first, end) in runs)
        {
            block.TimeS.AsSpan(first, end - first).CopyTo(timesS.AsSpan(at));
            at += end - first;
        }
        for (var c = 0; c < _channels.Count; c++)
        {
            var values = new double[count];
            at = 0;
            foreach (var (block, first, end) in runs)
            {
                block.ValuesSi[c].AsSpan(first, end - first).CopyTo(values.AsSpan(at));
                at += end - first;
            }
            onChannel(_channels[c], timesS, values);
        }
    }

    private sealed class Kept(int channels, int capacity)
    {
        public int Capacity { get; } = capacity;

        public double[] TimeS { get; } = new double[capacity];

        public double[][] ValuesSi { get; } = [.. Enumerable.Range(0, channels).Select(_ => new double[capacity])];

        public int Count { get; set; }

        public double LastS => TimeS[Count - 1];
    }
}
