using System.Collections.Concurrent;
using MathNet.Numerics.Distributions;

namespace BcPrep.Uncertainty;

/// <summary>
/// Coverage factor k = t_p(ν): the two-sided quantile of Student's t with ν degrees of freedom such that
/// [−k, k] holds probability p (GUM G.3, Table G.2); ν = +∞ gives the normal quantile. Results are cached by
/// (ν, p) because the t inverse costs ~17 µs a call.
/// </summary>
/// <remarks>
/// The library's t inverse is accurate for moderate ν but falls apart above ν ≈ 1e12 (1.9591 at 1e12, 0.4330 at
/// 1e15, 2.8284 at 1e17), and Welch–Satterthwaite on a Type-B-dominated budget routinely gives ν of 1e13–1e18.
/// From <see cref="AsymptoticFromDegreesOfFreedom"/> on, k comes from the Cornish–Fisher expansion of the t
/// quantile about the normal quantile z (Abramowitz &amp; Stegun 26.7.5), whose first omitted term is below
/// 1e-15 there, so k falls monotonically to z as ν grows, and reaches it exactly at ν = ∞.
/// </remarks>
public static class CoverageFactor
{
    /// <summary>ν from which the asymptotic expansion replaces the library inverse (its truncation error there is ~7e-16, below the library's ~2e-11).</summary>
    public const double AsymptoticFromDegreesOfFreedom = 1e3;

    private static readonly ConcurrentDictionary<(double Dof, double P), double> Cache = new();

    /// <summary>k for ν &gt; 0 (non-integer allowed, +∞ allowed) and 0 &lt; p &lt; 1; otherwise throws <see cref="BcPrepDataException"/>.</summary>
    public static double ForStudentT(double degreesOfFreedom, double coverageProbability = 0.95)
    {
        if (double.IsNaN(degreesOfFreedom) || degreesOfFreedom <= 0.0)
        {
            throw new BcPrepDataException($"Degrees of freedom {degreesOfFreedom} must be > 0 for a coverage factor.");
        }

        if (!(coverageProbability > 0.0 && coverageProbability < 1.0))
        {
            throw new BcPrepDataException($"Coverage probability {coverageProbability} must lie in (0, 1).");
        }

        return Cache.GetOrAdd((degreesOfFreedom, coverageProbability), static key =>
        {
            var upper = 0.5 * (1.0 + key.P);
            if (double.IsPositiveInfinity(key.Dof))
            {
                return Normal.InvCDF(0.0, 1.0, upper);
            }

            return key.Dof >= AsymptoticFromDegreesOfFreedom
                ? CornishFisher(Normal.InvCDF(0.0, 1.0, upper), key.Dof)
                : StudentT.InvCDF(0.0, 1.0, key.Dof, upper);
        });
    }

    /// <summary>
    /// t_p(ν) ≈ z + g₁(z)/ν + g₂(z)/ν² + g₃(z)/ν³ + g₄(z)/ν⁴ (Abramowitz &amp; Stegun 26.7.5). From ν = 1e3 on the
    /// positive g₁/ν term dominates the rest by three orders, so the sum decreases monotonically to z.
    /// </summary>
    private static double CornishFisher(double z, double nu)
    {
        var z2 = z * z;
        var g1 = z * (z2 + 1.0) / 4.0;
        var g2 = z * ((5.0 * z2 + 16.0) * z2 + 3.0) / 96.0;
        var g3 = z * (((3.0 * z2 + 19.0) * z2 + 17.0) * z2 - 15.0) / 384.0;
        var g4 = z * ((((79.0 * z2 + 776.0) * z2 + 1482.0) * z2 - 1920.0) * z2 - 945.0) / 92160.0;
        var r = 1.0 / nu;

        // Horner in 1/ν: at huge ν the correction underflows relative to z and the sum is exactly z.
        return z + (r * (g1 + (r * (g2 + (r * (g3 + (r * g4)))))));
    }
}
