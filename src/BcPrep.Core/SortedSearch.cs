using System.Runtime.CompilerServices;

namespace BcPrep;

/// <summary>
/// Binary searches on ascending values, as used on time stamps and on the Hampel window. Halving without a
/// data-dependent branch (the comparison only picks the next base, a conditional move), because on noisy values a
/// branch would be mispredicted half the time.
/// </summary>
internal static class SortedSearch
{
    /// <summary>The number of values below <paramref name="limit"/>: the first index whose value is ≥ it.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static int FirstAtOrAfter(ReadOnlySpan<double> ascending, double limit)
    {
        int basePos = 0;
        int n = ascending.Length;
        while (n > 1)
        {
            int half = n >>> 1;
            basePos = ascending[basePos + half - 1] < limit ? basePos + half : basePos;
            n -= half;
        }

        return n == 1 && ascending[basePos] < limit ? basePos + 1 : basePos;
    }

    /// <summary>The number of values at or below <paramref name="limit"/>: the first index whose value is &gt; it.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static int FirstAfter(ReadOnlySpan<double> ascending, double limit)
    {
        int basePos = 0;
        int n = ascending.Length;
        while (n > 1)
        {
            int half = n >>> 1;
            basePos = ascending[basePos + half - 1] <= limit ? basePos + half : basePos;
            n -= half;
        }

        return n == 1 && ascending[basePos] <= limit ? basePos + 1 : basePos;
    }
}
