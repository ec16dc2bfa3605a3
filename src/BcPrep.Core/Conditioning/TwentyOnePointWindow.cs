using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace BcPrep.Conditioning;

/// <summary>
/// The Hampel rule for the usual window of 21 finite values (k = 10), decided for four consecutive centres at once:
/// lane l of the j-th vector is sample c + l − 10 + j, so the 21 vectors are plain loads and lane l holds the whole
/// window of centre c + l. A sorting network (Batcher's odd–even merge sort on 32 wires, kept to the 21 that carry
/// values: 112 compare-exchanges, checked for every 0/1 input) sorts every lane without a branch; the median is the
/// middle value and the MAD the 11th smallest |s − m|, from the two runs of deviations on either side of the median.
/// The numbers are the definition's: order statistics are the values themselves, and each deviation and the rule's
/// products are the same operations as in <see cref="HampelFilter"/>'s scalar code.
/// </summary>
internal static class TwentyOnePointWindow
{
    public const int HalfWindow = 10;

    /// <summary>Centres decided at once.</summary>
    public static int Lanes => Vector256<double>.Count;

    /// <summary>Whether the vector form runs in hardware (it is slower than the sliding window when emulated).</summary>
    public static bool IsAccelerated => Vector256.IsHardwareAccelerated;

    /// <summary>
    /// Applies the rule to the centres <paramref name="from"/> … <paramref name="to"/> − 1, whose windows must lie inside
    /// <paramref name="x"/> (finite), with at least <see cref="Lanes"/> centres: a replaced sample gets its median in
    /// <paramref name="output"/> and its index appended to <paramref name="replaced"/>, in increasing order.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Apply(ReadOnlySpan<double> x, int from, int to, double sigmaThreshold, double scaleFloor, Span<double> output, List<int> replaced)
    {
        int lanes = Lanes;
        if (from < HalfWindow || to > x.Length - HalfWindow || to - from < lanes || output.Length < x.Length)
        {
            throw new ArgumentException("The centres need whole windows inside the samples, and at least one vector of them.");
        }

        ref double origin = ref MemoryMarshal.GetReference(x);
        var sigmas = Vector256.Create(sigmaThreshold);
        var floor = Vector256.Create(scaleFloor);
        var madToSigma = Vector256.Create(HampelFilter.MadToSigma);
        int done = from;
        while (done < to)
        {
            // The last group is moved back to end at `to`; its lanes already decided are skipped.
            int start = Math.Min(done, to - lanes);
            ref double window = ref Unsafe.Add(ref origin, start - HalfWindow);
            var v0 = Vector256.LoadUnsafe(ref window, (nuint)0);
            var v1 = Vector256.LoadUnsafe(ref window, (nuint)1);
            var v2 = Vector256.LoadUnsafe(ref window, (nuint)2);
            var v3 = Vector256.LoadUnsafe(ref window, (nuint)3);
            var v4 = Vector256.LoadUnsafe(ref window, (nuint)4);
            var v5 = Vector256.LoadUnsafe(ref window, (nuint)5);
            var v6 = Vector256.LoadUnsafe(ref window, (nuint)6);
            var v7 = Vector256.LoadUnsafe(ref window, (nuint)7);
            var v8 = Vector256.LoadUnsafe(ref window, (nuint)8);
            var v9 = Vector256.LoadUnsafe(ref window, (nuint)9);
            var v10 = Vector256.LoadUnsafe(ref window, (nuint)10);
            var v11 = Vector256.LoadUnsafe(ref window, (nuint)11);
            var v12 = Vector256.LoadUnsafe(ref window, (nuint)12);
            var v13 = Vector256.LoadUnsafe(ref window, (nuint)13);
            var v14 = Vector256.LoadUnsafe(ref window, (nuint)14);
            var v15 = Vector256.LoadUnsafe(ref window, (nuint)15);
            var v16 = Vector256.LoadUnsafe(ref window, (nuint)16);
            var v17 = Vector256.LoadUnsafe(ref window, (nuint)17);
            var v18 = Vector256.LoadUnsafe(ref window, (nuint)18);
            var v19 = Vector256.LoadUnsafe(ref window, (nuint)19);
            var v20 = Vector256.LoadUnsafe(ref window, (nuint)20);
            Sort(ref v0, ref v1, ref v2, ref v3, ref v4, ref v5, ref v6, ref v7, ref v8, ref v9, ref v10, ref v11, ref v12, ref v13, ref v14, ref v15, ref v16, ref v17, ref v18, ref v19, ref v20);

            var m = v10;
            // Deviations below the median, m − s₉ … m − s₀, and above it, s₁₁ − m … s₂₀ − m, each ascending; with
            // |s₁₀ − m| = 0 the MAD is the 10th smallest of the two runs together: the least of max(aₜ, b₁₀₋ₜ).
            var mad = Vector256.MinNative(m - v0, v20 - m);
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v9, v19 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v8, v18 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v7, v17 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v6, v16 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v5, v15 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v4, v14 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v3, v13 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v2, v12 - m));
            mad = Vector256.MinNative(mad, Vector256.MaxNative(m - v1, v11 - m));

            // HampelFilter.IsSpike, lane by lane: scale = max(1.4826·MAD, floor) > 0 and |x − m| > n_σ·scale.
            var scale = Vector256.Max(madToSigma * mad, floor);
            var centre = Vector256.LoadUnsafe(ref origin, (nuint)start);
            var spike = Vector256.GreaterThan(scale, Vector256<double>.Zero)
                & Vector256.GreaterThan(Vector256.Abs(centre - m), sigmas * scale);
            uint bits = spike.ExtractMostSignificantBits() >> (done - start);
            while (bits != 0)
            {
                int lane = (done - start) + System.Numerics.BitOperations.TrailingZeroCount(bits);
                output[start + lane] = m.GetElement(lane);
                replaced.Add(start + lane);
                bits &= bits - 1;
            }

            done = start + lanes;
        }
    }

    /// <summary>The network: after it, every lane of v0 … v20 is ascending.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static void Sort(ref Vector256<double> v0, ref Vector256<double> v1, ref Vector256<double> v2, ref Vector256<double> v3, ref Vector256<double> v4, ref Vector256<double> v5, ref Vector256<double> v6, ref Vector256<double> v7, ref Vector256<double> v8, ref Vector256<double> v9, ref Vector256<double> v10, ref Vector256<double> v11, ref Vector256<double> v12, ref Vector256<double> v13, ref Vector256<double> v14, ref Vector256<double> v15, ref Vector256<double> v16, ref Vector256<double> v17, ref Vector256<double> v18, ref Vector256<double> v19, ref Vector256<double> v20)
    {
        Exchange(ref v0, ref v1);
        Exchange(ref v2, ref v3);
        Exchange(ref v4, ref v5);
        Exchange(ref v6, ref v7);
        Exchange(ref v8, ref v9);
        Exchange(ref v10, ref v11);
        Exchange(ref v12, ref v13);
        Exchange(ref v14, ref v15);
        Exchange(ref v16, ref v17);
        Exchange(ref v18, ref v19);
        Exchange(ref v0, ref v2);
        Exchange(ref v1, ref v3);
        Exchange(ref v4, ref v6);
        Exchange(ref v5, ref v7);
        Exchange(ref v8, ref v10);
        Exchange(ref v9, ref v11);
        Exchange(ref v12, ref v14);
        Exchange(ref v13, ref v15);
        Exchange(ref v16, ref v18);
        Exchange(ref v17, ref v19);
        Exchange(ref v1, ref v2);
        Exchange(ref v5, ref v6);
        Exchange(ref v9, ref v10);
        Exchange(ref v13, ref v14);
        Exchange(ref v17, ref v18);
        Exchange(ref v0, ref v4);
        Exchange(ref v1, ref v5);
        Exchange(ref v2, ref v6);
        Exchange(ref v3, ref v7);
        Exchange(ref v8, ref v12);
        Exchange(ref v9, ref v13);
        Exchange(ref v10, ref v14);
        Exchange(ref v11, ref v15);
        Exchange(ref v16, ref v20);
        Exchange(ref v2, ref v4);
        Exchange(ref v3, ref v5);
        Exchange(ref v10, ref v12);
        Exchange(ref v11, ref v13);
        Exchange(ref v18, ref v20);
        Exchange(ref v1, ref v2);
        Exchange(ref v3, ref v4);
        Exchange(ref v5, ref v6);
        Exchange(ref v9, ref v10);
        Exchange(ref v11, ref v12);
        Exchange(ref v13, ref v14);
        Exchange(ref v17, ref v18);
        Exchange(ref v19, ref v20);
        Exchange(ref v0, ref v8);
        Exchange(ref v1, ref v9);
        Exchange(ref v2, ref v10);
        Exchange(ref v3, ref v11);
        Exchange(ref v4, ref v12);
        Exchange(ref v5, ref v13);
        Exchange(ref v6, ref v14);
        Exchange(ref v7, ref v15);
        Exchange(ref v4, ref v8);
        Exchange(ref v5, ref v9);
        Exchange(ref v6, ref v10);
        Exchange(ref v7, ref v11);
        Exchange(ref v2, ref v4);
        Exchange(ref v3, ref v5);
        Exchange(ref v6, ref v8);
        Exchange(ref v7, ref v9);
        Exchange(ref v10, ref v12);
        Exchange(ref v11, ref v13);
        Exchange(ref v18, ref v20);
        Exchange(ref v1, ref v2);
        Exchange(ref v3, ref v4);
        Exchange(ref v5, ref v6);
        Exchange(ref v7, ref v8);
        Exchange(ref v9, ref v10);
        Exchange(ref v11, ref v12);
        Exchange(ref v13, ref v14);
        Exchange(ref v17, ref v18);
        Exchange(ref v19, ref v20);
        Exchange(ref v0, ref v16);
        Exchange(ref v1, ref v17);
        Exchange(ref v2, ref v18);
        Exchange(ref v3, ref v19);
        Exchange(ref v4, ref v20);
        Exchange(ref v8, ref v16);
        Exchange(ref v9, ref v17);
        Exchange(ref v10, ref v18);
        Exchange(ref v11, ref v19);
        Exchange(ref v12, ref v20);
        Exchange(ref v4, ref v8);
        Exchange(ref v5, ref v9);
        Exchange(ref v6, ref v10);
        Exchange(ref v7, ref v11);
        Exchange(ref v12, ref v16);
        Exchange(ref v13, ref v17);
        Exchange(ref v14, ref v18);
        Exchange(ref v15, ref v19);
        Exchange(ref v2, ref v4);
        Exchange(ref v3, ref v5);
        Exchange(ref v6, ref v8);
        Exchange(ref v7, ref v9);
        Exchange(ref v10, ref v12);
        Exchange(ref v11, ref v13);
        Exchange(ref v14, ref v16);
        Exchange(ref v15, ref v17);
        Exchange(ref v18, ref v20);
        Exchange(ref v1, ref v2);
        Exchange(ref v3, ref v4);
        Exchange(ref v5, ref v6);
        Exchange(ref v7, ref v8);
        Exchange(ref v9, ref v10);
        Exchange(ref v11, ref v12);
        Exchange(ref v13, ref v14);
        Exchange(ref v15, ref v16);
        Exchange(ref v17, ref v18);
        Exchange(ref v19, ref v20);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Exchange(ref Vector256<double> low, ref Vector256<double> high)
    {
        var min = Vector256.MinNative(low, high);
        high = Vector256.MaxNative(low, high);
        low = min;
    }
}
