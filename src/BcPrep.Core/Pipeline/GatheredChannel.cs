using BcPrep.Conditioning;
using System.Runtime.ExceptionServices;

namespace BcPrep.Pipeline;

/// <summary>
/// One channel of a <see cref="GatheredWindow"/>, reduced once on a statistics thread. Its samples are loaded when the
/// reduction starts and let go when it succeeds; a reduction that fails keeps them (or the load's failure), so that a
/// second reduction for the failure's message (<see cref="WindowStatsBook"/>) sees the same samples after the store
/// has let the blocks go.
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
    /// loaded values (the thread's scratch) if it records every cell it writes in the <see cref="SampleEdits"/> it is
    /// given: should it fail, they are put back before the samples are kept for the second reduction, which gets the
    /// kept copy read-only (null edits).
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
            // The values are the thread's scratch (GatheredWindow.Load), which its next channel overwrites; the
            // reduction may have written over some of them, which are put back first.
            edits.Undo(samples.Values.Span);
            _kept = (samples.TimesS, samples.Values.ToArray().AsMemory());
            throw;
        }
        finally
        {
            window.Finish(loaded: true);
        }
    }
}
