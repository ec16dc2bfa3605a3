using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

/// <summary>The one quantity table: definitions, kinds and values come from the same entries (no external source: a consistency property).</summary>
public class PointOutputsTests
{
    [Fact]
    public void Every_output_has_the_kind_the_profile_rule_gives_its_name()
    {
        foreach (var point in SampleDayResult.Gum.Points)
        {
            Assert.All(point.Model.Outputs, o =>
            {
                Assert.Equal(ProfileOutputs.IsProfilePoint(o.Name), o.Kind == QuantityKind.ProfilePoint);
                Assert.Equal(o.Name.StartsWith(ProfileOutputs.WallPointPrefix, StringComparison.Ordinal), o.Kind == QuantityKind.WallPoint);
            });
            Assert.Contains(point.Model.Outputs, o => o.Name.StartsWith(ProfileOutputs.WallGridPrefix, StringComparison.Ordinal));
        }
    }

    [Fact]
    public void The_scalars_open_the_outputs_in_table_order_and_read_their_own_value()
    {
        var point = SampleDayResult.Gum.Points[0];
        var scalars = point.Model.Outputs.Where(o => o.Kind == QuantityKind.Scalar).Select(o => o.Name).ToList();
        Assert.Equal(PointOutputs.Scalars.Select(s => s.Name).Where(scalars.Contains), scalars);
        Assert.Equal(point.Nominal.Reynolds, point.Output(PointOutputs.Reynolds)!.Estimate, 1e-9 * point.Nominal.Reynolds);
        Assert.Equal(point.Nominal.InletDensity, point.Output(PointOutputs.InletDensity)!.Estimate, 1e-12);
    }
}
