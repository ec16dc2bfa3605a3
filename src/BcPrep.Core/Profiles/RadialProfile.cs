using System.Collections.Immutable;
using System.Globalization;

namespace BcPrep.Profiles;

/// <summary>
/// A quantity sampled at radii from the pipe axis (r = 0) to the wall (r = R), in SI units.
/// <see cref="StandardUncertainty"/> is empty until a caller (the uncertainty engine) fills it with one
/// standard uncertainty per point, same unit as <see cref="Values"/>.
/// </summary>
/// <param name="Quantity">Name of the quantity, e.g. "axial velocity".</param>
/// <param name="Unit">SI unit of the values, e.g. "m/s".</param>
/// <param name="RadiusM">Radii, m, strictly increasing, first 0 (axis), last R (wall).</param>
/// <param name="Values">One value per radius.</param>
/// <param name="StandardUncertainty">Empty, or one standard uncertainty per radius.</param>
public sealed record RadialProfile(
    string Quantity,
    string Unit,
    ImmutableArray<double> RadiusM,
    ImmutableArray<double> Values,
    ImmutableArray<double> StandardUncertainty)
{
    /// <summary>Outer radius R, m (last grid point).</summary>
    public double OuterRadiusM => RadiusM[^1];

    /// <summary>Creates a profile without uncertainties; arrays must have equal length ≥ 2.</summary>
    public static RadialProfile Create(string quantity, string unit, ImmutableArray<double> radiusM, ImmutableArray<double> values)
    {
        if (radiusM.IsDefault || values.IsDefault || radiusM.Length < 2 || radiusM.Length != values.Length)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Profile '{quantity}' needs equal-length radius and value arrays with at least 2 points."));
        }

        return new RadialProfile(quantity, unit, radiusM, values, []);
    }

    /// <summary>Returns a copy carrying one standard uncertainty per point (finite, ≥ 0).</summary>
    public RadialProfile WithStandardUncertainty(ImmutableArray<double> standardUncertainty)
    {
        if (standardUncertainty.IsDefault || standardUncertainty.Length != Values.Length || standardUncertainty.Any(u => !double.IsFinite(u) || u < 0.0))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Profile '{Quantity}' needs {Values.Length} finite non-negative standard uncertainties."));
        }

        return this with { StandardUncertainty = standardUncertainty };
    }

    /// <summary>
    /// Linear interpolation of the value at radius r, 0 ≤ r ≤ R (a relative excess of 1e-9 R is treated as R);
    /// throws outside.
    /// </summary>
    public double ValueAt(double radiusM)
    {
        var outer = OuterRadiusM;
        if (!double.IsFinite(radiusM) || radiusM < 0.0 || radiusM > outer * (1.0 + 1e-9))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Radius {radiusM:R} m is outside the profile '{Quantity}' range [0, {outer:R}] m."));
        }

        return Interpolation.Linear(RadiusM, Values, Math.Min(radiusM, outer));
    }
}
