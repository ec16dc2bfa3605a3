namespace BcPrep.Uncertainty;

/// <summary>
/// The biased sample autocorrelation at every lag, ρ̂(k) = Σᵢ dᵢ dᵢ₊ₖ / Σᵢ dᵢ² with d = x − mean (the estimator
/// of MathNet's Correlation.Auto), by the Wiener–Khinchin route: the inverse transform of |D(f)|² with D the
/// transform of d zero-padded to N ≥ 2n, so the circular sums equal the linear ones. The real sequence of length N
/// travels as N/2 complex points (even samples real, odd imaginary), which halves the transform.
/// </summary>
internal static class FftAutocorrelation
{
    public static double[] Compute(ReadOnlySpan<double> samples, double mean)
    {
        var rho = new double[samples.Length];
        Compute(samples, mean, rho);
        return rho;
    }

    /// <summary>Writes ρ̂(k), k &lt; n, into the first n elements of <paramref name="rho"/>.</summary>
    public static void Compute(ReadOnlySpan<double> samples, double mean, Span<double> rho)
    {
        var n = samples.Length;
        if (n == 0)
        {
            return;
        }
        if (rho.Length < n)
        {
            throw new ArgumentException($"The output holds {rho.Length} lags, fewer than the window's {n}.", nameof(rho));
        }
        var (re, im) = UnnormalisedLags(samples, mean);
        Normalised(re, im, rho[..n]);
    }

    /// <summary>
    /// The lag sums before the division by the zero lag: lag k is in re[k/2] for even k and im[k/2] for odd k, in the
    /// thread's FFT scratch, valid until the thread's next transform. ρ̂(k) is that value divided by the zero lag
    /// (re[0]), the same bits as <see cref="Compute(ReadOnlySpan{double}, double, Span{double})"/> writes, without an
    /// array of the window's length for them.
    /// </summary>
    public static (double[] Re, double[] Im) UnnormalisedLags(ReadOnlySpan<double> samples, double mean) =>
        UnnormalisedLags(samples, mean, 2 * ComplexPoints(samples.Length));

    /// <summary>
    /// As <see cref="UnnormalisedLags(ReadOnlySpan{double}, double)"/> with a transform of <paramref name="size"/> real
    /// points (a power of two ≥ n): the circular sums at lag k are r(k) + r(size − k), so only the lags
    /// k ≤ size − n are the linear ones (r(size − k) = 0 there). Stored as there, at <paramref name="size"/> / 2 complex points.
    /// </summary>
    public static (double[] Re, double[] Im) UnnormalisedLags(ReadOnlySpan<double> samples, double mean, int size)
    {
        if (size < 2 || (size & (size - 1)) != 0 || size < samples.Length)
        {
            throw new ArgumentException($"Transform size {size} must be a power of two ≥ 2 and ≥ the window's {samples.Length} samples.", nameof(size));
        }
        var half = size / 2;
        var re = ThreadScratch.Rent(ScratchSlots.FftReal, half);
        var im = ThreadScratch.Rent(ScratchSlots.FftImaginary, half);
        // The long twiddle table is grown to this size before the transforms of half of it, which read it with a
        // stride, so it is built once at its final size.
        var twiddles = RadixTwoFft.TwiddlesFor(size);
        PackBitReversed(samples, mean, re, im, half);
        RadixTwoFft.TransformBitReversed(re, im, half, inverse: false);
        PowerSpectrumPacked(re, im, size, twiddles);
        RadixTwoFft.Transform(re, im, half, inverse: true);
        return (re, im);
    }

    /// <summary>
    /// Complex points of the transform of <paramref name="n"/> samples, the length of each of its two arrays: half the
    /// smallest power of two ≥ 2n (at least 1).
    /// </summary>
    public static int ComplexPoints(int n)
    {
        var size = 2;
        while (size < 2 * n)
        {
            size <<= 1;
        }
        return size / 2;
    }

    /// <summary>
    /// <see cref="Pack"/> and the forward transform's bit reversal in one pass: packed point m (samples 2m, 2m + 1 less
    /// the mean, zero past the window) goes straight to the index of m with its bits reversed, and every index is
    /// written once, so the arrays need no clearing first. Index bits split as [a: 3 | mid | c: 3] as in
    /// <see cref="RadixTwoFft.BitReverse"/>: for each mid, 8 runs of 8 packed points (read in order, 8 streams) fill one
    /// tile of 8 cache lines at the reversed mid. The same values at the same indices as packing then reversing.
    /// </summary>
    internal static void PackBitReversed(ReadOnlySpan<double> samples, double mean, double[] re, double[] im, int half)
    {
        var bits = System.Numerics.BitOperations.Log2((uint)Math.Max(half, 1));
        const int tileBits = RadixTwoFft.TileBits;
        if (bits < 2 * tileBits)
        {
            Pack(samples, mean, re, im, half);
            RadixTwoFft.BitReverse(re, im, half);
            return;
        }
        const int side = 1 << tileBits;
        var middleBits = bits - (2 * tileBits);
        var high = bits - tileBits;
        Span<int> reversed = stackalloc int[side];
        for (var a = 0; a < side; a++)
        {
            reversed[a] = RadixTwoFft.Reverse(a, tileBits);
        }
        var n = samples.Length;
        for (var mid = 0; mid < 1 << middleBits; mid++)
        {
            var column = RadixTwoFft.Reverse(mid, middleBits) << tileBits;
            for (var a = 0; a < side; a++)
            {
                var first = (a << high) | (mid << tileBits);
                var target = column | reversed[a];
                for (var c = 0; c < side; c++)
                {
                    var i = 2 * (first | c);
                    var j = (reversed[c] << high) | target;
                    re[j] = i < n ? samples[i] - mean : 0.0;
                    im[j] = i + 1 < n ? samples[i + 1] - mean : 0.0;
                }
            }
        }
    }

    /// <summary>Packed point m = (samples 2m, 2m + 1 less the mean) at index m, zeros past the window, in natural order.</summary>
    internal static void Pack(ReadOnlySpan<double> samples, double mean, double[] re, double[] im, int half)
    {
        Array.Clear(re, 0, half);
        Array.Clear(im, 0, half);
        for (var i = 0; i < samples.Length; i++)
        {
            if ((i & 1) == 0)
            {
                re[i >> 1] = samples[i] - mean;
            }
            else
            {
                im[i >> 1] = samples[i] - mean;
            }
        }
    }

    /// <summary>
    /// In place, from the half-length transform Z of the packed sequence to the packed power spectrum for the
    /// half-length inverse transform. |X[k]|² for k = 0…N/2, with X[k] = E[k] + e^(−2πik/N)·O[k],
    /// E = (Z[k] + Z*[N/2−k])/2 and O = (Z[k] − Z*[N/2−k])/(2i), the transforms of the even and odd samples. The real,
    /// even spectrum P is then packed so that the inverse transform holds the even lags in its real part and the odd
    /// lags in its imaginary part: Y[k] = E[k] + i·e^(+2πik/N)·O[k] with E = (P[k] + P[N/2−k])/2 and
    /// O = (P[k] − P[N/2−k])/2. Both steps read only the pair k, N/2 − k, so the pair is done together, in place.
    /// </summary>
    private static void PowerSpectrumPacked(double[] re, double[] im, int size, StageTwiddles twiddles)
    {
        var half = size / 2;
        // k = 0 and k = N/2 both come from Z[0] alone (the twiddle of N/2 is −1).
        var (cos0, sin0) = twiddles.At(0);
        var p0 = Power(re[0], im[0], re[0], -im[0], cos0, -sin0);
        var pHalf = Power(re[0], im[0], re[0], -im[0], -1.0, 0.0);
        (re[0], im[0]) = Packed(p0, pHalf, cos0, sin0);
        for (var k = 1; k <= half / 2; k++)
        {
            var j = half - k;
            var zkRe = re[k];
            var zkIm = im[k];
            var zjRe = re[j];
            var zjIm = im[j];
            var (cosK, sinK) = twiddles.At(k);
            var (cosJ, sinJ) = twiddles.At(j);
            var pk = Power(zkRe, zkIm, zjRe, -zjIm, cosK, -sinK);
            var pj = Power(zjRe, zjIm, zkRe, -zkIm, cosJ, -sinJ);
            (re[k], im[k]) = Packed(pk, pj, cosK, sinK);
            if (j != k)
            {
                (re[j], im[j]) = Packed(pj, pk, cosJ, sinJ);
            }
        }
    }

    /// <summary>|X[k]|² from Z[k] = (zr, zi), Z*[N/2−k] = (cr, ci) and the twiddle e^(−2πik/N) = (wr, wi).</summary>
    private static double Power(double zr, double zi, double cr, double ci, double wr, double wi)
    {
        var evenRe = 0.5 * (zr + cr);
        var evenIm = 0.5 * (zi + ci);
        var oddRe = 0.5 * (zi - ci);
        var oddIm = -0.5 * (zr - cr);
        var xr = evenRe + ((wr * oddRe) - (wi * oddIm));
        var xi = evenIm + ((wr * oddIm) + (wi * oddRe));
        return (xr * xr) + (xi * xi);
    }

    /// <summary>Y[k] from P[k], P[N/2−k] and cos, sin(2πk/N).</summary>
    private static (double Re, double Im) Packed(double pk, double pMirror, double cos, double sin)
    {
        var even = 0.5 * (pk + pMirror);
        var odd = 0.5 * (pk - pMirror);
        return (even - (odd * sin), odd * cos);
    }

    private static void Normalised(double[] re, double[] im, Span<double> rho)
    {
        for (var i = 0; i < rho.Length; i++)
        {
            rho[i] = (i & 1) == 0 ? re[i >> 1] : im[i >> 1];
        }
        var zeroLag = rho[0];
        for (var i = 0; i < rho.Length; i++)
        {
            rho[i] /= zeroLag;
        }
    }
}
