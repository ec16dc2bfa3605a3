namespace BcPrep;

/// <summary>
/// Working arrays kept per thread and reused. A day's window statistics run on a few thread-pool threads and each
/// needs megabyte-sized temporaries; allocating them afresh on the large-object heap for every channel and window
/// forced full collections that cost more than the statistics. Callers must not hold a scratch array past the call
/// that rented it, nor rent the same slot twice at once.
/// </summary>
internal static class ThreadScratch
{
    [ThreadStatic]
    private static double[][]? _slots;

    /// <summary>A thread-local array of at least <paramref name="length"/> elements for a <see cref="ScratchSlots"/> slot; contents are undefined.</summary>
    public static double[] Rent(int slot, int length)
    {
        _slots ??= new double[ScratchSlots.Count][];
        var array = _slots[slot];
        if (array is null || array.Length < length)
        {
            array = new double[Math.Max(length, 1024)];
            _slots[slot] = array;
        }
        return array;
    }
}
