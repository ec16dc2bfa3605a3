namespace BcPrep.Pipeline;

/// <summary>A named output of the point model, with its SI unit, what it is, and which kind of output it is.</summary>
public sealed record QuantityDefinition(string Name, string Unit, string Description)
{
    public QuantityKind Kind { get; init; } = QuantityKind.Scalar;
}

/// <summary>How the tables treat an output.</summary>
public enum QuantityKind
{
    /// <summary>One value per point: scalars.csv, budgets, the scalar covariance.</summary>
    Scalar,

    /// <summary>The temperature at one wall thermocouple (<c>wall.temperature.&lt;channel&gt;</c>); written with the scalars.</summary>
    WallPoint,

    /// <summary>A point of a profile (inlet velocity, rake temperature, wall temperature on the axial grid): written in the profile tables only.</summary>
    ProfilePoint,
}
