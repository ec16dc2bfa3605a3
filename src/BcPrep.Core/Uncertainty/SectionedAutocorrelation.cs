using System.Runtime.CompilerServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// The lagged products r(k) = Σᵢ dᵢ dᵢ₊ₖ (d = x − mean) for the first L lags only, by sectioned correlation: the window
/// is cut into blocks of L samples, each block's transform at size 2L (zero-padded, so it stays in cache) is taken
/// once, and the spectra are accumulated as C(f) = Σⱼ |Aⱼ(f)|² + (−1)^f Σⱼ A*ⱼ(f) Aⱼ₊₁(f); one inverse transform of C
/// gives r(k), k &lt; L. The second sum is the correlation of block j with the block after it (shifting a block by L
/// at size 2L multiplies its transform by (−1)^f), so every product dᵢdᵢ₊ₖ with k &lt; L is counted once and none
/// wraps around. Cost about n·log₂(2L) instead of the whole window's 2n·log₂(2n), with scratch of order L.
/// Each real sequence of 2L travels as L complex points (even samples real, odd imaginary), as in
/// <see cref="FftAutocorrelation"/>.
/// </summary>
internal static class SectionedAutocorrelation
{
    /// <summary>Writes r(k) for k in [<paramref name="firstLag"/>, <paramref name="blockLength"/>) into <paramref name="sums"/>[k].</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Compute(ReadOnlySpan<double> samples, double mean, int blockLength, int firstLag, Span<double> sums)
    {
        var n = samples.Length;
        var l = blockLength;
        if (l < 2 || (l & (l - 1)) != 0 || firstLag < 0 || firstLag >= l || sums.Length < l)
        {
            throw new ArgumentException($"Block length {l} must be a power of two ≥ 2 above the first lag {firstLag}, within the output.", nameof(blockLength));
        }
        var re = ThreadScratch.Rent(ScratchSlots.FftReal, l + 1);
        var im = ThreadScratch.Rent(ScratchSlots.FftImaginary, l + 1);
        var previousRe = ThreadScratch.Rent(ScratchSlots.SectionPreviousReal, l + 1);
        var previousIm = ThreadScratch.Rent(ScratchSlots.SectionPreviousImaginary, l + 1);
        var sumRe = ThreadScratch.Rent(ScratchSlots.FftPower, l + 1);
        var sumIm = ThreadScratch.Rent(ScratchSlots.SectionSumImaginary, l + 1);
        Array.Clear(sumRe, 0, l + 1);
        Array.Clear(sumIm, 0, l + 1);
        var twiddles = RadixTwoFft.TwiddlesFor(2 * l);
        var first = true;
        for (var start = 0; start < n; start += l)
        {
            Pack(samples.Slice(start, Math.Min(l, n - start)), mean, re, im, l);
            RadixTwoFft.Transform(re, im, l, inverse: false);
            Unpack(re, im, l, twiddles);
            Accumulate(re, im, previousRe, previousIm, sumRe, sumIm, l, first);
            (re, previousRe) = (previousRe, re);
            (im, previousIm) = (previousIm, im);
            first = false;
        }
        PackHermitian(sumRe, sumIm, re, im, l, twiddles);
        RadixTwoFft.Transform(re, im, l, inverse: true);
        // z = IDFT_L(E + iO) holds L·r(2q) + i·L·r(2q + 1); L is a power of two, so the division is exact.
        var scale = 1.0 / l;
        for (var k = firstLag; k < l; k++)
        {
            sums[k] = ((k & 1) == 0 ? re[k >> 1] : im[k >> 1]) * scale;
        }
    }

    private static void Pack(ReadOnlySpan<double> block, double mean, double[] re, double[] im, int l)
    {
        Array.Clear(re, 0, l);
        Array.Clear(im, 0, l);
        for (var i = 0; i < block.Length; i++)
        {
            if ((i & 1) == 0)
            {
                re[i >> 1] = block[i] - mean;
            }
            else
            {
                im[i >> 1] = block[i] - mean;
            }
        }
    }

    /// <summary>
    /// In place, Z (the L-point transform of the packed block) → X[k], k = 0…L, the 2L-point transform of the block:
    /// X[k] = E[k] + e^(−2πik/2L)·O[k], E = (Z[k] + Z*[L−k])/2, O = (Z[k] − Z*[L−k])/(2i). X[k] and X[L−k] both come
    /// from Z[k] and Z[L−k], so they are written together.
    /// </summary>
    private static void Unpack(double[] re, double[] im, int l, StageTwiddles twiddles)
    {
        var z0Re = re[0];
        var z0Im = im[0];
        // k = 0 and k = L from Z[0] alone: X[0] = Re Z + Im Z, X[L] = Re Z − Im Z.
        re[0] = z0Re + z0Im;
        im[0] = 0.0;
        re[l] = z0Re - z0Im;
        im[l] = 0.0;
        for (var k = 1; k <= l / 2; k++)
        {
            var j = l - k;
            var aRe = re[k];
            var aIm = im[k];
            var bRe = re[j];
            var bIm = im[j];
            var (cosK, sinK) = twiddles.At(k);
            (re[k], im[k]) = Half(aRe, aIm, bRe, bIm, cosK, sinK);
            if (j != k)
            {
                var (cosJ, sinJ) = twiddles.At(j);
                (re[j], im[j]) = Half(bRe, bIm, aRe, aIm, cosJ, sinJ);
            }
        }
    }

    /// <summary>X[k] from Z[k] = a and Z[L−k] = b, with the twiddle cos, sin(2πk/2L).</summary>
    private static (double Re, double Im) Half(double aRe, double aIm, double bRe, double bIm, double c, double s)
    {
        var evenRe = 0.5 * (aRe + bRe);
        var evenIm = 0.5 * (aIm - bIm);
        var oddRe = 0.5 * (aIm + bIm);
        var oddIm = -0.5 * (aRe - bRe);
        return (evenRe + ((c * oddRe) + (s * oddIm)), evenIm + ((c * oddIm) - (s * oddRe)));
    }

    /// <summary>C[k] += |X[k]|² + (−1)^k·X*_previous[k]·X[k], k = 0…L.</summary>
    private static void Accumulate(double[] re, double[] im, double[] previousRe, double[] previousIm, double[] sumRe, double[] sumIm, int l, bool first)
    {
        for (var k = 0; k <= l; k++)
        {
            var xr = re[k];
            var xi = im[k];
            var power = (xr * xr) + (xi * xi);
            if (first)
            {
                sumRe[k] += power;
                continue;
            }
            var pr = previousRe[k];
            var pi = previousIm[k];
            var crossRe = (pr * xr) + (pi * xi);
            var crossIm = (pr * xi) - (pi * xr);
            if ((k & 1) == 0)
            {
                sumRe[k] += power + crossRe;
                sumIm[k] += crossIm;
            }
            else
            {
                sumRe[k] += power - crossRe;
                sumIm[k] -= crossIm;
            }
        }
    }

    /// <summary>
    /// The Hermitian spectrum C[k], k = 0…L, of a real sequence c of 2L, packed for the L-point inverse transform whose
    /// output is c(2q) + i·c(2q + 1) (times L): Z[k] = E[k] + i·O[k] with E = (C[k] + C*[L−k])/2 and
    /// O = (C[k] − C*[L−k])·e^(+2πik/2L)/2.
    /// </summary>
    private static void PackHermitian(double[] sumRe, double[] sumIm, double[] re, double[] im, int l, StageTwiddles twiddles)
    {
        for (var k = 0; k < l; k++)
        {
            var cr = sumRe[k];
            var ci = sumIm[k];
            var dr = sumRe[l - k];
            var di = -sumIm[l - k];
            var evenRe = 0.5 * (cr + dr);
            var evenIm = 0.5 * (ci + di);
            var tr = 0.5 * (cr - dr);
            var ti = 0.5 * (ci - di);
            var (cos, sin) = twiddles.At(k);
            var oddRe = (tr * cos) - (ti * sin);
            var oddIm = (tr * sin) + (ti * cos);
            re[k] = evenRe - oddIm;
            im[k] = evenIm + oddRe;
        }
    }
}
