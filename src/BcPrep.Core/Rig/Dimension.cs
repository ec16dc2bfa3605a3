namespace BcPrep.Rig;

/// <summary>The physical dimensions a person may type a number in; each converts to one SI unit.</summary>
public enum Dimension
{
    Dimensionless,
    Length,
    Pressure,
    Temperature,
    TemperatureDifference,
    Voltage,
    Current,
    Resistance,
    MassFlow,
    Duration,
    Frequency,
    Power,
}
