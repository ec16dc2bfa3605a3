using BcPrep.Values;

namespace BcPrep.Uncertainty;

/// <summary>
/// Result of the GUM law of propagation for one output quantity (unit of the output throughout).
/// </summary>
/// <param name="Name">Output name.</param>
/// <param name="Estimate">y = f(x̂).</param>
/// <param name="StandardUncertainty">Combined standard uncertainty u_c(y) = √(J U_x Jᵀ)ᵢᵢ.</param>
/// <param name="Budget">One line per input, in input order.</param>
/// <param name="CorrelationVariance">u_c² − Σ cᵢ²u²(xᵢ): the part of the variance from input correlations (may be negative).</param>
/// <param name="CorrelationVarianceShare">CorrelationVariance / u_c² (0 when u_c = 0).</param>
/// <param name="EffectiveDegreesOfFreedom">Unrounded ν_eff (see <paramref name="DegreesOfFreedomRule"/>).</param>
/// <param name="DegreesOfFreedom">ν_eff truncated down to an integer, at least 1 (GUM G.6.4), or +∞: the ν used for k.</param>
/// <param name="DegreesOfFreedomRule">How ν_eff was obtained.</param>
/// <param name="CoverageProbability">p of the expanded uncertainty.</param>
/// <param name="CoverageFactor">k = t_p(ν).</param>
/// <param name="ExpandedUncertainty">U = k·u_c.</param>
public sealed record GumOutput(
    string Name,
    double Estimate,
    double StandardUncertainty,
    IReadOnlyList<BudgetLine> Budget,
    double CorrelationVariance,
    double CorrelationVarianceShare,
    double EffectiveDegreesOfFreedom,
    double DegreesOfFreedom,
    DegreesOfFreedomRule DegreesOfFreedomRule,
    double CoverageProbability,
    double CoverageFactor,
    double ExpandedUncertainty)
{
    /// <summary>(y, u_c, truncated ν_eff).</summary>
    public MeasuredValue ToMeasuredValue() => new(Estimate, StandardUncertainty, DegreesOfFreedom);
}
