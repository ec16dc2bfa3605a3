using System.Collections.Concurrent;
using MathNet.Numerics.Distributions;

namespace BcPrep.Uncertainty;

/// <summary>
/// Coverage factor k = t_p(ν): the two-sided quantile of Student's t with ν degrees of freedom such that
/// [−k, k] holds probability p (GUM G.3, Table G.2); ν = +∞ gives the normal quantile. Results are cached by
/// (ν, p) because the t inverse costs ~17 µs a call.
/// </summary>
public static class CoverageFactor
{
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
            return double.IsPositiveInfinity(key.Dof)
                ? Normal.InvCDF(0.0, 1.0, upper)
                : StudentT.InvCDF(0.0, 1.0, key.Dof, upper);
        });
    }
}
