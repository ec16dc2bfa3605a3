namespace BcPrep.Live;

/// <summary>
/// What the live follower needs to know of a key channel's approach after a step: the first-order time constant,
/// the change still to come, and from when it is within tolerance. The fit itself belongs to the steady-state
/// detection (<c>Steady/</c>); this is the narrow view of it the follower reads.
/// </summary>
/// <param name="TauS">Time constant τ of the approach, s.</param>
/// <param name="RemainingChange">Predicted change still to come at the evaluation time, channel SI unit (≥ 0).</param>
/// <param name="SettledFromS">Time from which the predicted remaining change is within the tolerance, s (may lie in the future).</param>
public sealed record SettlingView(double TauS, double RemainingChange, double SettledFromS);

/// <summary>Fits the approach of one channel since a step; null when the data do not describe an approach (still moving).</summary>
public interface ISettlingEstimator
{
    SettlingView? Estimate(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double stepTimeS, double nowS, double toleranceSi);
}
