namespace BcPrep.Conditioning;

/// <summary>
/// A digital IIR filter held both as second-order sections (preferred for filtering, numerically robust at low
/// f_c/f_s) and as the expanded transfer function b, a (a[0] = 1; for comparison with reference tables).
/// </summary>
public sealed record IirFilter(IReadOnlyList<SecondOrderSection> Sections, IReadOnlyList<double> B, IReadOnlyList<double> A)
{
    /// <summary>Builds the transfer-function form by multiplying out the sections.</summary>
    public static IirFilter FromSections(IReadOnlyList<SecondOrderSection> sections)
    {
        ArgumentNullException.ThrowIfNull(sections);
        double[] b = [1.0];
        double[] a = [1.0];
        foreach (var s in sections)
        {
            b = FilterPolynomial.Multiply(b, s.IsFirstOrder ? [s.B0, s.B1] : [s.B0, s.B1, s.B2]);
            a = FilterPolynomial.Multiply(a, s.IsFirstOrder ? [1.0, s.A1] : [1.0, s.A1, s.A2]);
        }

        return new IirFilter(sections, b, a);
    }

    /// <summary>|H(e^{j2πf/f_s})| of the cascade; frequencyHz in [0, f_s/2].</summary>
    public double Magnitude(double frequencyHz, double sampleRateHz)
    {
        double w = 2.0 * Math.PI * frequencyHz / sampleRateHz;
        var zInv = System.Numerics.Complex.FromPolarCoordinates(1.0, -w);
        var h = System.Numerics.Complex.One;
        foreach (var s in Sections)
        {
            var num = s.B0 + (zInv * (s.B1 + (zInv * s.B2)));
            var den = 1.0 + (zInv * (s.A1 + (zInv * s.A2)));
            h *= num / den;
        }

        return h.Magnitude;
    }
}
