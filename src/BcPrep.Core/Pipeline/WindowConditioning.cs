using BcPrep.Conditioning;

namespace BcPrep.Pipeline;

/// <summary>Whether a sensor fault fails the operating point or is only reported.</summary>
public enum FaultSeverity
{
    /// <summary>Reported in the manifest and as a warning; the point is still reduced.</summary>
    Warning,

    /// <summary>The point cannot be trusted: processing stops with exit code 3.</summary>
    Failure,
}

/// <summary>A raised sensor-fault flag, its severity, and the log-clock time (s) of its first sample.</summary>
public sealed record FaultVerdict(SensorFaultFlag Flag, FaultSeverity Severity, double FirstTimeS);

/// <summary>
/// What conditioning changed in one channel's window: gaps bridged (log-clock times), gaps left open at the window
/// edges (their cells are dropped), times of the samples the Hampel filter replaced, and the fault verdicts.
/// </summary>
public sealed record WindowConditioning(
    IReadOnlyList<DataGap> BridgedGaps,
    IReadOnlyList<DataGap> OpenEdgeGaps,
    IReadOnlyList<double> SpikeTimesS,
    IReadOnlyList<FaultVerdict> Faults)
{
    /// <summary>
    /// Gaps inside the window longer than the bridge limit, left open: the statistics join the samples on both sides.
    /// </summary>
    public IReadOnlyList<DataGap> UnbridgedGaps { get; init; } = [];
}
