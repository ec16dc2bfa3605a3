namespace BcPrep.Pipeline;

/// <summary>
/// Names of the point-model outputs that are points of a profile rather than scalars: the tables write them in
/// their own files and leave them out of scalars.csv and the budgets.
/// </summary>
public static class ProfileOutputs
{
    public const string VelocityPrefix = "inlet.velocity.";
    public const string TemperaturePrefix = "inlet.temperature_profile.";
    public const string WallGridPrefix = "wall.temperature_at.";

    public static bool IsProfilePoint(string name) =>
        name.StartsWith(VelocityPrefix, StringComparison.Ordinal) || name.StartsWith(TemperaturePrefix, StringComparison.Ordinal)
        || name.StartsWith(WallGridPrefix, StringComparison.Ordinal);
}
