namespace BcPrep.Pipeline;

/// <summary>A scalar output of the point model and how its value is read from the model's result.</summary>
public sealed record ScalarOutput(string Name, string Unit, string Description, Func<PointMeasurements, PointQuantities, double> Value)
{
    public QuantityDefinition Definition { get; } = new(Name, Unit, Description);
}
