using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace BcPrep.Conditioning;

/// <summary>
/// The Hampel rule for the usual window of 21 finite values (k = 10), four centres at a time, one in each vector lane,
/// without a branch on the data. Lane l holds a whole window sorted: the j-th vector's lane l is the window's j-th
/// smallest value. The median is the middle vector, the MAD the 11th smallest |s − m|, from the two runs of deviations
/// on either side of the median. The numbers are the definition's: order statistics are the values themselves, and
/// each deviation and the rule's products are the same operations as in <see cref="HampelFilter"/>'s scalar code.
/// (One difference no number sees: a window holding both +0 and −0 may give a zero median of the other sign than the
/// sliding window would, as compares treat the two as equal; decisions, counts, means and sums are unaffected.)
/// <para>
/// Long series: each lane walks its own quarter of the centres, and each step slides its sorted window by one sample
/// (the leaving value taken out, the entering one put in, by compares and blends over the 21 vectors). Short ones:
/// four consecutive centres are sorted afresh by a sorting network (Batcher's odd–even merge sort on 32 wires, kept to
/// the 21 that carry values: 112 compare-exchanges, checked for every 0/1 input), which also sorts the long series'
/// first windows.
/// </para>
/// </summary>
internal static class TwentyOnePointWindow
{
    public const int HalfWindow = 10;

    /// <summary>Centres a lane walks at least before the series is split into four stretches instead of groups.</summary>
    private const int MinStretch = 64;

    /// <summary>Centres decided at once.</summary>
    public static int Lanes => Vector256<double>.Count;

    /// <summary>Whether the vector form runs in hardware (it is slower than the sliding window when emulated).</summary>
    public static bool IsAccelerated => Vector256.IsHardwareAccelerated;

    /// <summary>
    /// Applies the rule to the centres <paramref name="from"/> … <paramref name="to"/> − 1, whose windows must lie inside
    /// <paramref name="x"/> (finite), with at least <see cref="Lanes"/> centres: a replaced sample gets its median in
    /// <paramref name="output"/> and its index appended to <paramref name="replaced"/>, in increasing order.
    /// </summary>
    public static void Apply(ReadOnlySpan<double> x, int from, int to, double sigmaThreshold, double scaleFloor, Span<double> output, List<int> replaced)
    {
        if (from < HalfWindow || to > x.Length - HalfWindow || to - from < Lanes || output.Length < x.Length)
        {
            throw new ArgumentException("The centres need whole windows inside the samples, and at least one vector of them.");
        }

        if (to - from >= 4 * MinStretch)
        {
            ApplyStretches(x, from, to, sigmaThreshold, scaleFloor, output, replaced);
        }
        else
        {
            ApplyGroups(x, from, to, sigmaThreshold, scaleFloor, output, replaced);
        }
    }

    /// <summary>Four consecutive centres at a time, each group's windows sorted afresh.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void ApplyGroups(ReadOnlySpan<double> x, int from, int to, double sigmaThreshold, double scaleFloor, Span<double> output, List<int> replaced)
    {
        int lanes = Lanes;
        ref double origin = ref MemoryMarshal.GetReference(x);
        var sigmas = Vector256.Create(sigmaThreshold);
        var floor = Vector256.Create(scaleFloor);
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
            var mad = Mad(ref v0, ref v1, ref v2, ref v3, ref v4, ref v5, ref v6, ref v7, ref v8, ref v9, ref v10, ref v11, ref v12, ref v13, ref v14, ref v15, ref v16, ref v17, ref v18, ref v19, ref v20);
            var centre = Vector256.LoadUnsafe(ref origin, (nuint)start);
            uint bits = SpikeBits(centre, m, mad, sigmas, floor) >> (done - start);
            while (bits != 0)
            {
                int lane = (done - start) + BitOperations.TrailingZeroCount(bits);
                output[start + lane] = m.GetElement(lane);
                replaced.Add(start + lane);
                bits &= bits - 1;
            }

            done = start + lanes;
        }
    }

    /// <summary>
    /// Four stretches of centres, one per lane, each window slid on from the one before. The last stretch is moved
    /// back to end at <paramref name="to"/>; the third lane's centres from where it starts are left to it.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void ApplyStretches(ReadOnlySpan<double> x, int from, int to, double sigmaThreshold, double scaleFloor, Span<double> output, List<int> replaced)
    {
        int length = (to - from + 3) / 4;
        int c0 = from, c1 = from + length, c2 = from + (2 * length), c3 = to - length;
        int s0 = c0 - HalfWindow, s1 = c1 - HalfWindow, s2 = c2 - HalfWindow, s3 = c3 - HalfWindow;
        var sigmas = Vector256.Create(sigmaThreshold);
        var floor = Vector256.Create(scaleFloor);
        // The screen rests on n_σ·scale growing with the scale, which holds for n_σ ≥ 0 only.
        bool screens = sigmaThreshold >= 0;
        List<int>[] found = [[], [], [], []];
        var v0 = Vector256.Create(x[s0 + 0], x[s1 + 0], x[s2 + 0], x[s3 + 0]);
        var v1 = Vector256.Create(x[s0 + 1], x[s1 + 1], x[s2 + 1], x[s3 + 1]);
        var v2 = Vector256.Create(x[s0 + 2], x[s1 + 2], x[s2 + 2], x[s3 + 2]);
        var v3 = Vector256.Create(x[s0 + 3], x[s1 + 3], x[s2 + 3], x[s3 + 3]);
        var v4 = Vector256.Create(x[s0 + 4], x[s1 + 4], x[s2 + 4], x[s3 + 4]);
        var v5 = Vector256.Create(x[s0 + 5], x[s1 + 5], x[s2 + 5], x[s3 + 5]);
        var v6 = Vector256.Create(x[s0 + 6], x[s1 + 6], x[s2 + 6], x[s3 + 6]);
        var v7 = Vector256.Create(x[s0 + 7], x[s1 + 7], x[s2 + 7], x[s3 + 7]);
        var v8 = Vector256.Create(x[s0 + 8], x[s1 + 8], x[s2 + 8], x[s3 + 8]);
        var v9 = Vector256.Create(x[s0 + 9], x[s1 + 9], x[s2 + 9], x[s3 + 9]);
        var v10 = Vector256.Create(x[s0 + 10], x[s1 + 10], x[s2 + 10], x[s3 + 10]);
        var v11 = Vector256.Create(x[s0 + 11], x[s1 + 11], x[s2 + 11], x[s3 + 11]);
        var v12 = Vector256.Create(x[s0 + 12], x[s1 + 12], x[s2 + 12], x[s3 + 12]);
        var v13 = Vector256.Create(x[s0 + 13], x[s1 + 13], x[s2 + 13], x[s3 + 13]);
        var v14 = Vector256.Create(x[s0 + 14], x[s1 + 14], x[s2 + 14], x[s3 + 14]);
        var v15 = Vector256.Create(x[s0 + 15], x[s1 + 15], x[s2 + 15], x[s3 + 15]);
        var v16 = Vector256.Create(x[s0 + 16], x[s1 + 16], x[s2 + 16], x[s3 + 16]);
        var v17 = Vector256.Create(x[s0 + 17], x[s1 + 17], x[s2 + 17], x[s3 + 17]);
        var v18 = Vector256.Create(x[s0 + 18], x[s1 + 18], x[s2 + 18], x[s3 + 18]);
        var v19 = Vector256.Create(x[s0 + 19], x[s1 + 19], x[s2 + 19], x[s3 + 19]);
        var v20 = Vector256.Create(x[s0 + 20], x[s1 + 20], x[s2 + 20], x[s3 + 20]);
        Sort(ref v0, ref v1, ref v2, ref v3, ref v4, ref v5, ref v6, ref v7, ref v8, ref v9, ref v10, ref v11, ref v12, ref v13, ref v14, ref v15, ref v16, ref v17, ref v18, ref v19, ref v20);

        for (int t = 0; t < length; t++)
        {
            if (t > 0)
            {
                // Out with the sample before the window, in with its new last one. Taking a value out: below its
                // first copy nothing moves, from there on each place takes its upper neighbour. Putting one in: each
                // place keeps its value if smaller, else takes the larger of the new value and its lower neighbour.
                var leaving = Vector256.Create(x[s0 + t - 1], x[s1 + t - 1], x[s2 + t - 1], x[s3 + t - 1]);
                var entering = Vector256.Create(x[s0 + t + 20], x[s1 + t + 20], x[s2 + t + 20], x[s3 + t + 20]);
                v0 = Vector256.ConditionalSelect(Vector256.LessThan(v0, leaving), v0, v1);
                v1 = Vector256.ConditionalSelect(Vector256.LessThan(v1, leaving), v1, v2);
                v2 = Vector256.ConditionalSelect(Vector256.LessThan(v2, leaving), v2, v3);
                v3 = Vector256.ConditionalSelect(Vector256.LessThan(v3, leaving), v3, v4);
                v4 = Vector256.ConditionalSelect(Vector256.LessThan(v4, leaving), v4, v5);
                v5 = Vector256.ConditionalSelect(Vector256.LessThan(v5, leaving), v5, v6);
                v6 = Vector256.ConditionalSelect(Vector256.LessThan(v6, leaving), v6, v7);
                v7 = Vector256.ConditionalSelect(Vector256.LessThan(v7, leaving), v7, v8);
                v8 = Vector256.ConditionalSelect(Vector256.LessThan(v8, leaving), v8, v9);
                v9 = Vector256.ConditionalSelect(Vector256.LessThan(v9, leaving), v9, v10);
                v10 = Vector256.ConditionalSelect(Vector256.LessThan(v10, leaving), v10, v11);
                v11 = Vector256.ConditionalSelect(Vector256.LessThan(v11, leaving), v11, v12);
                v12 = Vector256.ConditionalSelect(Vector256.LessThan(v12, leaving), v12, v13);
                v13 = Vector256.ConditionalSelect(Vector256.LessThan(v13, leaving), v13, v14);
                v14 = Vector256.ConditionalSelect(Vector256.LessThan(v14, leaving), v14, v15);
                v15 = Vector256.ConditionalSelect(Vector256.LessThan(v15, leaving), v15, v16);
                v16 = Vector256.ConditionalSelect(Vector256.LessThan(v16, leaving), v16, v17);
                v17 = Vector256.ConditionalSelect(Vector256.LessThan(v17, leaving), v17, v18);
                v18 = Vector256.ConditionalSelect(Vector256.LessThan(v18, leaving), v18, v19);
                v19 = Vector256.ConditionalSelect(Vector256.LessThan(v19, leaving), v19, v20);
                v20 = Vector256.MaxNative(entering, v19);
                v19 = Vector256.MinNative(v19, Vector256.MaxNative(entering, v18));
                v18 = Vector256.MinNative(v18, Vector256.MaxNative(entering, v17));
                v17 = Vector256.MinNative(v17, Vector256.MaxNative(entering, v16));
                v16 = Vector256.MinNative(v16, Vector256.MaxNative(entering, v15));
                v15 = Vector256.MinNative(v15, Vector256.MaxNative(entering, v14));
                v14 = Vector256.MinNative(v14, Vector256.MaxNative(entering, v13));
                v13 = Vector256.MinNative(v13, Vector256.MaxNative(entering, v12));
                v12 = Vector256.MinNative(v12, Vector256.MaxNative(entering, v11));
                v11 = Vector256.MinNative(v11, Vector256.MaxNative(entering, v10));
                v10 = Vector256.MinNative(v10, Vector256.MaxNative(entering, v9));
                v9 = Vector256.MinNative(v9, Vector256.MaxNative(entering, v8));
                v8 = Vector256.MinNative(v8, Vector256.MaxNative(entering, v7));
                v7 = Vector256.MinNative(v7, Vector256.MaxNative(entering, v6));
                v6 = Vector256.MinNative(v6, Vector256.MaxNative(entering, v5));
                v5 = Vector256.MinNative(v5, Vector256.MaxNative(entering, v4));
                v4 = Vector256.MinNative(v4, Vector256.MaxNative(entering, v3));
                v3 = Vector256.MinNative(v3, Vector256.MaxNative(entering, v2));
                v2 = Vector256.MinNative(v2, Vector256.MaxNative(entering, v1));
                v1 = Vector256.MinNative(v1, Vector256.MaxNative(entering, v0));
                v0 = Vector256.MinNative(v0, entering);
            }

            var m = v10;
            var centre = Vector256.Create(x[c0 + t], x[c1 + t], x[c2 + t], x[c3 + t]);
            if (screens && !MayBeSpike(centre, m, MadLowerBound(v5, v10, v15), sigmas, floor))
            {
                continue; // no lane can pass the rule with the MAD itself (see MadLowerBound): the usual step
            }
            var mad = Mad(ref v0, ref v1, ref v2, ref v3, ref v4, ref v5, ref v6, ref v7, ref v8, ref v9, ref v10, ref v11, ref v12, ref v13, ref v14, ref v15, ref v16, ref v17, ref v18, ref v19, ref v20);
            uint bits = SpikeBits(centre, m, mad, sigmas, floor);
            while (bits != 0)
            {
                int lane = BitOperations.TrailingZeroCount(bits);
                int at = (lane == 0 ? c0 : lane == 1 ? c1 : lane == 2 ? c2 : c3) + t;
                output[at] = m.GetElement(lane);
                found[lane].Add(at);
                bits &= bits - 1;
            }
        }

        replaced.AddRange(found[0]);
        replaced.AddRange(found[1]);
        replaced.AddRange(found[2].Where(i => i < c3));
        replaced.AddRange(found[3]);
    }

    /// <summary>The MAD of each lane's sorted window about its median v10: the least of max(aₜ, b₁₀₋ₜ).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> Mad(ref Vector256<double> v0, ref Vector256<double> v1, ref Vector256<double> v2, ref Vector256<double> v3, ref Vector256<double> v4, ref Vector256<double> v5, ref Vector256<double> v6, ref Vector256<double> v7, ref Vector256<double> v8, ref Vector256<double> v9, ref Vector256<double> v10, ref Vector256<double> v11, ref Vector256<double> v12, ref Vector256<double> v13, ref Vector256<double> v14, ref Vector256<double> v15, ref Vector256<double> v16, ref Vector256<double> v17, ref Vector256<double> v18, ref Vector256<double> v19, ref Vector256<double> v20)
    {
        // Deviations below the median, m − s₉ … m − s₀, and above it, s₁₁ − m … s₂₀ − m, each ascending; with
        // |s₁₀ − m| = 0 the MAD is the 10th smallest of the two runs together.
        var m = v10;
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
        return mad;
    }

    /// <summary>
    /// A lower bound of each lane's MAD from two of its order statistics: min(m − s₅, s₁₅ − m). Each term
    /// max(m − sₐ, sₐ₊₁₀ − m), a = 1 … 9, of <see cref="Mad"/> (and its first, min(m − s₀, s₂₀ − m)) has a side at least
    /// as far out as s₅ or s₁₅, and m − s and s − m only grow as s moves out (rounding is monotonic), so the MAD, their least,
    /// is not below it, to the bit. It costs three operations where the MAD costs forty.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static Vector256<double> MadLowerBound(Vector256<double> v5, Vector256<double> m, Vector256<double> v15) =>
        Vector256.MinNative(m - v5, v15 - m);

    /// <summary>
    /// Whether any lane could be a spike with a MAD of at least <paramref name="madLowerBound"/>: |x − m| &gt;
    /// n_σ·max(1.4826·bound, floor). max(1.4826·MAD, floor) is not below that scale and n_σ·scale grows with it (for
    /// n_σ ≥ 0, every operation rounding monotonically), so a lane this rejects is no spike by <see cref="SpikeBits"/>
    /// either, and the MAD need not be formed. On noise it rejects nearly every step (the bound is close to the MAD).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static bool MayBeSpike(Vector256<double> centre, Vector256<double> m, Vector256<double> madLowerBound, Vector256<double> sigmas, Vector256<double> floor)
    {
        var scale = Vector256.Max(Vector256.Create(HampelFilter.MadToSigma) * madLowerBound, floor);
        return Vector256.GreaterThanAny(Vector256.Abs(centre - m), sigmas * scale);
    }

    /// <summary>HampelFilter.IsSpike, lane by lane: scale = max(1.4826·MAD, floor) &gt; 0 and |x − m| &gt; n_σ·scale.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static uint SpikeBits(Vector256<double> centre, Vector256<double> m, Vector256<double> mad, Vector256<double> sigmas, Vector256<double> floor)
    {
        var scale = Vector256.Max(Vector256.Create(HampelFilter.MadToSigma) * mad, floor);
        var spike = Vector256.GreaterThan(scale, Vector256<double>.Zero)
            & Vector256.GreaterThan(Vector256.Abs(centre - m), sigmas * scale);
        return spike.ExtractMostSignificantBits();
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
