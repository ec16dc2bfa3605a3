using BcPrep.Values;

namespace BcPrep.Uncertainty;

/// <summary>
/// Type A evaluation of the mean of one steady window of a sampled channel (unit of the samples).
/// </summary>
/// <param name="Mean">x̄.</param>
/// <param name="StandardDeviation">Sample standard deviation s (n − 1 denominator).</param>
/// <param name="SampleCount">n.</param>
/// <param name="CutoffLag">Last lag included in γ_n (0 when none).</param>
/// <param name="CutoffConverged">False when the Sokal criterion was never met up to lag n − 1 (γ_n then uses all lags; treat with suspicion).</param>
/// <param name="RawIntegratedAutocorrelation">γ̂_n = 1 + 2 Σ_{k≤m} (1 − k/n) ρ̂(k) as estimated.</param>
/// <param name="IntegratedAutocorrelation">γ_n used: max(γ̂_n, 1), so anti-correlation never claims more than n independent samples ("common practice", conservative).</param>
/// <param name="EffectiveSampleCount">n_eff = n/γ_n.</param>
/// <param name="StandardUncertainty">u(x̄) = s·√[(n − 1)/(n(n_eff − 1))] (bias-corrected, Zhang 2006); 0 for a constant channel.</param>
/// <param name="DegreesOfFreedom">ν used for coverage factors: min(<paramref name="EffectiveSampleDegreesOfFreedom"/>, <paramref name="AutocorrelationEstimateDegreesOfFreedom"/>).</param>
/// <param name="EffectiveSampleDegreesOfFreedom">n_eff − 1 ("common practice"; not standardised).</param>
/// <param name="AutocorrelationEstimateDegreesOfFreedom">n/(2M + 1): reliability of u through the estimated γ_n (GUM G.3 with Sokal's variance of γ̂, from memory); +∞ for a constant channel.</param>
/// <param name="NaiveStandardUncertainty">s/√n, valid only for uncorrelated samples; for comparison.</param>
/// <param name="IsConstant">All samples equal (e.g. a stuck channel or a quantised constant): u = 0 is reported, not NaN.</param>
/// <param name="Cutoff">The cut-off rule used.</param>
public sealed record WindowMeanResult(
    double Mean,
    double StandardDeviation,
    int SampleCount,
    int CutoffLag,
    bool CutoffConverged,
    double RawIntegratedAutocorrelation,
    double IntegratedAutocorrelation,
    double EffectiveSampleCount,
    double StandardUncertainty,
    double DegreesOfFreedom,
    double EffectiveSampleDegreesOfFreedom,
    double AutocorrelationEstimateDegreesOfFreedom,
    double NaiveStandardUncertainty,
    bool IsConstant,
    AutocorrelationCutoff Cutoff)
{
    /// <summary>ν of the naive estimate, n − 1.</summary>
    public double NaiveDegreesOfFreedom => SampleCount - 1.0;

    /// <summary>(x̄, u(x̄), ν).</summary>
    public MeasuredValue ToMeasuredValue() => new(Mean, StandardUncertainty, DegreesOfFreedom);

    /// <summary>Expanded uncertainty k·u with k = t_p(ν) from <see cref="CoverageFactor"/>.</summary>
    public double ExpandedUncertainty(double coverageProbability = 0.95) =>
        StandardUncertainty == 0.0 ? 0.0 : CoverageFactor.ForStudentT(DegreesOfFreedom, coverageProbability) * StandardUncertainty;
}
