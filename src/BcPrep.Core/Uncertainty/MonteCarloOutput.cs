using BcPrep.Values;

namespace BcPrep.Uncertainty;

/// <summary>
/// Monte Carlo result for one output (JCGM 101 7.6–7.7), unit of the output.
/// </summary>
/// <param name="Name">Output name.</param>
/// <param name="Estimate">Mean of the M model values.</param>
/// <param name="StandardUncertainty">Their standard deviation (M − 1 denominator).</param>
/// <param name="Low">Lower end of the probabilistically symmetric interval (quantile (1 − p)/2).</param>
/// <param name="High">Upper end of the probabilistically symmetric interval.</param>
/// <param name="ShortestLow">Lower end of the shortest interval of probability p.</param>
/// <param name="ShortestHigh">Upper end of the shortest interval.</param>
/// <param name="CoverageProbability">p.</param>
public sealed record MonteCarloOutput(
    string Name,
    double Estimate,
    double StandardUncertainty,
    double Low,
    double High,
    double ShortestLow,
    double ShortestHigh,
    double CoverageProbability)
{
    /// <summary>(mean, standard deviation, +∞): a Monte Carlo u carries no Student-t degrees of freedom.</summary>
    public MeasuredValue ToMeasuredValue() => new(Estimate, StandardUncertainty, double.PositiveInfinity);
}
