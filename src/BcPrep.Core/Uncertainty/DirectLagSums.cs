using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// The lagged products r(k) = Σᵢ dᵢ dᵢ₊ₖ (d = x − mean) of a range of lags, summed directly, every lag of the range in
/// one sweep over the window: the window is walked in chunks whose deviations sit in a small buffer (cache-resident,
/// of the chunk's length plus the lags, not of the window's), and four lags share each load of dᵢ. A lag is summed in
/// the same order as one vectorised sweep of its own (lane j holds the i ≡ j terms in increasing i, then the lanes are
/// added, then the scalar tail), so r(k) does not depend on which other lags are summed with it or on the chunking.
/// </summary>
internal static class DirectLagSums
{
    /// <summary>Samples per chunk: 2048 deviations plus the lags stay within the first-level cache's reach.</summary>
    private const int Chunk = 2048;

    /// <summary>Writes r(k) for k in [<paramref name="firstLag"/>, <paramref name="endLag"/>) into <paramref name="sums"/>[k].</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Compute(ReadOnlySpan<double> samples, double mean, int firstLag, int endLag, Span<double> sums)
    {
        var n = samples.Length;
        if (firstLag < 1 || endLag > n || firstLag >= endLag || sums.Length < endLag)
        {
            throw new ArgumentException($"Lags [{firstLag}, {endLag}) must lie within [1, {n}) and the output.", nameof(endLag));
        }
        var width = Vector<double>.Count;
        var lagCount = endLag - firstLag;
        // Per lag: the lane accumulators and how far its vector part reaches, ⌊(n − k)/w⌋·w.
        var accumulators = new Vector<double>[lagCount];
        var deviations = ThreadScratch.Rent(ScratchSlots.Deviations, Chunk + endLag);
        var vectorEnd = VectorEnd(n, firstLag, width);
        for (var start = 0; start < vectorEnd; start += Chunk)
        {
            var stop = Math.Min(start + Chunk, vectorEnd);
            var available = Math.Min(n, stop + endLag) - start;
            for (var i = 0; i < available; i++)
            {
                deviations[i] = samples[start + i] - mean;
            }
            var d = deviations.AsSpan(0, available);
            var k = firstLag;
            for (; k + 4 <= endLag; k += 4)
            {
                SweepFour(d, start, stop, n, k, width, accumulators.AsSpan(k - firstLag, 4));
            }
            for (; k < endLag; k++)
            {
                accumulators[k - firstLag] = Sweep(d, start, start, Math.Min(stop, VectorEnd(n, k, width)), k, width, accumulators[k - firstLag]);
            }
        }
        for (var k = firstLag; k < endLag; k++)
        {
            var sum = Vector.Sum(accumulators[k - firstLag]);
            for (var i = VectorEnd(n, k, width); i < n - k; i++)
            {
                sum += (samples[i] - mean) * (samples[i + k] - mean);
            }
            sums[k] = sum;
        }
    }

    private static int VectorEnd(int n, int lag, int width) => (n - lag) / width * width;

    /// <summary>Lags k … k + 3 over [start, stop) of the window, d holding the deviations from start on.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void SweepFour(ReadOnlySpan<double> d, int start, int stop, int n, int k, int width, Span<Vector<double>> acc)
    {
        // The four lags' vector parts end within one vector of each other; sweep them together to the shortest.
        var common = Math.Min(stop, VectorEnd(n, k + 3, width)) - start;
        if (common > 0 && common + k + 3 > d.Length)
        {
            throw new InvalidOperationException("The deviation buffer does not reach the lags swept.");
        }
        var a0 = acc[0];
        var a1 = acc[1];
        var a2 = acc[2];
        var a3 = acc[3];
        ref var origin = ref MemoryMarshal.GetReference(d);
        for (var i = 0; i < common; i += width)
        {
            // Unchecked loads: the check above keeps i + k + 3 + width − 1 ≤ common + k + 2 below d.Length.
            var x = Vector.LoadUnsafe(ref origin, (nuint)i);
            a0 += x * Vector.LoadUnsafe(ref origin, (nuint)(i + k));
            a1 += x * Vector.LoadUnsafe(ref origin, (nuint)(i + k + 1));
            a2 += x * Vector.LoadUnsafe(ref origin, (nuint)(i + k + 2));
            a3 += x * Vector.LoadUnsafe(ref origin, (nuint)(i + k + 3));
        }
        var from = start + Math.Max(common, 0);
        acc[0] = Sweep(d, start, from, Math.Min(stop, VectorEnd(n, k, width)), k, width, a0);
        acc[1] = Sweep(d, start, from, Math.Min(stop, VectorEnd(n, k + 1, width)), k + 1, width, a1);
        acc[2] = Sweep(d, start, from, Math.Min(stop, VectorEnd(n, k + 2, width)), k + 2, width, a2);
        acc[3] = Sweep(d, start, from, Math.Min(stop, VectorEnd(n, k + 3, width)), k + 3, width, a3);
    }

    /// <summary>One lag over window indices [from, to), d holding the deviations from window index <paramref name="origin"/> on.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static Vector<double> Sweep(ReadOnlySpan<double> d, int origin, int from, int to, int lag, int width, Vector<double> acc)
    {
        for (var i = from - origin; i < to - origin; i += width)
        {
            acc += new Vector<double>(d[i..]) * new Vector<double>(d[(i + lag)..]);
        }
        return acc;
    }
}
