namespace BcPrep.Uncertainty;

/// <summary>Options of <see cref="MonteCarloPropagation"/>; change with <c>with</c>.</summary>
/// <param name="Seed">Seed of the System.Random stream; same seed, same inputs → same result.</param>
/// <param name="CoverageProbability">p of the coverage intervals, in (0, 1).</param>
/// <param name="FixedTrials">When set, run exactly this many trials (≥ 2) instead of the adaptive procedure.</param>
/// <param name="SignificantDigits">n_dig of the adaptive procedure (JCGM 101 7.9.2), 1 or 2 in practice.</param>
/// <param name="MaxTrials">Upper bound on trials of the adaptive procedure; reaching it sets <see cref="MonteCarloResult.Converged"/> false.</param>
public sealed record MonteCarloOptions(
    int Seed = 1,
    double CoverageProbability = 0.95,
    int? FixedTrials = null,
    int SignificantDigits = 2,
    int MaxTrials = 5_000_000)
{
    public static MonteCarloOptions Default { get; } = new();
}
