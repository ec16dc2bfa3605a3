using System.Runtime.ExceptionServices;

namespace BcPrep.Pipeline;

/// <summary>
/// Reduces window samples to statistics on the statistics threads (<see cref="StatisticsWorkers"/>) while the scan goes on reading, so that a day's
/// windows use both cores. Results are gathered in the order the windows were handed in, and the first failure
/// in that order is the one reported, so runs stay deterministic whatever the scheduling.
/// <para>
/// The channels of one window handed in together (<see cref="AddAll"/>) start costliest first, by what each channel's
/// previous window took (<see cref="StartOrder"/>): the day's last window is reduced after the read, on both cores,
/// and a costly channel started last kept one core busy alone for a tenth of a second or more while the other idled.
/// The order they start in changes nothing in what is filed or reported.
/// </para>
/// </summary>
internal sealed class WindowStatsBook
{
    private readonly List<Pending> _pending = [];

    /// <summary>Stopwatch ticks each channel's latest reduction took, by channel (written by the statistics threads).</summary>
    private readonly System.Collections.Concurrent.ConcurrentDictionary<string, long> _lastTicks = new(StringComparer.Ordinal);

    /// <summary>
    /// Starts reducing one channel of one window; <paramref name="evaluate"/> is given the window. It is kept (with
    /// the samples it holds) only while it runs or after it failed: a day of many windows at a high rate must not
    /// hold every window's samples until the day's end.
    /// </summary>
    public void Add(TimeWindow window, string channel, Func<TimeWindow, ChannelWindowStats> evaluate)
    {
        var pending = new Pending(window, channel) { Evaluate = evaluate };
        Start(pending);
        _pending.Add(pending);
    }

    /// <summary>
    /// Starts reducing several channels of one window, as <see cref="Add"/> one after the other would, except that they
    /// start in <see cref="StartOrder"/>: results and failures are still filed in the order given here.
    /// </summary>
    public void AddAll(TimeWindow window, IReadOnlyList<(string Channel, Func<TimeWindow, ChannelWindowStats> Evaluate)> channels)
    {
        var added = channels.Select(c => new Pending(window, c.Channel) { Evaluate = c.Evaluate }).ToList();
        foreach (var i in StartOrder([.. channels.Select(c => c.Channel)], _lastTicks))
        {
            Start(added[i]);
        }
        _pending.AddRange(added);
    }

    /// <summary>
    /// The order in which to start one window's channels (indices into <paramref name="channels"/>): those never
    /// reduced before first, in the given order (nothing is known of their cost), then the others by what their
    /// latest reduction took, longest first, ties in the given order. Longest first keeps the last channels to
    /// finish short, so both threads end about together.
    /// </summary>
    internal static int[] StartOrder(IReadOnlyList<string> channels, IReadOnlyDictionary<string, long> lastTicks)
    {
        long Cost(int i) => lastTicks.TryGetValue(channels[i], out var ticks) ? ticks : long.MaxValue;
        return [.. Enumerable.Range(0, channels.Count).OrderByDescending(Cost).ThenBy(i => i)];
    }

    private void Start(Pending pending)
    {
        var (window, channel, evaluate) = (pending.Window, pending.Channel, pending.Evaluate!);
        pending.Work = StatisticsWorkers.Run(() =>
        {
            var started = System.Diagnostics.Stopwatch.GetTimestamp();
            var result = evaluate(window);
            _lastTicks[channel] = System.Diagnostics.Stopwatch.GetTimestamp() - started;
            pending.Evaluate = null;
            return result;
        });
    }

    private sealed class Pending(TimeWindow window, string channel)
    {
        public TimeWindow Window { get; } = window;

        public string Channel { get; } = channel;

        /// <summary>The evaluation, kept for a failure's second evaluation under the point's id; null once it succeeded.</summary>
        public Func<TimeWindow, ChannelWindowStats>? Evaluate { get; set; }

        public Task<ChannelWindowStats> Work { get; set; } = null!;
    }

    /// <summary>
    /// Waits for every window handed in so far and files the results into <paramref name="into"/>.
    /// </summary>
    /// <param name="into">Receives the statistics, by window id and channel.</param>
    /// <param name="lost">
    /// When given, an operating-point window that lost too much to gaps (<see cref="WindowLostFailure"/>) is filed
    /// here (window id → the problem, the first channel's in hand-in order) instead of failing the day. A tare window's
    /// loss always fails the day: every point depends on it.
    /// </param>
    /// <param name="named">
    /// When given, the windows were handed in under their time interval alone (no id): each is filed under the
    /// window (with its point id) this map gives it, and a window it does not name is dropped, failed or not. A
    /// failure is evaluated again with the named window, so that its message names the point.
    /// </param>
    public void DrainInto(Dictionary<string, Dictionary<string, ChannelWindowStats>> into, Dictionary<string, Problem>? lost = null,
        IReadOnlyDictionary<TimeWindow, TimeWindow>? named = null)
    {
        if (named is not null)
        {
            _pending.RemoveAll(p => !named.ContainsKey(p.Window));
        }
        try
        {
            Task.WaitAll([.. _pending.Select(p => p.Work)]);
        }
        catch (AggregateException)
        {
            // Rethrown below in hand-in order, unwrapped.
        }
        foreach (var pending in _pending)
        {
            var (handedIn, channel, work) = (pending.Window, pending.Channel, pending.Work);
            var window = named is null ? handedIn : named[handedIn];
            ChannelWindowStats result;
            if (work.IsFaulted)
            {
                var failure = work.Exception!.InnerException!;
                // Out of memory is not evaluated again: the retry would fail on its own (its samples may be let go)
                // and hide the cause.
                if (named is not null && failure is not OutOfMemoryException)
                {
                    // The same samples again, now with the point's id, for a message that names it.
                    try
                    {
                        pending.Evaluate!(window);
                    }
                    catch (Exception again)
                    {
                        failure = again;
                    }
                }
                if (lost is not null && failure is WindowLostFailure wl && window.TareOf is null)
                {
                    lost.TryAdd(window.Id, wl.Problems[0]);
                    continue;
                }
                ExceptionDispatchInfo.Capture(failure).Throw();
            }
            result = work.Result;
            if (!into.TryGetValue(window.Id, out var byChannel))
            {
                byChannel = new Dictionary<string, ChannelWindowStats>(StringComparer.Ordinal);
                into[window.Id] = byChannel;
            }
            byChannel[channel] = named is null ? result : result with { Window = window.Id };
        }
        _pending.Clear();
    }
}
