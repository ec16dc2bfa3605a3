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
        var n = samples.Length;
        if (n == 0)
        {
            return [];
        }
        var size = 2;
        while (size < 2 * n)
        {
            size <<= 1;
        }
        var half = size / 2;
        var re = ThreadScratch.Rent(ScratchSlots.FftReal, half);
        var im = ThreadScratch.Rent(ScratchSlots.FftImaginary, half);
        var power = ThreadScratch.Rent(ScratchSlots.FftPower, half + 1);
        Pack(samples, mean, re, im, half);
        RadixTwoFft.Transform(re, im, half, inverse: false);
        PowerSpectrum(re, im, power, size);
        PackSymmetricSpectrum(power, re, im, size);
        RadixTwoFft.Transform(re, im, half, inverse: true);
        return Normalised(re, im, n);
    }

    private static void Pack(ReadOnlySpan<double> samples, double mean, double[] re, double[] im, int half)
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
    /// |X[k]|² for k = 0…N/2 from the half-length transform Z of the packed sequence: X[k] = E[k] + e^(−2πik/N)·O[k]
    /// with E = (Z[k] + Z*[N/2−k])/2 and O = (Z[k] − Z*[N/2−k])/(2i), the transforms of the even and odd samples.
    /// </summary>
    private static void PowerSpectrum(double[] re, double[] im, double[] power, int size)
    {
        var half = size / 2;
        var (cos, sin) = RadixTwoFft.TwiddlesFor(size);
        for (var k = 0; k <= half; k++)
        {
            var k1 = k % half;
            var k2 = (half - k) % half;
            var zr = re[k1];
            var zi = im[k1];
            var cr = re[k2];
            var ci = -im[k2];
            var evenRe = 0.5 * (zr + cr);
            var evenIm = 0.5 * (zi + ci);
            var oddRe = 0.5 * (zi - ci);
            var oddIm = -0.5 * (zr - cr);
            var wr = k < half ? cos[k] : -1.0;
            var wi = k < half ? -sin[k] : 0.0;
            var xr = evenRe + ((wr * oddRe) - (wi * oddIm));
            var xi = evenIm + ((wr * oddIm) + (wi * oddRe));
            power[k] = (xr * xr) + (xi * xi);
        }
    }

    /// <summary>
    /// Packs the real, even spectrum P for the half-length inverse transform, whose output then holds the even lags
    /// in its real part and the odd lags in its imaginary part: Y[k] = E[k] + i·e^(+2πik/N)·O[k] with
    /// E = (P[k] + P[N/2−k])/2 and O = (P[k] − P[N/2−k])/2.
    /// </summary>
    private static void PackSymmetricSpectrum(double[] power, double[] re, double[] im, int size)
    {
        var half = size / 2;
        var (cos, sin) = RadixTwoFft.TwiddlesFor(size);
        for (var k = 0; k < half; k++)
        {
            var even = 0.5 * (power[k] + power[half - k]);
            var odd = 0.5 * (power[k] - power[half - k]);
            re[k] = even - (odd * sin[k]);
            im[k] = odd * cos[k];
        }
    }

    private static double[] Normalised(double[] re, double[] im, int n)
    {
        var rho = new double[n];
        for (var i = 0; i < n; i++)
        {
            rho[i] = (i & 1) == 0 ? re[i >> 1] : im[i >> 1];
        }
        var zeroLag = rho[0];
        for (var i = 0; i < n; i++)
        {
            rho[i] /= zeroLag;
        }
        return rho;
    }
}
