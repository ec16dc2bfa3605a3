namespace BcPrep.Uncertainty;

/// <summary>
/// One row of an uncertainty budget for one output y: the input's data, its sensitivity coefficient
/// c = ∂y/∂x (unit of y per unit of x), its contribution uᵢ(y) = c·u(x) (signed, unit of y) and its share of
/// the variance c²u²(x)/u_c²(y) (dimensionless; 0 when u_c = 0). With correlated inputs the shares of all rows
/// plus <see cref="GumOutput.CorrelationVarianceShare"/> add up to 1.
/// </summary>
public sealed record BudgetLine(
    string InputName,
    double Estimate,
    double StandardUncertainty,
    double DegreesOfFreedom,
    DistributionKind Distribution,
    EvaluationType Evaluation,
    string Source,
    double SensitivityCoefficient,
    double Contribution,
    double VarianceShare);
