namespace BcPrep.Uncertainty;

/// <summary>
/// How long a settled point must be held for the expanded uncertainty of a window mean to reach a target.
/// </summary>
/// <param name="HeldS">Time held so far (length of the settled record evaluated), s.</param>
/// <param name="ExpandedUncertaintyNow">U of the mean over the record held so far.</param>
/// <param name="TargetExpandedUncertainty">U wanted.</param>
/// <param name="NeededS">Total hold needed for U to reach the target (≥ <paramref name="HeldS"/>); +∞ when unreachable.</param>
/// <param name="Reachable">False when the fixed Type B alone, times its coverage factor, is at or above the target: no hold reaches it.</param>
public sealed record HoldTimeEstimate(double HeldS, double ExpandedUncertaintyNow, double TargetExpandedUncertainty, double NeededS, bool Reachable)
{
    /// <summary>Hold still to go, s (0 when the target is met; +∞ when unreachable).</summary>
    public double RemainingS => Math.Max(0.0, NeededS - HeldS);

    public bool Met => ExpandedUncertaintyNow <= TargetExpandedUncertainty;
}

/// <summary>
/// Predicts the hold time from the running Type A evaluation of a settled record (autocorrelation-corrected,
/// <see cref="WindowMean"/>) and a fixed Type B standard uncertainty.
/// </summary>
/// <remarks>
/// Once a record is several correlation times long, γ_n is constant, so var(x̄) = σ²γ/n falls as 1/T: u_A(T) =
/// u_A(T₀)·√(T₀/T) (JCGM 100 4.2.3 with the autocorrelated variance of the mean, reference sheet 4.1). Both terms
/// of the Type A degrees of freedom (n_eff − 1 and n/(2M + 1)) grow in proportion to n, so ν_A(T) = ν_A(T₀)·T/T₀.
/// The Type B terms are taken as exactly known (ν = ∞, as in the budget). U(T) = t_p(ν_eff)·√(u_A² + u_B²) with
/// ν_eff by Welch–Satterthwaite (JCGM 100 G.4.1) falls monotonically with T, so the hold that meets the target is
/// found by bisection. The limit as T → ∞ is z_p·u_B: a target at or below it is unreachable.
/// </remarks>
public static class HoldTime
{
    /// <summary>Longest hold searched, as a multiple of the hold so far; beyond it the target counts as unreachable.</summary>
    public const double MaxGrowth = 1e6;

    public static HoldTimeEstimate Estimate(WindowMeanResult typeA, double heldS, double typeBStandard, double targetExpanded, double coverageProbability = 0.95)
    {
        ArgumentNullException.ThrowIfNull(typeA);
        if (!(heldS > 0) || !(targetExpanded > 0) || !(typeBStandard >= 0))
        {
            throw new BcPrepDataException($"Hold time needs a positive hold so far ({heldS} s), a positive target ({targetExpanded}) and a Type B ≥ 0 ({typeBStandard}).");
        }
        var uA0 = typeA.StandardUncertainty;
        var nuA0 = typeA.DegreesOfFreedom;
        double ExpandedAt(double t)
        {
            var uA = uA0 * Math.Sqrt(heldS / t);
            var uc2 = (uA * uA) + (typeBStandard * typeBStandard);
            if (uc2 == 0.0)
            {
                return 0.0;
            }
            var nuA = nuA0 * t / heldS;
            var nuEff = uA == 0.0 ? double.PositiveInfinity : uc2 * uc2 / (Math.Pow(uA, 4) / nuA);
            return CoverageFactor.ForStudentT(nuEff, coverageProbability) * Math.Sqrt(uc2);
        }
        var now = ExpandedAt(heldS);
        if (now <= targetExpanded)
        {
            return new HoldTimeEstimate(heldS, now, targetExpanded, heldS, true);
        }
        var limit = CoverageFactor.ForStudentT(double.PositiveInfinity, coverageProbability) * typeBStandard;
        var high = heldS * MaxGrowth;
        if (limit >= targetExpanded || ExpandedAt(high) > targetExpanded)
        {
            return new HoldTimeEstimate(heldS, now, targetExpanded, double.PositiveInfinity, false);
        }
        var low = heldS;
        // Bisection on log T: U(T) is monotone, and 60 halvings of a factor of 1e6 pin T to well under a part in 1e6.
        for (var i = 0; i < 60; i++)
        {
            var mid = Math.Sqrt(low * high);
            if (ExpandedAt(mid) > targetExpanded)
            {
                low = mid;
            }
            else
            {
                high = mid;
            }
        }
        return new HoldTimeEstimate(heldS, now, targetExpanded, high, true);
    }
}
