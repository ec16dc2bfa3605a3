namespace BcPrep.Uncertainty;

/// <summary>How the effective degrees of freedom of an output were obtained.</summary>
public enum DegreesOfFreedomRule
{
    /// <summary>No input contributes (u_c = 0) or all contributing inputs have ν = +∞: ν_eff = +∞.</summary>
    Infinite,

    /// <summary>Welch–Satterthwaite, GUM G.4.1 eq. G.2b, uncorrelated contributing inputs.</summary>
    WelchSatterthwaite,

    /// <summary>
    /// Contributing inputs are correlated, where Welch–Satterthwaite is not strictly valid. Conservative rule
    /// ("common practice", chosen here): ν_eff = min(ν_WS, smallest ν of the correlated contributing inputs), with
    /// ν_WS computed with the correlated u_c⁴ in the numerator, so that cancelling correlations lower it.
    /// </summary>
    ConservativeCorrelated,
}
