using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>A time interval on the log clock (s) for which samples are gathered.</summary>
public sealed record TimeWindow(string Id, double StartS, double EndS)
{
    /// <summary>The channel whose no-flow tare this window is; null for an operating point's window.</summary>
    public string? TareOf { get; init; }

    /// <summary>The start on the logger clock, typed.</summary>
    public LoggerSeconds Start => new(StartS);

    /// <summary>The end on the logger clock, typed.</summary>
    public LoggerSeconds End => new(EndS);

    public double DurationS => EndS - StartS;

    /// <summary>The tare window of a channel: it serves that channel only, and its id ("tare:" + channel) is only a label.</summary>
    public static TimeWindow Tare(string channel, double startS, double endS) => new("tare:" + channel, startS, endS) { TareOf = channel };

    /// <summary>Whether this window's samples of <paramref name="channel"/> are wanted: a tare window serves its own channel only.</summary>
    public bool Serves(string channel) => TareOf is null || TareOf == channel;

    public bool Contains(double timeS) => timeS >= StartS && timeS <= EndS;
}

/// <summary>
/// Gathers each channel's samples inside each window and hands them over as soon as the channel has passed the
/// window's end, so only the windows open at the current time are held in memory (in practice one operating point).
/// </summary>
/// <remarks>
/// A window of 17 channels at 1 kHz over 17 minutes is 140 MB of values, so each is held once: the channels of one
/// logger share one array of times per window (a channel whose times differ, another logger's, keeps its own), and
/// each buffer is sized at its first sample from the block's sample interval, so that on evenly spaced rows the
/// buffer is handed over as it is, with no growing and no trimming copy (either is done when the rows are uneven).
/// </remarks>
public sealed class WindowCollector : IChannelSink
{
    private readonly IReadOnlyList<TimeWindow> _windows;
    private readonly Action<TimeWindow, string, double[], double[]> _onWindowComplete;
    private readonly Func<TimeWindow, string, bool>? _collects;
    private readonly Dictionary<string, ChannelState> _state = new(StringComparer.Ordinal);
    private readonly SampleBuffer?[] _sharedTimes;
    private readonly int[] _sharedFollowers;

    /// <param name="windows">Windows to collect, any order, may overlap.</param>
    /// <param name="onWindowComplete">
    /// Receives (window, channel, times, values) once per window and channel. The times array may be shared by the
    /// window's channels: it must not be changed.
    /// </param>
    /// <param name="collects">Whether a window is collected for a channel (a tare window serves one channel); null for all.</param>
    public WindowCollector(IReadOnlyList<TimeWindow> windows, Action<TimeWindow, string, double[], double[]> onWindowComplete,
        Func<TimeWindow, string, bool>? collects = null)
    {
        _windows = windows.OrderBy(w => w.StartS).ToList();
        _onWindowComplete = onWindowComplete;
        _collects = collects;
        _sharedTimes = new SampleBuffer?[_windows.Count];
        _sharedFollowers = new int[_windows.Count];
    }

    public void Accept(string channel, ReadOnlySpan<double> timeS, ReadOnlySpan<double> valueSi)
    {
        var state = StateOf(channel);
        if (timeS.IsEmpty)
        {
            return;
        }
        // Times increase, so each window takes one contiguous run of the block: copy runs, not samples.
        for (var w = state.FirstOpen; w < _windows.Count; w++)
        {
            var window = _windows[w];
            if (timeS[^1] < window.StartS)
            {
                break; // windows are ordered by start: this one and the rest begin after the block
            }
            if (state.Done[w])
            {
                continue;
            }
            var first = SortedSearch.FirstAtOrAfter(timeS, window.StartS);
            var end = SortedSearch.FirstAfter(timeS, window.EndS);
            if (end > first)
            {
                var values = state.Values[w] ??= new SampleBuffer(ExpectedSamples(window, timeS, first));
                AddTimes(state, w, window, timeS, first, end, values.Count);
                values.Add(valueSi[first..end]);
            }
            if (end < timeS.Length)
            {
                Flush(channel, state, w);
            }
        }
        while (state.FirstOpen < _windows.Count && state.Done[state.FirstOpen])
        {
            state.FirstOpen++;
        }
    }

    public void Complete(string channel)
    {
        var state = StateOf(channel);
        for (var w = 0; w < _windows.Count; w++)
        {
            Flush(channel, state, w);
        }
    }

    /// <summary>
    /// Appends a run of times for a channel that holds <paramref name="held"/> samples of window <paramref name="w"/>:
    /// to the window's shared times when they hold the same times up to here (the first channel of a block to get
    /// there appends, the others only compare), else to the channel's own.
    /// </summary>
    private void AddTimes(ChannelState state, int w, TimeWindow window, ReadOnlySpan<double> timeS, int first, int end, int held)
    {
        var run = timeS[first..end];
        if (state.OwnTimes[w] is { } own)
        {
            own.Add(run);
            return;
        }
        if (held == 0)
        {
            var axis = _sharedTimes[w] ??= new SampleBuffer(ExpectedSamples(window, timeS, first));
            _sharedFollowers[w]++;
            state.FollowsShared[w] = true;
            if (Joins(axis, 0, run))
            {
                return;
            }
            _sharedFollowers[w]--;
            state.FollowsShared[w] = false;
            state.OwnTimes[w] = new SampleBuffer(ExpectedSamples(window, timeS, first));
            state.OwnTimes[w]!.Add(run);
            return;
        }
        var shared = _sharedTimes[w]!;
        if (!Joins(shared, held, run))
        {
            // Another time axis from here on: the channel keeps its own copy of the times so far and of the rest.
            var mine = new SampleBuffer(held + run.Length);
            mine.Add(shared.Span[..held]);
            mine.Add(run);
            state.OwnTimes[w] = mine;
            Leave(state, w);
        }
    }

    /// <summary>
    /// Whether the run continues the shared times after their first <paramref name="held"/> entries (appending what
    /// they do not hold yet); false, and nothing appended, when they differ.
    /// </summary>
    private static bool Joins(SampleBuffer axis, int held, ReadOnlySpan<double> run)
    {
        var known = Math.Clamp(axis.Count - held, 0, run.Length);
        if (held > axis.Count || !axis.Span.Slice(held, known).SequenceEqual(run[..known]))
        {
            return false;
        }
        if (known < run.Length)
        {
            if (axis.Count != held + known)
            {
                return false;
            }
            axis.Add(run[known..]);
        }
        return true;
    }

    /// <summary>A channel's state; windows it does not collect start out done, so they are neither filled nor handed over.</summary>
    private ChannelState StateOf(string channel)
    {
        if (!_state.TryGetValue(channel, out var state))
        {
            state = new ChannelState(_windows.Count);
            for (var w = 0; w < _windows.Count; w++)
            {
                state.Done[w] = _collects is not null && !_collects(_windows[w], channel);
            }
            _state[channel] = state;
        }
        return state;
    }

    /// <summary>
    /// The samples a window will hold from sample <paramref name="i"/> of the block on, if the rows keep the block's
    /// mean interval: exact on evenly spaced rows (the interval is taken over the whole rest of the block, so the
    /// rounding of large time stamps does not add up), 0 when the block cannot tell.
    /// </summary>
    private static int ExpectedSamples(TimeWindow window, ReadOnlySpan<double> timeS, int i)
    {
        var last = timeS.Length - 1;
        if (last <= i)
        {
            return 0;
        }
        var interval = (timeS[last] - timeS[i]) / (last - i);
        if (!(interval > 0))
        {
            return 0;
        }
        var expected = Math.Floor(((window.EndS - timeS[i]) / interval) + 1e-6) + 1;
        return (int)Math.Clamp(expected, 0, 256_000_000);
    }

    private void Flush(string channel, ChannelState state, int w)
    {
        if (state.Done[w])
        {
            return;
        }
        state.Done[w] = true;
        var values = state.Values[w];
        state.Values[w] = null;
        double[] times;
        if (values is null)
        {
            times = [];
        }
        else if (state.OwnTimes[w] is { } own)
        {
            times = own.Exact();
            state.OwnTimes[w] = null;
        }
        else
        {
            var shared = _sharedTimes[w]!;
            times = shared.Count == values.Count ? shared.Exact() : shared.Span[..values.Count].ToArray();
            Leave(state, w);
        }
        _onWindowComplete(_windows[w], channel, times, values?.Exact() ?? []);
    }

    /// <summary>The channel no longer follows the window's shared times; the last to leave lets them go.</summary>
    private void Leave(ChannelState state, int w)
    {
        if (!state.FollowsShared[w])
        {
            return;
        }
        state.FollowsShared[w] = false;
        if (--_sharedFollowers[w] == 0)
        {
            _sharedTimes[w] = null;
        }
    }

    private sealed class ChannelState(int windows)
    {
        public SampleBuffer?[] Values { get; } = new SampleBuffer?[windows];

        /// <summary>The channel's own times of a window, when they are not the window's shared times.</summary>
        public SampleBuffer?[] OwnTimes { get; } = new SampleBuffer?[windows];

        public bool[] FollowsShared { get; } = new bool[windows];

        public bool[] Done { get; } = new bool[windows];

        public int FirstOpen { get; set; }
    }

    /// <summary>
    /// A growable array that hands itself over without a copy when it is exactly full, and keeps handing the same
    /// exact array afterwards (the shared times of a window go to each of its channels).
    /// </summary>
    private sealed class SampleBuffer(int capacity)
    {
        private double[] _items = capacity > 0 ? GC.AllocateUninitializedArray<double>(capacity) : [];

        public int Count { get; private set; }

        public ReadOnlySpan<double> Span => _items.AsSpan(0, Count);

        public void Add(ReadOnlySpan<double> run)
        {
            if (Count + run.Length > _items.Length)
            {
                var grown = GC.AllocateUninitializedArray<double>(Math.Max(Count + run.Length, Math.Max(16, _items.Length + (_items.Length / 2))));
                Span.CopyTo(grown);
                _items = grown;
            }
            run.CopyTo(_items.AsSpan(Count));
            Count += run.Length;
        }

        /// <summary>The samples as an array of exactly their number: the buffer itself when it is full.</summary>
        public double[] Exact()
        {
            if (_items.Length != Count)
            {
                _items = Span.ToArray();
            }
            return _items;
        }
    }
}
