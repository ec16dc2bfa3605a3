using System.Globalization;

using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

/// <summary>
/// Test fixture (the tool itself evaluates time series with <see cref="WindowMean"/>): Type A evaluation of several quantities observed together in n simultaneous sets (GUM 4.2 and 5.2.3):
/// the means q̄, their standard uncertainties s(q̄) = s(q)/√n, ν = n − 1, and the covariance of the means
/// s(q̄, r̄) = Σ(q_k − q̄)(r_k − r̄)/[n(n − 1)] (GUM eq. 17) with correlation r = s(q̄, r̄)/(s(q̄)s(r̄)).
/// Readings are assumed independent between sets (no autocorrelation; use <see cref="WindowMean"/> for a time series).
/// </summary>
/// <param name="Means">q̄ per quantity.</param>
/// <param name="StandardUncertainties">s(q̄) per quantity.</param>
/// <param name="DegreesOfFreedom">n − 1.</param>
/// <param name="Covariance">s(q̄ᵢ, q̄ⱼ).</param>
/// <param name="Correlation">The correlation matrix of the means (identity entries where an s(q̄) is zero).</param>
internal sealed record SimultaneousMeans(
    IReadOnlyList<double> Means,
    IReadOnlyList<double> StandardUncertainties,
    double DegreesOfFreedom,
    double[,] Covariance,
    CorrelationMatrix Correlation)
{
    /// <summary>
    /// From observations[k][i] = reading of quantity i in set k. Needs n ≥ 2 sets of equal length with finite values;
    /// otherwise throws <see cref="BcPrepDataException"/>.
    /// </summary>
    public static SimultaneousMeans FromSets(IReadOnlyList<IReadOnlyList<double>> observations)
    {
        ArgumentNullException.ThrowIfNull(observations);
        var n = observations.Count;
        if (n < 2)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Type A evaluation needs at least 2 simultaneous sets, got {n}."));
        }

        var q = observations[0].Count;
        if (q == 0 || observations.Any(set => set.Count != q || set.Any(v => !double.IsFinite(v))))
        {
            throw new BcPrepDataException("Simultaneous sets must all have the same non-zero length and finite values.");
        }

        var means = new double[q];
        for (var i = 0; i < q; i++)
        {
            means[i] = observations.Average(set => set[i]);
        }

        var covariance = new double[q, q];
        for (var i = 0; i < q; i++)
        {
            for (var j = 0; j <= i; j++)
            {
                var s = 0.0;
                for (var k = 0; k < n; k++)
                {
                    s += (observations[k][i] - means[i]) * (observations[k][j] - means[j]);
                }

                covariance[i, j] = covariance[j, i] = s / (n * (n - 1.0));
            }
        }

        var u = new double[q];
        for (var i = 0; i < q; i++)
        {
            u[i] = Math.Sqrt(covariance[i, i]);
        }

        var r = new double[q, q];
        for (var i = 0; i < q; i++)
        {
            for (var j = 0; j < q; j++)
            {
                r[i, j] = i == j ? 1.0 : (u[i] > 0.0 && u[j] > 0.0 ? covariance[i, j] / (u[i] * u[j]) : 0.0);
            }
        }

        return new SimultaneousMeans(means, u, n - 1.0, covariance, CorrelationMatrix.FromMatrix(r));
    }
}
