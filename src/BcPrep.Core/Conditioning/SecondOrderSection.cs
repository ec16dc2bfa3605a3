namespace BcPrep.Conditioning;

/// <summary>
/// One biquad H(z) = (B0 + B1 z⁻¹ + B2 z⁻²) / (1 + A1 z⁻¹ + A2 z⁻²), leading denominator coefficient 1.
/// A first-order section has B2 = A2 = 0.
/// </summary>
public readonly record struct SecondOrderSection(double B0, double B1, double B2, double A1, double A2)
{
    /// <summary>Gain at DC (z = 1): (B0 + B1 + B2) / (1 + A1 + A2).</summary>
    public double DcGain => (B0 + B1 + B2) / (1.0 + A1 + A2);

    /// <summary>True for a first-order section (both z⁻² coefficients zero).</summary>
    public bool IsFirstOrder => B2 == 0.0 && A2 == 0.0;

    /// <summary>
    /// Steady-state transposed-direct-form-II state for a unit step input (scipy lfilter_zi of this section):
    /// z1 = B2 − A2·G, z0 = B1 − A1·G + z1, with G the DC gain.
    /// </summary>
    public (double Z0, double Z1) StepState()
    {
        double g = DcGain;
        double z1 = B2 - (A2 * g);
        double z0 = B1 - (A1 * g) + z1;
        return (z0, z1);
    }
}
