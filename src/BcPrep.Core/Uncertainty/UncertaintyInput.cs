using BcPrep.Values;

namespace BcPrep.Uncertainty;

/// <summary>
/// One input quantity of a measurement model: its estimate x (SI unit of the quantity), standard
/// uncertainty u(x) (same unit, ≥ 0), degrees of freedom ν (&gt; 0, <see cref="double.PositiveInfinity"/>
/// when u is taken as exactly known), the distribution used by Monte Carlo, the evaluation type and a free
/// text naming where u came from (e.g. "calibration certificate", "spec % of reading").
/// </summary>
/// <remarks>Construction validates the numbers and throws <see cref="BcPrepDataException"/> on NaN,
/// infinite estimate or uncertainty, negative uncertainty or non-positive degrees of freedom.</remarks>
public sealed record UncertaintyInput
{
    public UncertaintyInput(
        string name,
        double estimate,
        double standardUncertainty,
        double degreesOfFreedom = double.PositiveInfinity,
        DistributionKind distribution = DistributionKind.Normal,
        EvaluationType evaluation = EvaluationType.TypeB,
        string source = "")
    {
        ArgumentNullException.ThrowIfNull(name);
        ArgumentNullException.ThrowIfNull(source);
        if (!double.IsFinite(estimate))
        {
            throw new BcPrepDataException($"Input '{name}': estimate {estimate} is not a finite number.");
        }

        if (!double.IsFinite(standardUncertainty) || standardUncertainty < 0.0)
        {
            throw new BcPrepDataException(
                $"Input '{name}': standard uncertainty {standardUncertainty} must be finite and ≥ 0.");
        }

        if (double.IsNaN(degreesOfFreedom) || degreesOfFreedom <= 0.0)
        {
            throw new BcPrepDataException(
                $"Input '{name}': degrees of freedom {degreesOfFreedom} must be > 0 (use +∞ for exactly known u).");
        }

        Name = name;
        Estimate = estimate;
        StandardUncertainty = standardUncertainty;
        DegreesOfFreedom = degreesOfFreedom;
        Distribution = distribution;
        Evaluation = evaluation;
        Source = source;
    }

    public string Name { get; }

    public double Estimate { get; }

    public double StandardUncertainty { get; }

    public double DegreesOfFreedom { get; }

    public DistributionKind Distribution { get; }

    public EvaluationType Evaluation { get; }

    public string Source { get; }

    /// <summary>Builds a normal-distribution input from a <see cref="MeasuredValue"/>.</summary>
    public static UncertaintyInput FromMeasuredValue(
        string name, MeasuredValue value, EvaluationType evaluation, string source) =>
        new(name, value.Value, value.StandardUncertainty, value.DegreesOfFreedom,
            DistributionKind.Normal, evaluation, source);

    /// <summary>The estimate, standard uncertainty and degrees of freedom as a <see cref="MeasuredValue"/>.</summary>
    public MeasuredValue ToMeasuredValue() => new(Estimate, StandardUncertainty, DegreesOfFreedom);
}
