using System.Collections.Concurrent;
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
        var (cos, sin) = TwiddlesFor(n);
        var sign = inverse ? 1.0 : -1.0;
        for (var length = 2; length <= n; length <<= 1)
        {
            var half = length >> 1;
            var stride = n / length;
            for (var start = 0; start < n; start += length)
            {
                for (var k = 0; k < half; k++)
                {
                    var wr = cos[k * stride];
                    var wi = sign * sin[k * stride];
                    var a = start + k;
                    var b = a + half;
                    var tr = (re[b] * wr) - (im[b] * wi);
                    var ti = (re[b] * wi) + (im[b] * wr);
                    re[b] = re[a] - tr;
                    im[b] = im[a] - ti;
                    re[a] += tr;
                    im[a] += ti;
                }
            }
        }
    }

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
