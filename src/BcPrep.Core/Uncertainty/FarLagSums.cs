using System.Runtime.CompilerServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// The lagged products r(k) = Σᵢ dᵢ dᵢ₊ₖ (d = x − mean) of the far lags k ≥ K of a window of n samples, and only
/// those: r(K + j) = Σᵢ aᵢ bᵢ₊ⱼ with a = d[0, m) and b = d[K, n), m = n − K, the cross-correlation of the window's
/// first m deviations with its last m. Both travel in one complex transform of M ≥ 2m points, z = a + i·b, so no sum
/// wraps around: A(f) = (Z(f) + Z*(M − f))/2, B(f) = (Z(f) − Z*(M − f))/(2i), and the inverse transform of A*(f)·B(f)
/// (Hermitian, so its result is real) holds M·r(K + j) at index j. With K = size − n + 1 of a whole-window
/// transform of size points, which gives the lags below K (<see cref="FftAutocorrelation.UnnormalisedLags(ReadOnlySpan{double}, double, int)"/>),
/// the two cover every lag with transforms of at most half the points of the one whole-window transform that
/// zero-pads to 2n.
/// </summary>
internal static class FarLagSums
{
    /// <summary>
    /// Writes M·r(<paramref name="firstLag"/> + j), j &lt; n − firstLag, into <paramref name="re"/>[j] (M =
    /// <paramref name="points"/>, a power of two ≥ 2(n − firstLag)); <paramref name="re"/> and <paramref name="im"/> hold
    /// at least M values and are overwritten.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Compute(ReadOnlySpan<double> samples, double mean, int firstLag, double[] re, double[] im, int points)
    {
        var n = samples.Length;
        var m = n - firstLag;
        if (firstLag < 1 || m < 1 || points < 2 * m || (points & (points - 1)) != 0 || re.Length < points || im.Length < points)
        {
            throw new ArgumentException($"Far lags from {firstLag} of {n} samples need a power of two ≥ {2 * Math.Max(m, 1)} points within the arrays, not {points}.", nameof(points));
        }
        for (var i = 0; i < m; i++)
        {
            re[i] = samples[i] - mean;
            im[i] = samples[firstLag + i] - mean;
        }
        Array.Clear(re, m, points - m);
        Array.Clear(im, m, points - m);
        RadixTwoFft.Transform(re, im, points, inverse: false);
        for (var f = 0; f <= points / 2; f++)
        {
            var g = (points - f) & (points - 1);
            var (sRe, sIm) = CrossSpectrum(re[f], im[f], re[g], im[g]);
            // S(M − f) = S*(f): the pair is written together, in place.
            re[f] = sRe;
            im[f] = sIm;
            re[g] = sRe;
            im[g] = -sIm;
        }
        RadixTwoFft.Transform(re, im, points, inverse: true);
    }

    /// <summary>A*(f)·B(f) from Z(f) = (p, q) and Z(M − f) = (r, s).</summary>
    private static (double Re, double Im) CrossSpectrum(double p, double q, double r, double s)
    {
        var aRe = 0.5 * (p + r);
        var aIm = 0.5 * (q - s);
        var bRe = 0.5 * (q + s);
        var bIm = -0.5 * (p - r);
        return ((aRe * bRe) + (aIm * bIm), (aRe * bIm) - (aIm * bRe));
    }
}
