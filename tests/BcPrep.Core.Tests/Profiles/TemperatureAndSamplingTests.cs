using System.Collections.Immutable;
using BcPrep.Profiles;

namespace BcPrep.Tests.Profiles;

public class TemperatureAndSamplingTests
{
    private static readonly ImmutableArray<double> Grid = RadialGrid.WallClustered(0.025, 51);

    [Fact]
    public void Rake_interpolation_is_exact_for_a_linear_temperature_field()
    {
        double[] rake = [0.0, 0.010, 0.025];
        var temperatures = rake.Select(r => 300.0 + (400.0 * r)).ToArray();
        var result = TemperatureProfiles.FromRake(Grid, rake, temperatures, RakeEndPolicy.Error);
        for (var i = 0; i < Grid.Length; i++)
        {
            Assert.Equal(300.0 + (400.0 * Grid[i]), result.Profile.Values[i], 10);
        }

        Assert.Equal(0, result.ClampedPointCount);
    }

    [Fact]
    public void Rake_not_reaching_the_wall_throws_or_clamps_with_a_diagnostic()
    {
        double[] rake = [0.020, 0.0, 0.010]; // unsorted on purpose
        double[] temperatures = [310.0, 300.0, 305.0];
        Assert.Throws<BcPrepDataException>(() => TemperatureProfiles.FromRake(Grid, rake, temperatures, RakeEndPolicy.Error));
        var clamped = TemperatureProfiles.FromRake(Grid, rake, temperatures, RakeEndPolicy.ClampConstant);
        var outside = Grid.Count(r => r > 0.020);
        Assert.Equal(outside, clamped.ClampedPointCount);
        Assert.Equal(310.0, clamped.Profile.Values[^1]);
        Assert.Single(clamped.Diagnostics);
    }

    [Fact]
    public void Uniform_temperature_and_uncertainty_slot()
    {
        var p = TemperatureProfiles.Uniform(Grid, 300.0).Profile;
        Assert.All(p.Values, t => Assert.Equal(300.0, t));
        Assert.True(p.StandardUncertainty.IsEmpty);
        var withU = p.WithStandardUncertainty(Grid.Select(_ => 0.2).ToImmutableArray());
        Assert.Equal(0.2, withU.StandardUncertainty[5]);
        Assert.Throws<BcPrepDataException>(() => p.WithStandardUncertainty([0.1]));
    }

    [Fact]
    public void Face_points_take_the_value_at_their_distance_from_the_axis()
    {
        var profile = VelocityProfiles.Build(new VelocityProfileRequest(0.02, 1.17662, 1.846e-5, 0.05)).Profile;
        var centre = new Point3(1.0, 2.0, 3.0);
        var axis = new Point3(0.0, 0.0, 2.0); // not unit length on purpose
        Point3[] points = [new(1.0, 2.0, 3.0), new(1.01, 2.0, 3.5), new(1.0, 1.985, 2.0), new(1.0 + 0.025, 2.0, 3.0)];
        var values = FaceSampling.Sample(profile, centre, axis, points);
        Assert.Equal(profile.Values[0], values[0], 12);
        Assert.Equal(profile.ValueAt(0.01), values[1], 12);
        Assert.Equal(profile.ValueAt(0.015), values[2], 9);
        Assert.Equal(0.0, values[3], 9);
        Assert.Throws<BcPrepDataException>(() => FaceSampling.Sample(profile, centre, axis, [new Point3(1.0, 2.03, 3.0)]));
    }
}
