namespace BcPrep.Uncertainty;

/// <summary>
/// Everything the GUM propagation produced: the inputs and their correlation as used, the Jacobian
/// J[i,j] = ∂yᵢ/∂xⱼ, the output covariance U_y = J U_x Jᵀ (units yᵢ·yⱼ), the output correlation matrix and
/// one <see cref="GumOutput"/> per output. Arrays are copies owned by this result.
/// </summary>
public sealed record GumResult(
    IReadOnlyList<UncertaintyInput> Inputs,
    CorrelationMatrix InputCorrelation,
    IReadOnlyList<GumOutput> Outputs,
    double[,] Jacobian,
    double[,] OutputCovariance,
    double[,] OutputCorrelation)
{
    /// <summary>r(yᵢ, yⱼ) = U_y[i,j]/(u(yᵢ)u(yⱼ)); NaN when either uncertainty is zero (undefined), 1 on the diagonal otherwise.</summary>
    public double CorrelationBetween(int i, int j) => OutputCorrelation[i, j];
}
