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
    public void DrainInto(Dictionary<string, Dictionary<string, ChannelWindowStats>> into, Func<TimeWindow, bool>? keep = null)
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
                ExceptionDispatchInfo.Capture(work.Exception!.InnerException!).Throw();
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
