using System.Runtime.ExceptionServices;

namespace BcPrep.Pipeline;

/// <summary>
/// Reduces window samples to statistics on the thread pool while the scan goes on reading, so that a day's
/// windows use both cores. Results are gathered in the order the windows were handed in, and the first failure
/// in that order is the one reported, so runs stay deterministic whatever the scheduling.
/// </summary>
internal sealed class WindowStatsBook
{
    private readonly List<(TimeWindow Window, string Channel, Task<ChannelWindowStats> Work)> _pending = [];

    public void Add(TimeWindow window, string channel, Func<ChannelWindowStats> evaluate) =>
        _pending.Add((window, channel, Task.Run(evaluate)));

    /// <summary>
    /// Waits for every window handed in so far (or only those <paramref name="keep"/> accepts; the others are
    /// dropped, failed or not) and files the results into <paramref name="into"/>.
    /// </summary>
    /// <param name="into">Receives the statistics, by window id and channel.</param>
    /// <param name="keep">Which windows to keep (null: all).</param>
    /// <param name="lost">
    /// When given, an operating-point window that lost too much to gaps (<see cref="WindowLostFailure"/>) is filed
    /// here (window id → the problem, the first channel's in hand-in order) instead of failing the day. A tare window's
    /// loss always fails the day: every point depends on it.
    /// </param>
    public void DrainInto(Dictionary<string, Dictionary<string, ChannelWindowStats>> into, Func<TimeWindow, bool>? keep = null, Dictionary<string, Problem>? lost = null)
    {
        if (keep is not null)
        {
            _pending.RemoveAll(p => !keep(p.Window));
        }
        try
        {
            Task.WaitAll([.. _pending.Select(p => p.Work)]);
        }
        catch (AggregateException)
        {
            // Rethrown below in hand-in order, unwrapped.
        }
        foreach (var (window, channel, work) in _pending)
        {
            if (work.IsFaulted)
            {
                var failure = work.Exception!.InnerException!;
                if (lost is not null && failure is WindowLostFailure wl && window.TareOf is null)
                {
                    lost.TryAdd(window.Id, wl.Problems[0]);
                    continue;
                }
                ExceptionDispatchInfo.Capture(failure).Throw();
            }
            if (!into.TryGetValue(window.Id, out var byChannel))
            {
                byChannel = new Dictionary<string, ChannelWindowStats>(StringComparer.Ordinal);
                into[window.Id] = byChannel;
            }
            byChannel[channel] = work.Result;
        }
        _pending.Clear();
    }
}
