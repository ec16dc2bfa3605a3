namespace BcPrep.Uncertainty;

/// <summary>
/// Monte Carlo propagation result: one <see cref="MonteCarloOutput"/> per output, the sample covariance of the
/// outputs (units yᵢ·yⱼ), the number of trials, whether the adaptive procedure met its tolerance (always true
/// for a fixed number of trials) and the seed used.
/// </summary>
public sealed record MonteCarloResult(
    IReadOnlyList<MonteCarloOutput> Outputs,
    double[,] OutputCovariance,
    int Trials,
    bool Converged,
    int Seed);
