using System.Globalization;

namespace BcPrep.Conditioning;

/// <summary>Second-order IIR notch filters for mains interference (50/60 Hz and harmonics).</summary>
public static class MainsNotch
{
    /// <summary>
    /// Notch at <paramref name="notchHz"/> with quality factor Q = f0 / (−3 dB bandwidth), Orfanidis (1996) form as in
    /// scipy.signal.iirnotch: ω0 = 2π f0/f_s, β = tan(ω0/(2Q)), g = 1/(1+β), b = g·[1, −2cos ω0, 1],
    /// a = [1, −2g cos ω0, 2g − 1]. Unit gain at DC and Nyquist, zero at f0.
    /// </summary>
    /// <exception cref="BcPrepDataException">f_s not positive, f0 not in (0, f_s/2), or Q not positive.</exception>
    public static SecondOrderSection Design(double notchHz, double qualityFactor, double sampleRateHz)
    {
        if (!double.IsFinite(sampleRateHz) || sampleRateHz <= 0.0)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Sample rate {sampleRateHz} Hz must be positive and finite."));
        }

        if (!double.IsFinite(notchHz) || notchHz <= 0.0 || notchHz >= sampleRateHz / 2.0)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Notch frequency {notchHz} Hz must lie strictly between 0 and the Nyquist frequency {sampleRateHz / 2.0} Hz."));
        }

        if (!double.IsFinite(qualityFactor) || qualityFactor <= 0.0)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Notch quality factor {qualityFactor} must be positive."));
        }

        double w0 = 2.0 * Math.PI * notchHz / sampleRateHz;
        double beta = Math.Tan(w0 / qualityFactor / 2.0);
        double g = 1.0 / (1.0 + beta);
        double c = Math.Cos(w0);
        return new SecondOrderSection(g, -2.0 * g * c, g, -2.0 * g * c, (2.0 * g) - 1.0);
    }

    /// <summary>
    /// Cascade of notches at f0, 2·f0, … up to <paramref name="harmonicCount"/> multiples, keeping only those strictly
    /// below Nyquist; every notch uses the same Q, so bandwidths grow with frequency (bw_k = k·f0/Q).
    /// </summary>
    /// <exception cref="BcPrepDataException">harmonicCount &lt; 1 or invalid f0, Q, f_s (see <see cref="Design"/>).</exception>
    public static IirFilter WithHarmonics(double mainsHz, double qualityFactor, int harmonicCount, double sampleRateHz)
    {
        if (harmonicCount < 1)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Harmonic count {harmonicCount} must be at least 1 (the fundamental)."));
        }

        var sections = new List<SecondOrderSection> { Design(mainsHz, qualityFactor, sampleRateHz) };
        for (int k = 2; k <= harmonicCount && k * mainsHz < sampleRateHz / 2.0; k++)
        {
            sections.Add(Design(k * mainsHz, qualityFactor, sampleRateHz));
        }

        return IirFilter.FromSections(sections);
    }

    /// <summary>
    /// Applies <see cref="WithHarmonics"/> zero-phase (forward–backward, odd padding); the notch depth is squared.
    /// Pad length: <see cref="ZeroPhaseFilter.SettlingPadLength"/> (narrow notches ring for ~f_s·Q/(π·f0) samples).
    /// </summary>
    /// <exception cref="BcPrepDataException">Series not longer than that pad, or invalid notch settings.</exception>
    public static double[] Apply(ReadOnlySpan<double> x, double mainsHz, double qualityFactor, int harmonicCount, double sampleRateHz)
    {
        var filter = WithHarmonics(mainsHz, qualityFactor, harmonicCount, sampleRateHz);
        return ZeroPhaseFilter.ForwardBackwardPadded(filter.Sections, x, ZeroPhaseFilter.SettlingPadLength(filter.Sections));
    }
}
