using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Profiles;
using BcPrep.Rig;

namespace BcPrep.Writing;

/// <summary>
/// The inlet profile sampled onto the Cartesian points of a solver's inlet face: each point's radius is its
/// distance from the face axis, and the radial profiles are interpolated linearly there.
/// </summary>
public static class InletFaceTable
{
    public static CsvTable Build(PointResult point, InletFaceSpec face, IReadOnlyList<Point3> pointsM)
    {
        ArgumentNullException.ThrowIfNull(point);
        ArgumentNullException.ThrowIfNull(face);
        var radius = point.Model.ProfileRadiiM;
        var velocity = Profile(point, radius, ProfileOutputs.Velocity, "axial velocity", "m/s");
        var temperature = Profile(point, radius, i => point.Nominal.TemperatureProfile is null ? PointOutputs.InletTemperature.Name : ProfileOutputs.Temperature(i), "temperature", "K");
        var k = point.Output(PointOutputs.TurbulentKineticEnergy)?.Estimate ?? double.NaN;
        var epsilon = point.Output(PointOutputs.DissipationRate)?.Estimate ?? double.NaN;
        var omega = point.Output(PointOutputs.SpecificDissipationRate)?.Estimate ?? double.NaN;
        ImmutableArray<double> u, uVelocity, t, uTemperature;
        try
        {
            u = FaceSampling.Sample(velocity.Values, face.CentreM, face.Axis, pointsM);
            uVelocity = FaceSampling.Sample(velocity.Uncertainty, face.CentreM, face.Axis, pointsM);
            t = FaceSampling.Sample(temperature.Values, face.CentreM, face.Axis, pointsM);
            uTemperature = FaceSampling.Sample(temperature.Uncertainty, face.CentreM, face.Axis, pointsM);
        }
        catch (BcPrepDataException e) when (e is not BcPrepFailure)
        {
            throw new BcPrepFailure(FailureKind.Configuration, face.Location with { Key = "inlet_profile.face" }, e.Message + " Check centre, axis and points_unit.");
        }
        var table = new CsvTable(["x [m]", "y [m]", "z [m]", "velocity [m/s]", "u(velocity) [m/s]", "temperature [K]", "u(temperature) [K]",
            "k [m2/s2]", "epsilon [m2/s3]", "omega [1/s]"])
            .Comment($"BcPrep inlet face; point {point.Id}; profile sampled at each point's distance from the axis through the centre " +
                     $"({Triple(face.CentreM)}) m along ({Triple(face.Axis)}); velocity is axial, directed along +axis")
            .Comment("u(...) is the standard uncertainty interpolated linearly between profile points: an upper bound, since the neighbouring points' errors are at most fully correlated")
            .Comment(InletTurbulence.ConventionDescription);
        for (var i = 0; i < pointsM.Count; i++)
        {
            var p = pointsM[i];
            table.Add(p.X, p.Y, p.Z, u[i], uVelocity[i], t[i], uTemperature[i], k, epsilon, omega);
        }
        return table;
    }

    private static (RadialProfile Values, RadialProfile Uncertainty) Profile(PointResult point, ImmutableArray<double> radius, Func<int, string> name, string quantity, string unit)
    {
        var outputs = Enumerable.Range(0, radius.Length).Select(i => point.Output(name(i))).ToList();
        var values = RadialProfile.Create(quantity, unit, radius, [.. outputs.Select(o => o?.Estimate ?? double.NaN)]);
        var uncertainty = RadialProfile.Create("u(" + quantity + ")", unit, radius, [.. outputs.Select(o => o?.StandardUncertainty ?? double.NaN)]);
        return (values, uncertainty);
    }

    private static string Triple(Point3 p) => string.Create(CultureInfo.InvariantCulture, $"{p.X:R}, {p.Y:R}, {p.Z:R}");
}
