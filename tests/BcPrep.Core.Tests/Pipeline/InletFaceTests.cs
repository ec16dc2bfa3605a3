using System.Globalization;
using BcPrep.Profiles;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Writing;

namespace BcPrep.Tests.Pipeline;

/// <summary>Sampling the inlet profile onto a face's Cartesian points, and reading the points file.</summary>
public class InletFaceTests
{
    [Fact]
    public void Face_points_take_the_profile_at_their_distance_from_the_axis()
    {
        using var day = BoundaryPhysicsTests.OrificeDay().Table("""
            [inlet_profile.face]
            centre = ["0 m", "0 m", "0.1 m"]
            axis = [0, 0, 2]
            points_file = "face.csv"
            """);
        var result = day.Process();
        var point = result.Points.Single();
        var face = result.Rig.InletFace!;
        Assert.Equal(new Point3(0, 0, 0.1), face.CentreM);

        // On the axis, on the wall (r = 0.05 m, also off the face plane: only the distance from the axis counts),
        // and in between at r = 0.01 m.
        Point3[] points = [new(0, 0, 0.1), new(0.03, 0.04, 0.3), new(0.006, -0.008, 0.1)];
        var rows = InletFaceTable.Build(point, face, points).ToString().Split('\n').Where(l => l.Length > 0 && !l.StartsWith('#')).Skip(1)
            .Select(l => l.Split(',').Select(c => double.Parse(c, CultureInfo.InvariantCulture)).ToArray()).ToList();

        var velocity = point.Nominal.Velocity.Profile;
        Assert.Equal(point.Output("inlet.velocity.0")!.Estimate, rows[0][3], 1e-12);
        Assert.Equal(point.Output($"inlet.velocity.{velocity.RadiusM.Length - 1}")!.Estimate, rows[1][3], 1e-12);
        Assert.Equal(velocity.ValueAt(0.01), rows[2][3], 1e-9);
        Assert.All(rows, r => Assert.Equal(point.Output("inlet.temperature")!.Estimate, r[5], 1e-12));
        Assert.All(rows, r => Assert.Equal(point.Output("inlet.turbulent_kinetic_energy")!.Estimate, r[7], 1e-12));
        // The power-law profile is zero at the wall, and so is its uncertainty there; inside, u(velocity) > 0.
        Assert.Equal(0.0, rows[1][3]);
        Assert.True(rows[0][4] > 0 && rows[2][4] > 0);

        var outside = Assert.Throws<BcPrepFailure>(() => InletFaceTable.Build(point, face, [new Point3(0.06, 0, 0.1)]));
        Assert.Equal(FailureKind.Configuration, outside.Kind);
    }

    [Fact]
    public void Points_file_skips_header_and_comments_and_applies_the_unit()
    {
        var points = FacePointsReader.Read(new StringReader("# face of the inlet patch\nx,y,z\n1,2,3\n\n4;5;6\n"), 1e-3, "face.csv");
        Assert.Equal([new Point3(0.001, 0.002, 0.003), new Point3(0.004, 0.005, 0.006)], points);
    }

    [Fact]
    public void Malformed_points_line_is_reported_with_its_line_number()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => FacePointsReader.Read(new StringReader("x,y,z\n1,2,3\n1,2\n"), 1.0, "face.csv"));
        Assert.Equal(FailureKind.InputData, failure.Kind);
        Assert.Equal(3, failure.Problems[0].Location.Line);
    }

    [Fact]
    public void Face_table_needs_centre_axis_and_file()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(SyntheticDay.Header + """
            [[channel]]
            id = "p_in"
            measures = "static_pressure"
            plane = "inlet"

            [inlet_profile.face]
            centre = ["0 m", "0"]
            axis = [0, 0, 0]
            """, "rig.toml"));
        Assert.Contains(failure.Problems, p => p.Message.Contains("three components", StringComparison.Ordinal));
        Assert.Contains(failure.Problems, p => p.Message.Contains("zero vector", StringComparison.Ordinal));
        Assert.Contains(failure.Problems, p => p.Message.Contains("points_file", StringComparison.Ordinal));
    }
}
