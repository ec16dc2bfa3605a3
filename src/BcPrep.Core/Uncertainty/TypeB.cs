namespace BcPrep.Uncertainty;

/// <summary>
/// Type B standard uncertainties from the kinds of information a data sheet or certificate gives
/// (GUM 4.3). All inputs and outputs share the unit of the quantity. Negative, NaN or infinite inputs throw
/// <see cref="BcPrepDataException"/>.
/// </summary>
public static class TypeB
{
    private static readonly double Sqrt3 = Math.Sqrt(3.0);
    private static readonly double Sqrt6 = Math.Sqrt(6.0);
    private static readonly double Sqrt2 = Math.Sqrt(2.0);
    private static readonly double Sqrt12 = Math.Sqrt(12.0);

    /// <summary>Certificate expanded uncertainty U with its coverage factor k: u = U/k (GUM 4.3.3). k &gt; 0.</summary>
    public static double FromCertificate(double expandedUncertainty, double coverageFactor)
    {
        RequireNonNegative(expandedUncertainty, nameof(expandedUncertainty));
        if (!double.IsFinite(coverageFactor) || coverageFactor <= 0.0)
        {
            throw new BcPrepDataException($"Coverage factor k = {coverageFactor} must be finite and > 0.");
        }

        return expandedUncertainty / coverageFactor;
    }

    /// <summary>Rectangular distribution of half-width a: u = a/√3 (GUM 4.3.7).</summary>
    public static double FromRectangularHalfWidth(double halfWidth) => RequireNonNegative(halfWidth, nameof(halfWidth)) / Sqrt3;

    /// <summary>Symmetric triangular distribution of half-width a: u = a/√6 (GUM 4.3.9).</summary>
    public static double FromTriangularHalfWidth(double halfWidth) => RequireNonNegative(halfWidth, nameof(halfWidth)) / Sqrt6;

    /// <summary>U-shaped (arcsine) distribution of half-width a: u = a/√2 (GUM H.1.3.4).</summary>
    public static double FromArcSineHalfWidth(double halfWidth) => RequireNonNegative(halfWidth, nameof(halfWidth)) / Sqrt2;

    /// <summary>
    /// Symmetric trapezoid with outer half-width a and inner half-width β·a, 0 ≤ β ≤ 1:
    /// u = a·√((1 + β²)/6) (GUM 4.3.9). β = 0 is triangular, β = 1 rectangular.
    /// </summary>
    public static double FromTrapezoidalHalfWidth(double halfWidth, double beta)
    {
        RequireNonNegative(halfWidth, nameof(halfWidth));
        if (!(beta >= 0.0 && beta <= 1.0))
        {
            throw new BcPrepDataException($"Trapezoid shape β = {beta} must lie in [0, 1].");
        }

        return halfWidth * Math.Sqrt((1.0 + beta * beta) / 6.0);
    }

    /// <summary>Quantisation by a display/ADC resolution δ (one digit step): u = δ/√12 (GUM F.2.2.1).</summary>
    public static double FromResolution(double resolution) => RequireNonNegative(resolution, nameof(resolution)) / Sqrt12;

    /// <summary>
    /// Degrees of freedom of a Type B uncertainty from the judged relative reliability Δu/u of u:
    /// ν = ½·(Δu/u)⁻² (GUM G.4.2 eq. G.3). 0.25 → 8, 0.10 → 50, 0.50 → 2. A reliability of 0 gives +∞.
    /// </summary>
    public static double DegreesOfFreedomFromRelativeReliability(double relativeUncertaintyOfU)
    {
        RequireNonNegative(relativeUncertaintyOfU, nameof(relativeUncertaintyOfU));
        return relativeUncertaintyOfU == 0.0
            ? double.PositiveInfinity
            : 0.5 / (relativeUncertaintyOfU * relativeUncertaintyOfU);
    }

    private static double RequireNonNegative(double value, string what)
    {
        if (!double.IsFinite(value) || value < 0.0)
        {
            throw new BcPrepDataException($"Type B {what} = {value} must be finite and ≥ 0.");
        }

        return value;
    }
}
