namespace BcPrep.Pipeline;

/// <summary>
/// Names of the point-model outputs that come in runs (wall thermocouples, profile points) and the one rule for which
/// are profile points (<see cref="QuantityKind.ProfilePoint"/>): the tables write those in their own files and leave
/// them out of scalars.csv, the budgets and the scalar covariance.
/// </summary>
public static class ProfileOutputs
{
    public const string VelocityPrefix = "inlet.velocity.";
    public const string TemperaturePrefix = "inlet.temperature_profile.";
    public const string WallGridPrefix = "wall.temperature_at.";

    /// <summary>Infix of every plane's rake temperature profile (<c>PLANE.temperature_profile.N</c>; the inlet's is <see cref="TemperaturePrefix"/>).</summary>
    public const string PlaneTemperatureInfix = ".temperature_profile.";

    /// <summary>Prefix of the wall-thermocouple outputs (<see cref="QuantityKind.WallPoint"/>), which are not profile points.</summary>
    public const string WallPointPrefix = "wall.temperature.";

    public static string Velocity(int i) => VelocityPrefix + i.ToString(System.Globalization.CultureInfo.InvariantCulture);

    public static string Temperature(int i) => TemperaturePrefix + i.ToString(System.Globalization.CultureInfo.InvariantCulture);

    public static string PlaneTemperature(string plane, int i) => plane + PlaneTemperatureInfix + i.ToString(System.Globalization.CultureInfo.InvariantCulture);

    public static string WallGrid(int i) => WallGridPrefix + i.ToString(System.Globalization.CultureInfo.InvariantCulture);

    public static string WallPoint(string channel) => WallPointPrefix + channel;

    public static bool IsProfilePoint(string name) =>
        name.StartsWith(VelocityPrefix, StringComparison.Ordinal) || name.Contains(PlaneTemperatureInfix, StringComparison.Ordinal)
        || name.StartsWith(WallGridPrefix, StringComparison.Ordinal);
}
