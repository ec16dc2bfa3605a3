namespace BcPrep.Pipeline;

/// <summary>
/// Counts the window channels loaded from the kept rows and not yet reduced, now and at most: with loading one
/// channel at a time the peak is the number of statistics threads, not the channels of a window.
/// </summary>
internal sealed class LoadedChannels
{
    private int _now;
    private int _peak;

    public int Now => Volatile.Read(ref _now);

    public int Peak => Volatile.Read(ref _peak);

    public void Add()
    {
        var now = Interlocked.Increment(ref _now);
        var peak = Volatile.Read(ref _peak);
        while (now > peak)
        {
            var seen = Interlocked.CompareExchange(ref _peak, now, peak);
            if (seen == peak)
            {
                break;
            }
            peak = seen;
        }
    }

    public void Remove() => Interlocked.Decrement(ref _now);
}
