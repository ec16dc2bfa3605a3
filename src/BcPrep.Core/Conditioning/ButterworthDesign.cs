using System.Globalization;
using System.Numerics;

namespace BcPrep.Conditioning;

/// <summary>Digital Butterworth low-pass design in double precision.</summary>
public static class ButterworthDesign
{
    /// <summary>Highest order accepted; beyond it the transfer-function form loses all useful digits.</summary>
    public const int MaxOrder = 20;

    /// <summary>
    /// Butterworth low-pass of order <paramref name="order"/> with −3 dB cutoff <paramref name="cutoffHz"/> at sample
    /// rate <paramref name="sampleRateHz"/>. Method: analog prototype poles s_k = Ω_c·exp[jπ(2k + N − 1)/(2N)],
    /// k = 1…N, prewarped Ω_c = 2 f_s tan(π f_c / f_s), bilinear transform z = (2 f_s + s)/(2 f_s − s), all N zeros
    /// at z = −1, gain set for unit DC gain. Equivalent to scipy.signal.butter(N, f_c/(f_s/2)).
    /// Sections: a first-order section first when N is odd, then conjugate pole pairs ordered from the pole farthest
    /// from the unit circle to the nearest; the overall gain sits in the first section's numerator.
    /// </summary>
    /// <exception cref="BcPrepDataException">order outside 1…20, f_s not positive and finite, or f_c not in (0, f_s/2).</exception>
    public static IirFilter LowPass(int order, double cutoffHz, double sampleRateHz)
    {
        Validate(order, cutoffHz, sampleRateHz);
        double k = Math.Tan(Math.PI * cutoffHz / sampleRateHz); // Ω_c / (2 f_s)
        var poles = new Complex[order];
        var gainProduct = Complex.One;
        for (int i = 1; i <= order; i++)
        {
            var s = Complex.FromPolarCoordinates(k, Math.PI * ((2 * i) + order - 1) / (2.0 * order));
            poles[i - 1] = (1.0 + s) / (1.0 - s);
            gainProduct *= -s / (1.0 - s); // (1 − p)/2 without the cancellation of 1 − p near z = 1
        }

        double[] a = FilterPolynomial.FromRoots(poles);
        double[] b = Binomial(order);
        double gain = gainProduct.Real;
        for (int i = 0; i < b.Length; i++)
        {
            b[i] *= gain;
        }

        return new IirFilter(BuildSections(poles, gain), b, a);
    }

    private static void Validate(int order, double cutoffHz, double sampleRateHz)
    {
        if (order < 1 || order > MaxOrder)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Butterworth order {order} is outside the accepted range 1…{MaxOrder}."));
        }

        if (!double.IsFinite(sampleRateHz) || sampleRateHz <= 0.0)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Sample rate {sampleRateHz} Hz must be positive and finite."));
        }

        if (!double.IsFinite(cutoffHz) || cutoffHz <= 0.0 || cutoffHz >= sampleRateHz / 2.0)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Low-pass cutoff {cutoffHz} Hz must lie strictly between 0 and the Nyquist frequency {sampleRateHz / 2.0} Hz."));
        }
    }

    private static double[] Binomial(int n)
    {
        var c = new double[n + 1];
        c[0] = 1.0;
        for (int i = 1; i <= n; i++)
        {
            c[i] = c[i - 1] * (n - i + 1) / i;
        }

        return c;
    }

    private static SecondOrderSection[] BuildSections(Complex[] poles, double gain)
    {
        var sections = new List<SecondOrderSection>();
        var upperPoles = poles.Where(p => p.Imaginary > 1e-14).OrderBy(p => p.Magnitude).ToList();
        var realPoles = poles.Where(p => Math.Abs(p.Imaginary) <= 1e-14).ToList();
        foreach (var p in realPoles)
        {
            sections.Add(new SecondOrderSection(1.0, 1.0, 0.0, -p.Real, 0.0));
        }

        foreach (var p in upperPoles)
        {
            sections.Add(new SecondOrderSection(1.0, 2.0, 1.0, -2.0 * p.Real, p.Magnitude * p.Magnitude));
        }

        var first = sections[0];
        sections[0] = first with { B0 = first.B0 * gain, B1 = first.B1 * gain, B2 = first.B2 * gain };
        return [.. sections];
    }
}
