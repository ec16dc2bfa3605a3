namespace BcPrep.Values;

/// <summary>
/// A best estimate with its standard uncertainty (same unit as <see cref="Value"/>, SI) and
/// the degrees of freedom of that uncertainty (<see cref="double.PositiveInfinity"/> when exactly known).
/// </summary>
public readonly record struct MeasuredValue(double Value, double StandardUncertainty, double DegreesOfFreedom)
{
    public static MeasuredValue Exact(double value) => new(value, 0.0, double.PositiveInfinity);

    public double RelativeUncertainty => Value == 0.0 ? double.NaN : StandardUncertainty / Math.Abs(Value);
}
