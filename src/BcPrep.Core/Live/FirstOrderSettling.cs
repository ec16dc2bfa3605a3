using BcPrep.Steady;

namespace BcPrep.Live;

/// <summary>
/// The follower's view of the steady-state detection's first-order fit (<see cref="SettlingEstimate"/>): τ, the
/// change still to come at the report time, and the moment from which it is within the key's tolerance.
/// </summary>
/// <remarks>
/// τ is searched from one second to three times the record since the step (common practice): a longer τ is not
/// pinned down by the record, so a fit that ends at that bound with more than the tolerance still to travel reads as
/// moving. A fit at the lower bound is a change that was over within a block or two: settled from its start.
/// </remarks>
public sealed class FirstOrderSettling : ISettlingEstimator
{
    /// <summary>Fewest block means since the step before an approach is fitted.</summary>
    public const int MinBlocks = 20;

    public SettlingView? Estimate(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double stepTimeS, double nowS, double toleranceSi)
    {
        var spanS = nowS - stepTimeS;
        if (timesS.Length < MinBlocks || !(spanS > 0) || !(toleranceSi > 0))
        {
            return null;
        }
        SettlingFit fit;
        try
        {
            fit = SettlingEstimate.Fit(timesS, values, stepTimeS, 1.0, Math.Max(10.0, 3.0 * spanS), withDrift: false);
        }
        catch (BcPrepDataException e) when (e is not BcPrepFailure)
        {
            return null;
        }
        var remaining = fit.RemainingChangeAt(nowS);
        var longTau = fit.TauAtBound && fit.TauS > Math.Sqrt(3.0 * spanS);
        if (longTau && remaining > toleranceSi)
        {
            return null;
        }
        return new SettlingView(fit.TauS, remaining, fit.SettledSinceS(toleranceSi));
    }
}
