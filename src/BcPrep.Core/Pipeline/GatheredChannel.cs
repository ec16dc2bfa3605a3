using BcPrep.Conditioning;
using System.Runtime.ExceptionServices;

namespace BcPrep.Pipeline;

/// <summary>
/// One channel of a <see cref="GatheredWindow"/>, reduced once on a statistics thread. Its samples are loaded when the
/// reduction starts and let go when it succeeds; a reduction that fails keeps a copy loaded again (or the load's
/// failure), so that a second reduction for the failure's message (<see cref="WindowStatsBook"/>) sees the samples as
/// they were loaded after the store has let the blocks go.
/// </summary>
internal sealed class GatheredChannel(GatheredWindow window, string name, int index)
{
    private readonly object _gate = new();
    private bool _started;
    private (double[] TimesS, Memory<double> Values)? _kept;
    private ExceptionDispatchInfo? _loadFailure;

    public string Name { get; } = name;

    /// <summary>Reduces the channel's samples (times, values), loading them the first time.</summary>
    public T Reduce<T>(Func<double[], ReadOnlyMemory<double>, T> reduce) =>
        Reduce<T>((times, values, _) => reduce(times, values));

    /// <summary>
    /// As <see cref="Reduce{T}(Func{double[], ReadOnlyMemory{double}, T})"/>, but the first reduction may write over the
    /// loaded values (the thread's scratch) as it likes, and over the rest of that slot's array (it is given
    /// <see cref="SampleEdits"/> for <see cref="WindowStatistics.EvaluateInPlace"/>, not to give them back): should it
    /// fail, the channel is loaded again from the kept rows for the second reduction, which gets that copy read-only
    /// (null edits).
    /// </summary>
    public T Reduce<T>(Func<double[], Memory<double>, SampleEdits?, T> reduce)
    {
        bool again;
        lock (_gate)
        {
            again = _started;
            _started = true;
        }
        if (again)
        {
            if (_kept is { } kept)
            {
                return reduce(kept.TimesS, kept.Values, null);
            }
            _loadFailure?.Throw();
            throw new InvalidOperationException($"channel '{Name}' of a gathered window was reduced already and its samples let go");
        }
        (double[] TimesS, Memory<double> Values) samples;
        try
        {
            samples = window.Load(index);
        }
        catch (Exception e)
        {
            _loadFailure = ExceptionDispatchInfo.Capture(e);
            window.Finish(loaded: false);
            throw;
        }
        var edits = new SampleEdits();
        try
        {
            return reduce(samples.TimesS, samples.Values, edits);
        }
        catch
        {
            // The values are the thread's scratch (GatheredWindow.Load), which its next channel overwrites, and the
            // reduction may have written over them beyond repair (a de-spiked copy of a window with inserted samples
            // goes into the same slot), so the second reduction gets them loaded again; the blocks stay until this
            // channel is finished (below).
            KeepLoadedAgain(samples.TimesS);
            throw;
        }
        finally
        {
            window.Finish(loaded: true);
        }
    }

    private void KeepLoadedAgain(double[] timesS)
    {
        try
        {
            _kept = (timesS, window.LoadAgain(index));
        }
        catch (Exception e)
        {
            // The reduction's own failure goes on; the second reduction reports why the samples are not there.
            _loadFailure = ExceptionDispatchInfo.Capture(e);
        }
    }
}
