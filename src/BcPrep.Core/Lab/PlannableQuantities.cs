using BcPrep.Pipeline;
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
        (PointOutputs.InletStaticPressure.Name, Dimension.Pressure),
        (PointOutputs.OutletStaticPressure.Name, Dimension.Pressure),
        (PointOutputs.InletTemperature.Name, Dimension.Temperature),
        (PointOutputs.OutletTemperature.Name, Dimension.Temperature),
        (PointOutputs.MassFlow.Name, Dimension.MassFlow),
        (PointOutputs.HeaterPower.Name, Dimension.Power),
        (PointOutputs.PressureDropMeasured.Name, Dimension.Pressure),
        (PointOutputs.Reynolds.Name, Dimension.Dimensionless),
        (PointOutputs.Mach.Name, Dimension.Dimensionless),
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
        const string wallPrefix = ProfileOutputs.WallPointPrefix;
        if (name.StartsWith(wallPrefix, StringComparison.Ordinal) && rig.Channel(name[wallPrefix.Length..]) is { Role: ChannelRole.WallTemperature })
        {
            return Dimension.Temperature;
        }
        return rig.Channel(name)?.Dimension;
    }

    /// <summary>Every name <see cref="DimensionOf"/> accepts for this rig, for "did you mean" hints.</summary>
    public static IEnumerable<string> Names(RigDescription rig) =>
        Outputs.Select(o => o.Name)
            .Concat(rig.WithRole(ChannelRole.WallTemperature).Select(c => ProfileOutputs.WallPoint(c.Id)))
            .Concat(rig.Channels.Select(c => c.Id));
}
