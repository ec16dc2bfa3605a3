namespace BcPrep.Uncertainty;

/// <summary>
/// Comparison of a GUM-framework coverage interval y ± U_p with a Monte Carlo interval [y_low, y_high]
/// (JCGM 101 8.1): d_low = |y − U_p − y_low|, d_high = |y + U_p − y_high|; the GUM result is validated when
/// both are ≤ δ, the numerical tolerance of the Monte Carlo u(y) at n_dig significant digits (7.9.2).
/// </summary>
public sealed record GufValidation(double Tolerance, double LowDifference, double HighDifference, bool IsValidated)
{
    /// <summary>
    /// Compares a <see cref="GumOutput"/> with a <see cref="MonteCarloOutput"/> (probabilistically symmetric interval)
    /// at <paramref name="significantDigits"/> digits of the Monte Carlo u. Both must use the same coverage probability.
    /// </summary>
    public static GufValidation Compare(GumOutput gum, MonteCarloOutput monteCarlo, int significantDigits)
    {
        ArgumentNullException.ThrowIfNull(gum);
        ArgumentNullException.ThrowIfNull(monteCarlo);
        if (Math.Abs(gum.CoverageProbability - monteCarlo.CoverageProbability) > 1e-12)
        {
            throw new BcPrepDataException(
                $"GUM (p = {gum.CoverageProbability}) and Monte Carlo (p = {monteCarlo.CoverageProbability}) intervals have different coverage probabilities.");
        }

        var delta = NumericalTolerance(monteCarlo.StandardUncertainty, significantDigits);
        var dLow = Math.Abs(gum.Estimate - gum.ExpandedUncertainty - monteCarlo.Low);
        var dHigh = Math.Abs(gum.Estimate + gum.ExpandedUncertainty - monteCarlo.High);
        return new GufValidation(delta, dLow, dHigh, dLow <= delta && dHigh <= delta);
    }

    /// <summary>
    /// JCGM 101 7.9.2: write u with n_dig significant digits as c·10^ℓ; δ = ½·10^ℓ (u = 0.025, n_dig = 2 → 0.0005).
    /// u must be &gt; 0 and finite, n_dig ≥ 1; u = 0 gives δ = 0.
    /// </summary>
    public static double NumericalTolerance(double standardUncertainty, int significantDigits)
    {
        if (!double.IsFinite(standardUncertainty) || standardUncertainty < 0.0 || significantDigits < 1)
        {
            throw new BcPrepDataException(
                $"Numerical tolerance needs a finite u ≥ 0 (got {standardUncertainty}) and n_dig ≥ 1 (got {significantDigits}).");
        }

        if (standardUncertainty == 0.0)
        {
            return 0.0;
        }

        var exponent = (int)Math.Floor(Math.Log10(standardUncertainty)) - (significantDigits - 1);
        var c = Math.Round(standardUncertainty / Math.Pow(10.0, exponent), MidpointRounding.AwayFromZero);
        if (c >= Math.Pow(10.0, significantDigits))
        {
            exponent++; // rounding carried into an extra digit, e.g. 0.0996 at 2 digits is 0.10
        }

        return 0.5 * Math.Pow(10.0, exponent);
    }
}
