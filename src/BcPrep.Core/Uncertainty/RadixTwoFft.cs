using System.Collections.Concurrent;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// In-place iterative radix-2 complex FFT on split real/imaginary arrays, single-threaded. A window's statistics
/// already run in parallel with other windows, so a transform that spreads itself over the cores (as the general
/// library's does) only adds contention; this one is about four times cheaper in CPU on a 2¹⁸-point transform.
/// </summary>
internal static class RadixTwoFft
{
    private static readonly ConcurrentDictionary<int, (double[] Cos, double[] Sin)> Twiddles = new();
    private static readonly ConcurrentDictionary<int, (double[] Cos, double[] Sin)> StageTwiddles = new();

    /// <summary>
    /// X[k] = Σ x[j]·exp(∓2πi·jk/n) over the first <paramref name="n"/> elements (a power of two); the minus sign
    /// when <paramref name="inverse"/> is false. Unnormalised both ways.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Transform(Span<double> re, Span<double> im, int n, bool inverse)
    {
        if (n < 1 || (n & (n - 1)) != 0 || re.Length < n || im.Length < n)
        {
            throw new ArgumentException($"FFT length {n} must be a power of two within the buffers.", nameof(n));
        }
        BitReverse(re, im, n);
        var (cos, sin) = StageTwiddlesFor(n);
        var sign = inverse ? 1.0 : -1.0;
        // The stages up to CacheBlock points run block by block, each block through all of them while it is in
        // cache; only the longer stages sweep the whole array. Every butterfly is the same as stage by stage over
        // the whole array (same inputs, twiddles and order of operations), so the result is the same to the bit.
        var block = Math.Min(n, CacheBlock);
        for (var start = 0; start < n; start += block)
        {
            Stages(re.Slice(start, block), im.Slice(start, block), 2, block, cos, sin, sign);
        }
        Stages(re[..n], im[..n], 2 * block, n, cos, sin, sign);
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
            // This stage's twiddles cos, sin(2πk/length), k < half, sit contiguously at [half, length).
            var wCos = cos.AsSpan(half, half);
            var wSin = sin.AsSpan(half, half);
            for (var start = 0; start < n; start += length)
            {
                var aRe = re.Slice(start, half);
                var aIm = im.Slice(start, half);
                var bRe = re.Slice(start + half, half);
                var bIm = im.Slice(start + half, half);
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
        }
    }

    /// <summary>
    /// The twiddles of every stage, the stage of length L at [L/2, L): entry L/2 + k is cos, sin(2πk/L), taken from
    /// <see cref="TwiddlesFor"/> at k·n/L so the values are those of the full table. Contiguous per stage, so a
    /// stage reads them in order (and in vectors) instead of with a stride of n/L.
    /// </summary>
    private static (double[] Cos, double[] Sin) StageTwiddlesFor(int n) => StageTwiddles.GetOrAdd(n, static size =>
    {
        var (cos, sin) = TwiddlesFor(size);
        var stageCos = new double[Math.Max(1, size)];
        var stageSin = new double[Math.Max(1, size)];
        for (var length = 2; length <= size; length <<= 1)
        {
            var half = length >> 1;
            var stride = size / length;
            for (var k = 0; k < half; k++)
            {
                stageCos[half + k] = cos[k * stride];
                stageSin[half + k] = sin[k * stride];
            }
        }
        return (stageCos, stageSin);
    });

    /// <summary>cos and sin of 2πk/n for k &lt; n/2, kept per size: the autocorrelation of a day's windows reuses a few sizes.</summary>
    public static (double[] Cos, double[] Sin) TwiddlesFor(int n) => Twiddles.GetOrAdd(n, static size =>
    {
        var count = Math.Max(1, size / 2);
        var cos = new double[count];
        var sin = new double[count];
        for (var k = 0; k < count; k++)
        {
            var angle = 2.0 * Math.PI * k / size;
            cos[k] = Math.Cos(angle);
            sin[k] = Math.Sin(angle);
        }
        return (cos, sin);
    });

    private static void BitReverse(Span<double> re, Span<double> im, int n)
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
