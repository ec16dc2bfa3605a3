namespace BcPrep;

/// <summary>
/// Working arrays kept per thread and reused. A day's window statistics run on a few thread-pool threads and each
/// needs megabyte-sized temporaries; allocating them afresh on the large-object heap for every channel and window
/// forced full collections that cost more than the statistics. Callers must not hold a scratch array past the call
/// that rented it, nor rent the same slot twice at once.
/// </summary>
internal static class ThreadScratch
{
    /// <summary>Arrays up to this many values are made at the length asked for (or 1024); longer ones get headroom (<see cref="CapacityFor"/>).</summary>
    internal const int ExactUpTo = 1 << 16;

    [ThreadStatic]
    private static double[]?[]? _slots;

    // Every thread's slot table, weakly (a thread's table goes with the thread), for ReleaseAll.
    private static readonly List<WeakReference<double[]?[]>> Tables = [];

    /// <summary>A thread-local array of at least <paramref name="length"/> elements for a <see cref="ScratchSlots"/> slot; contents are undefined.</summary>
    public static double[] Rent(int slot, int length)
    {
        _slots ??= NewTable();
        var array = _slots[slot];
        if (array is null || array.Length < length)
        {
            // Drop the old array first, so that it is not kept alive beside the new one by this slot.
            _slots[slot] = null;
            array = new double[CapacityFor(length)];
            _slots[slot] = array;
        }
        return array;
    }

    /// <summary>The length of this thread's array in <paramref name="slot"/>, 0 when it has none (what a statistics thread holds).</summary>
    internal static int LengthOf(int slot) => _slots?[slot]?.Length ?? 0;

    /// <summary>
    /// Lets go of every thread's arrays, for when the window statistics of a day are done: the statistics threads
    /// are kept for the process, and so were their arrays (on the 8 h 1 kHz day about 40 MB a thread) while the
    /// points were evaluated and written, the run's last peak. A thread that is still working keeps the arrays it
    /// holds (they are only dropped from the slots), and its next rent makes new ones.
    /// </summary>
    public static void ReleaseAll()
    {
        lock (Tables)
        {
            foreach (var table in Tables)
            {
                if (table.TryGetTarget(out var slots))
                {
                    Array.Clear(slots);
                }
            }
        }
    }

    private static double[]?[] NewTable()
    {
        var slots = new double[]?[ScratchSlots.Count];
        lock (Tables)
        {
            Tables.RemoveAll(t => !t.TryGetTarget(out _));
            Tables.Add(new WeakReference<double[]?[]>(slots));
        }
        return slots;
    }

    /// <summary>
    /// The length of a new array for <paramref name="length"/> values: above <see cref="ExactUpTo"/>, rounded up to a
    /// multiple of an eighth of the largest power of two not above it (at most 12.5 % more). A day's windows usually
    /// grow by a few samples from one to the next (on the 8 h 1 kHz day 1 214 001, 1 215 001, 1 216 001, ...): at the
    /// exact length every such window made each thread's window-long arrays anew, and the 10 MB arrays given up were
    /// large-object garbage that stayed in memory until the next full collection (about 40 MB at the day's peak).
    /// </summary>
    internal static int CapacityFor(int length)
    {
        if (length <= ExactUpTo)
        {
            return Math.Max(length, 1024);
        }
        var step = (int)(System.Numerics.BitOperations.RoundUpToPowerOf2((uint)length + 1) >> 4);
        var rounded = ((long)length + step - 1) / step * step;
        return (int)Math.Min(rounded, Array.MaxLength);
    }
}
