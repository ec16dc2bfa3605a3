namespace BcPrep.Pipeline;

/// <summary>Choices for one processing run that are not part of the rig description.</summary>
public sealed record ProcessOptions(
    bool MonteCarlo = false,
    int Seed = 1,
    double MaxBridgeS = WindowStatistics.DefaultMaxBridgeS,
    int MonteCarloMaxTrials = 200_000);
