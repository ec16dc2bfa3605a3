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
public sealed class WindowCollector : IChannelSink
{
    private readonly IReadOnlyList<TimeWindow> _windows;
    private readonly Action<TimeWindow, string, double[], double[]> _onWindowComplete;
    private readonly Func<TimeWindow, string, bool>? _collects;
    private readonly Dictionary<string, ChannelState> _state = new(StringComparer.Ordinal);

    /// <param name="windows">Windows to collect, any order, may overlap.</param>
    /// <param name="onWindowComplete">Receives (window, channel, times, values) once per window and channel.</param>
    /// <param name="collects">Whether a window is collected for a channel (a tare window serves one channel); null for all.</param>
    public WindowCollector(IReadOnlyList<TimeWindow> windows, Action<TimeWindow, string, double[], double[]> onWindowComplete,
        Func<TimeWindow, string, bool>? collects = null)
    {
        _windows = windows.OrderBy(w => w.StartS).ToList();
        _onWindowComplete = onWindowComplete;
        _collects = collects;
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
                if (state.Times[w].Count == 0)
                {
                    Reserve(state, w, window, timeS, first);
                }
                state.Times[w].AddRange(timeS[first..end]);
                state.Values[w].AddRange(valueSi[first..end]);
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
    /// Sizes a window's lists from the sample interval seen at its first sample, so a long window at a high rate is
    /// not grown by doubling and copying (which would hold up to three copies of it at once).
    /// </summary>
    private static void Reserve(ChannelState state, int w, TimeWindow window, ReadOnlySpan<double> timeS, int i)
    {
        var interval = i + 1 < timeS.Length ? timeS[i + 1] - timeS[i] : i > 0 ? timeS[i] - timeS[i - 1] : 0.0;
        if (!(interval > 0))
        {
            return;
        }
        var expected = ((window.EndS - timeS[i]) / interval * 1.02) + 16;
        var capacity = (int)Math.Min(expected, 256_000_000);
        state.Times[w].Capacity = capacity;
        state.Values[w].Capacity = capacity;
    }

    private void Flush(string channel, ChannelState state, int w)
    {
        if (state.Done[w])
        {
            return;
        }
        state.Done[w] = true;
        _onWindowComplete(_windows[w], channel, state.Times[w].ToArray(), state.Values[w].ToArray());
        state.Times[w] = [];
        state.Values[w] = [];
    }

    private sealed class ChannelState
    {
        public ChannelState(int windows)
        {
            Times = Enumerable.Range(0, windows).Select(_ => new List<double>()).ToArray();
            Values = Enumerable.Range(0, windows).Select(_ => new List<double>()).ToArray();
            Done = new bool[windows];
        }

        public List<double>[] Times { get; }

        public List<double>[] Values { get; }

        public bool[] Done { get; }

        public int FirstOpen { get; set; }
    }
}
