using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// In-place iterative radix-2 complex FFT on split real/imaginary arrays, single-threaded. A window's statistics
/// already run in parallel with other windows, so a transform that spreads itself over the cores (as the general
/// library's does) only adds contention; this one is about four times cheaper in CPU on a 2¹⁸-point transform.
/// </summary>
/// <remarks>
/// Twiddles: every stage's cos, sin(2πk/L) equals, to the bit, entry k·(N/L) of a longer stage N, because
/// 2π(mk)/(mL) rounds to the same double as 2πk/L when m is a power of two (scaling by a power of two is exact). The
/// stages up to <see cref="ContiguousStages"/> read a small contiguous copy of those values, in order and in vectors.
/// A longer stage (and the real-input steps of a whole-window transform) takes its twiddles from
/// <see cref="FactoredTwiddles"/>: two tables of about √N entries, the twiddle of index j = h·F + l being the angle
/// sum of coarse entry h and fine entry l. A table of N/2 entries (the former way) held 32 MB at the 2²²-point
/// spectrum of a 20-minute window at 1 kHz; the factored tables hold 48 kB, and each twiddle lies within 4.5e-16 of
/// Math.Cos/Math.Sin of its angle and of the exact value (tested), as close to the exact value as the direct one.
/// </remarks>
internal static class RadixTwoFft
{
    /// <summary>
    /// Stages up to this length read a contiguous copy of their twiddles (2¹⁸: 4 MB for all of them). A longer stage
    /// gathers its own from the long table with a stride of a cache line or more, which costs memory traffic: a
    /// whole-window Type A of 1.22 M samples measured about 20 % slower with the copy up to 2¹⁶, 14 % with it up to 2¹⁸,
    /// than with every stage contiguous (one statistics thread, loaded 2-core machine).
    /// </summary>
    internal const int ContiguousStages = 1 << 18;

    /// <summary>Twiddles a longer stage gathers from the long table at a time (16 kB on the stack, in the first-level cache).</summary>
    private const int GatherChunk = 1024;

    private static readonly Lock TableLock = new();
    private static FactoredTwiddles _long = FactoredTwiddles.Build(2);

    /// <summary>Stage L's cos, sin(2πk/L), k &lt; L/2, at [L/2, L), for L ≤ <see cref="ContiguousStages"/>.</summary>
    private static readonly (double[] Cos, double[] Sin) Contiguous = BuildContiguous();

    /// <summary>
    /// X[k] = Σ x[j]·exp(∓2πi·jk/n) over the first <paramref name="n"/> elements (a power of two); the minus sign
    /// when <paramref name="inverse"/> is false. Unnormalised both ways.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Transform(Span<double> re, Span<double> im, int n, bool inverse)
    {
        RequireLength(re, im, n);
        var longStage = n > ContiguousStages ? LongStageFor(n) : null;
        BitReverse(re, im, n);
        RunStages(re, im, n, inverse, longStage);
    }

    /// <summary>
    /// The same transform of an input already at bit-reversed indices (element i at the index of i with its bits
    /// reversed, as <see cref="BitReverse"/> leaves it): for a caller that writes its input there in one pass.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void TransformBitReversed(Span<double> re, Span<double> im, int n, bool inverse)
    {
        RequireLength(re, im, n);
        RunStages(re, im, n, inverse, n > ContiguousStages ? LongStageFor(n) : null);
    }

    private static void RequireLength(Span<double> re, Span<double> im, int n)
    {
        if (n < 1 || (n & (n - 1)) != 0 || re.Length < n || im.Length < n)
        {
            throw new ArgumentException($"FFT length {n} must be a power of two within the buffers.", nameof(n));
        }
    }

    /// <summary>Every butterfly stage over an input in bit-reversed order.</summary>
    private static void RunStages(Span<double> re, Span<double> im, int n, bool inverse, FactoredTwiddles? longStage)
    {
        var (cos, sin) = Contiguous;
        var sign = inverse ? 1.0 : -1.0;
        // The stages up to CacheBlock points run block by block, each block through all of them while it is in
        // cache; only the longer stages sweep the whole array. Every butterfly is the same as stage by stage over
        // the whole array (same inputs, twiddles and order of operations), so the result is the same to the bit.
        var block = Math.Min(n, CacheBlock);
        for (var start = 0; start < n; start += block)
        {
            Stages(re.Slice(start, block), im.Slice(start, block), 2, block, cos, sin, sign);
        }
        Stages(re[..n], im[..n], 2 * block, Math.Min(n, ContiguousStages), cos, sin, sign);
        if (longStage is not null)
        {
            LongStages(re[..n], im[..n], 2 * ContiguousStages, n, longStage, sign);
        }
    }

    /// <summary>Points whose stages run together: 2¹² complex points are 64 kB, within the second-level cache.</summary>
    private const int CacheBlock = 4096;

    /// <summary>The butterfly stages of lengths <paramref name="fromLength"/> … <paramref name="toLength"/> over all of re, im.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Stages(Span<double> re, Span<double> im, int fromLength, int toLength, double[] cos, double[] sin, double sign)
    {
        var n = re.Length;
        for (var length = fromLength; length <= toLength; length <<= 1)
        {
            var half = length >> 1;
            if (!Vector.IsHardwareAccelerated || half < Vector<double>.Count)
            {
                ShortStage(re, im, half, cos, sin, sign);
                continue;
            }
            // This stage's twiddles cos, sin(2πk/length), k < half, sit contiguously at [half, length).
            var wCos = cos.AsSpan(half, half);
            var wSin = sin.AsSpan(half, half);
            for (var start = 0; start < n; start += length)
            {
                Butterflies(re.Slice(start, half), im.Slice(start, half), re.Slice(start + half, half), im.Slice(start + half, half), wCos, wSin, sign);
            }
        }
    }

    /// <summary>
    /// One stage whose half length is below a vector (the first two with four doubles a vector), twiddle by twiddle
    /// over the whole span: the same butterflies with the same expressions as the scalar loop of <see cref="Butterflies"/>, without slicing
    /// four spans for every group of two or four points (the slicing cost about three times the arithmetic there).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void ShortStage(Span<double> re, Span<double> im, int half, double[] cos, double[] sin, double sign)
    {
        var n = re.Length;
        for (var k = 0; k < half; k++)
        {
            var wr = cos[half + k];
            var wi = sign * sin[half + k];
            for (var a = k; a < n; a += 2 * half)
            {
                var b = a + half;
                var xr = re[b];
                var xi = im[b];
                var tr = (xr * wr) - (xi * wi);
                var ti = (xr * wi) + (xi * wr);
                var ar = re[a];
                var ai = im[a];
                re[b] = ar - tr;
                im[b] = ai - ti;
                re[a] = ar + tr;
                im[a] = ai + ti;
            }
        }
    }

    /// <summary>
    /// The stages longer than <see cref="ContiguousStages"/>: their twiddles are every (Size/L)-th index of the
    /// factored tables, made a chunk at a time into the stack and applied to that chunk of every group of the stage.
    /// The butterflies are those of <see cref="Stages"/>, only visited chunk by chunk.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void LongStages(Span<double> re, Span<double> im, int fromLength, int toLength, FactoredTwiddles table, double sign)
    {
        var n = re.Length;
        Span<double> wCos = stackalloc double[GatherChunk];
        Span<double> wSin = stackalloc double[GatherChunk];
        for (var length = fromLength; length <= toLength; length <<= 1)
        {
            var half = length >> 1;
            var stride = table.Size / length;
            for (var from = 0; from < half; from += GatherChunk)
            {
                var count = Math.Min(GatherChunk, half - from);
                table.Fill(from * stride, stride, wCos[..count], wSin[..count]);
                for (var start = 0; start < n; start += length)
                {
                    Butterflies(re.Slice(start + from, count), im.Slice(start + from, count), re.Slice(start + half + from, count), im.Slice(start + half + from, count), wCos[..count], wSin[..count], sign);
                }
            }
        }
    }

    /// <summary>a, b ← a + w·b, a − w·b for each k, with w = cos + i·sign·sin: the butterfly of every stage of a vector or longer.</summary>
    /// <remarks>Inlined into the stage loops (themselves compiled optimised at once), which call it once per group.</remarks>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Butterflies(Span<double> aRe, Span<double> aIm, Span<double> bRe, Span<double> bIm, ReadOnlySpan<double> wCos, ReadOnlySpan<double> wSin, double sign)
    {
        var half = aRe.Length;
        var k = 0;
        if (Vector.IsHardwareAccelerated && half >= Vector<double>.Count)
        {
            var signs = new Vector<double>(sign);
            for (; k <= half - Vector<double>.Count; k += Vector<double>.Count)
            {
                var wr = new Vector<double>(wCos[k..]);
                var wi = signs * new Vector<double>(wSin[k..]);
                var xr = new Vector<double>(bRe[k..]);
                var xi = new Vector<double>(bIm[k..]);
                var tr = (xr * wr) - (xi * wi);
                var ti = (xr * wi) + (xi * wr);
                var ar = new Vector<double>(aRe[k..]);
                var ai = new Vector<double>(aIm[k..]);
                (ar - tr).CopyTo(bRe[k..]);
                (ai - ti).CopyTo(bIm[k..]);
                (ar + tr).CopyTo(aRe[k..]);
                (ai + ti).CopyTo(aIm[k..]);
            }
        }
        for (; k < half; k++)
        {
            var wr = wCos[k];
            var wi = sign * wSin[k];
            var tr = (bRe[k] * wr) - (bIm[k] * wi);
            var ti = (bRe[k] * wi) + (bIm[k] * wr);
            bRe[k] = aRe[k] - tr;
            bIm[k] = aIm[k] - ti;
            aRe[k] += tr;
            aIm[k] += ti;
        }
    }

    /// <summary>
    /// cos and sin of 2πk/n for k &lt; n/2 (n a power of two): the stage of length n, read in place from the contiguous
    /// copy (n ≤ <see cref="ContiguousStages"/>, the exact Math.Cos/Math.Sin values) or made from the factored tables.
    /// These grow to the largest n asked for and serve every smaller one with a stride.
    /// </summary>
    public static StageTwiddles TwiddlesFor(int n)
    {
        if (n < 1 || (n & (n - 1)) != 0)
        {
            throw new ArgumentException($"Twiddle stage length {n} must be a power of two.", nameof(n));
        }
        if (n <= ContiguousStages)
        {
            return new StageTwiddles(Contiguous.Cos, Contiguous.Sin, n / 2, 1, Math.Max(1, n / 2));
        }
        var table = LongStageFor(n);
        return new StageTwiddles(table, table.Size / n, n / 2);
    }

    private static FactoredTwiddles LongStageFor(int n)
    {
        var table = Volatile.Read(ref _long);
        return table.Size >= n ? table : Grow(n);
    }

    /// <summary>The factored tables at <paramref name="n"/> points, built once for the largest size asked for.</summary>
    private static FactoredTwiddles Grow(int n)
    {
        lock (TableLock)
        {
            if (_long.Size >= n)
            {
                return _long;
            }
            var table = FactoredTwiddles.Build(n);
            Volatile.Write(ref _long, table);
            return table;
        }
    }

    private static (double[] Cos, double[] Sin) StageOf(int n)
    {
        var half = n / 2;
        var cos = new double[half];
        var sin = new double[half];
        for (var k = 0; k < half; k++)
        {
            var angle = 2.0 * Math.PI * k / n;
            cos[k] = Math.Cos(angle);
            sin[k] = Math.Sin(angle);
        }
        return (cos, sin);
    }

    /// <summary>
    /// The stages up to <see cref="ContiguousStages"/>, stage L at [L/2, L): the longest computed as 2πk/L, each shorter
    /// one every other entry of the next (the same doubles the expression gives for its own length, see the remarks).
    /// </summary>
    private static (double[] Cos, double[] Sin) BuildContiguous()
    {
        var n = ContiguousStages;
        var (longCos, longSin) = StageOf(n);
        var cos = new double[n];
        var sin = new double[n];
        longCos.CopyTo(cos, n / 2);
        longSin.CopyTo(sin, n / 2);
        for (var length = n / 2; length >= 2; length >>= 1)
        {
            var stageHalf = length >> 1;
            for (var k = 0; k < stageHalf; k++)
            {
                cos[stageHalf + k] = cos[length + (2 * k)];
                sin[stageHalf + k] = sin[length + (2 * k)];
            }
        }
        return (cos, sin);
    }

    /// <summary>
    /// Puts element i at the bit-reversed index of i (n a power of two): the straightforward pass for small n, else
    /// tile by tile. Index bits split as [a: 3 | m | c: 3]; i = (a, m, c) goes to (rev c, rev m, rev a), so the 64
    /// elements of tile m (8 runs of 8 contiguous values, one cache line each) trade places with those of tile rev m.
    /// Both tiles stay in the first-level cache while they swap, where the straightforward pass reads each partner a
    /// megabyte away and misses the cache on almost every swap (3-4 times slower at 2²⁰ points). A permutation either
    /// way: the values are the same to the bit.
    /// </summary>
    internal static void BitReverse(Span<double> re, Span<double> im, int n)
    {
        var bits = BitOperations.Log2((uint)Math.Max(n, 1));
        if (bits < 2 * TileBits)
        {
            BitReverseStraight(re, im, n);
            return;
        }
        const int side = 1 << TileBits;
        var middleBits = bits - (2 * TileBits);
        var high = bits - TileBits;
        Span<int> reversed = stackalloc int[side];
        for (var a = 0; a < side; a++)
        {
            reversed[a] = Reverse(a, TileBits);
        }
        re = re[..n];
        im = im[..n];
        for (var m = 0; m < 1 << middleBits; m++)
        {
            var mirror = Reverse(m, middleBits);
            if (mirror < m)
            {
                continue; // swapped already, from tile mirror
            }
            for (var a = 0; a < side; a++)
            {
                var iBase = (a << high) | (m << TileBits);
                var jBase = (mirror << TileBits) | reversed[a];
                for (var c = 0; c < side; c++)
                {
                    var i = iBase | c;
                    var j = (reversed[c] << high) | jBase;
                    // Two tiles: every pair once. One tile (its own mirror): each pair from its lower index.
                    if (mirror > m || i < j)
                    {
                        (re[i], re[j]) = (re[j], re[i]);
                        (im[i], im[j]) = (im[j], im[i]);
                    }
                }
            }
        }
    }

    /// <summary>Low and high index bits of a bit-reversal tile: 2³ doubles are one 64-byte cache line.</summary>
    internal const int TileBits = 3;

    /// <summary>The lowest <paramref name="bits"/> bits of <paramref name="x"/> in reverse order.</summary>
    internal static int Reverse(int x, int bits)
    {
        var v = (uint)x;
        v = ((v >> 1) & 0x55555555u) | ((v & 0x55555555u) << 1);
        v = ((v >> 2) & 0x33333333u) | ((v & 0x33333333u) << 2);
        v = ((v >> 4) & 0x0F0F0F0Fu) | ((v & 0x0F0F0F0Fu) << 4);
        v = ((v >> 8) & 0x00FF00FFu) | ((v & 0x00FF00FFu) << 8);
        v = (v >> 16) | (v << 16);
        return bits == 0 ? 0 : (int)(v >> (32 - bits));
    }

    /// <summary>The straightforward bit-reversal pass: j runs as i reversed, each pair swapped from its lower index.</summary>
    internal static void BitReverseStraight(Span<double> re, Span<double> im, int n)
    {
        for (int i = 1, j = 0; i < n; i++)
        {
            var bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1)
            {
                j ^= bit;
            }
            j ^= bit;
            if (i < j)
            {
                (re[i], re[j]) = (re[j], re[i]);
                (im[i], im[j]) = (im[j], im[i]);
            }
        }
    }
}
