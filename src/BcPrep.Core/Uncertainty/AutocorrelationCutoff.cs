namespace BcPrep.Uncertainty;

/// <summary>Rule that decides up to which lag the sample autocorrelations enter γ_n.</summary>
public enum AutocorrelationCutoff
{
    /// <summary>
    /// Sokal's automatic window (Sokal 1997; also used by emcee's integrated_time): the smallest lag M with
    /// M ≥ c·γ̂(M), c = <see cref="WindowMeanOptions.SokalFactor"/> (default 5). Sums nearly the whole
    /// correlation tail, at the price of somewhat more noise. Default.
    /// </summary>
    SokalWindow,

    /// <summary>
    /// Zhang (2006, Metrologia 43 S276) style: the series is treated as a moving average whose order m is the
    /// last lag before the first ρ̂(k) inside the Bartlett band ±2·√[(1 + 2Σ_{i&lt;k} ρ̂(i)²)/n]. Scanning stops at
    /// the first insignificant lag (searching for the "largest significant lag" over all lags would pick up the
    /// 5 % of noise lags that exceed any 2σ band). Drops the part of a slowly decaying tail that falls inside
    /// the band, so it tends to under-state γ_n for strongly correlated AR-like series.
    /// </summary>
    BartlettBand,
}
