using BcPrep.Rig;

namespace BcPrep.Lab;

/// <summary>
/// Which measured quantities a test matrix may plan, and in which dimension: the point model's main outputs
/// (names as in scalars.csv), the wall temperatures by channel, and any channel by its id (its window mean),
/// so that a logged fan setting or valve position can be planned too. Output names win over channel ids.
/// </summary>
public static class PlannableQuantities
{
    private static readonly (string Name, Dimension Dimension)[] Outputs =
    [
        ("inlet.static_pressure", Dimension.Pressure),
        ("outlet.static_pressure", Dimension.Pressure),
        ("inlet.temperature", Dimension.Temperature),
        ("outlet.temperature", Dimension.Temperature),
        ("mass_flow", Dimension.MassFlow),
        ("heater_power", Dimension.Power),
        ("pressure_drop.measured", Dimension.Pressure),
        ("reynolds", Dimension.Dimensionless),
        ("mach", Dimension.Dimensionless),
    ];

    /// <summary>The dimension of <paramref name="name"/>, or null when it is nothing the matrix can plan.</summary>
    public static Dimension? DimensionOf(string name, RigDescription rig)
    {
        foreach (var (output, dimension) in Outputs)
        {
            if (output == name)
            {
                return dimension;
            }
        }
        const string wallPrefix = "wall.temperature.";
        if (name.StartsWith(wallPrefix, StringComparison.Ordinal) && rig.Channel(name[wallPrefix.Length..]) is { Role: ChannelRole.WallTemperature })
        {
            return Dimension.Temperature;
        }
        return rig.Channel(name)?.Dimension;
    }

    /// <summary>Every name <see cref="DimensionOf"/> accepts for this rig, for "did you mean" hints.</summary>
    public static IEnumerable<string> Names(RigDescription rig) =>
        Outputs.Select(o => o.Name)
            .Concat(rig.WithRole(ChannelRole.WallTemperature).Select(c => "wall.temperature." + c.Id))
            .Concat(rig.Channels.Select(c => c.Id));
}
