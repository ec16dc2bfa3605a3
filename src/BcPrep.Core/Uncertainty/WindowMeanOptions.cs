namespace BcPrep.Uncertainty;

/// <summary>Options of <see cref="WindowMean.Evaluate(double[], WindowMeanOptions?)"/>; change with <c>with</c>.</summary>
/// <param name="Cutoff">Lag cut-off rule.</param>
/// <param name="SokalFactor">c of the Sokal window, &gt; 0 (5 as in emcee; some libraries use 7).</param>
public sealed record WindowMeanOptions(
    AutocorrelationCutoff Cutoff = AutocorrelationCutoff.SokalWindow,
    double SokalFactor = 5.0)
{
    public static WindowMeanOptions Default { get; } = new();
}
