using System.Runtime.ExceptionServices;

namespace BcPrep.Pipeline;

/// <summary>
/// Reduces window samples to statistics on the statistics threads (<see cref="StatisticsWorkers"/>) while the scan goes on reading, so that a day's
/// windows use both cores. Results are gathered in the order the windows were handed in, and the first failure
/// in that order is the one reported, so runs stay deterministic whatever the scheduling.
/// </summary>
internal sealed class WindowStatsBook
{
    private readonly List<Pending> _pending = [];

    /// <summary>
    /// Starts reducing one channel of one window; <paramref name="evaluate"/> is given the window. It is kept (with
    /// the samples it holds) only while it runs or after it failed: a day of many windows at a high rate must not
    /// hold every window's samples until the day's end.
    /// </summary>
    public void Add(TimeWindow window, string channel, Func<TimeWindow, ChannelWindowStats> evaluate)
    {
        var pending = new Pending(window, channel) { Evaluate = evaluate };
        pending.Work = StatisticsWorkers.Run(() =>
        {
            var result = evaluate(window);
            pending.Evaluate = null;
            return result;
        });
        _pending.Add(pending);
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
