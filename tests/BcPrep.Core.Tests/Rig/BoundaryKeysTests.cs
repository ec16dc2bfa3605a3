using BcPrep.Physics;
using BcPrep.Rig;
using BcPrep.Tests.Pipeline;

namespace BcPrep.Tests.Rig;

/// <summary>Rig keys of the flow meter, rake radii and the wall grid.</summary>
public class BoundaryKeysTests
{
    private const string Channels = """
        [[channel]]
        id = "p_in"
        measures = "static_pressure"
        plane = "inlet"

        [[channel]]
        id = "dp"
        measures = "differential_pressure"

        """;

    private static IReadOnlyList<Problem> Problems(string toml) =>
        Assert.Throws<BcPrepFailure>(() => RigLoader.Load(SyntheticDay.Header + Channels + toml, "rig.toml")).Problems;

    [Fact]
    public void Venturi_table_is_read_in_SI()
    {
        var rig = RigLoader.Load(SyntheticDay.Header + Channels + """
            [flow_meter]
            kind = "venturi"
            pipe_diameter = "4 in"
            throat_diameter = "60 mm"
            throat_diameter_uncertainty = "0.01 mm"
            upstream_pressure = "p_in"
            isentropic_exponent = 1.39
            """, "rig.toml");
        var meter = rig.FlowMeter!;
        Assert.Equal(FlowMeterKind.Venturi, meter.Kind);
        Assert.Equal(0.1016, meter.PipeDiameterM, 1e-12); // 1 in = 25.4 mm exactly (NIST SP 811)
        Assert.Equal(0.06, meter.ThroatDiameterM, 1e-12);
        Assert.Equal(1e-5, meter.ThroatDiameterStdM, 1e-15);
        Assert.Equal(1.39, meter.IsentropicExponent);
        Assert.Null(meter.DifferentialPressureChannel);
    }

    [Fact]
    public void Orifice_without_tapping_and_with_unknown_channel_is_rejected_with_a_suggestion()
    {
        var problems = Problems("""
            [flow_meter]
            kind = "orifice"
            pipe_diameter = "100 mm"
            bore_diameter = "50 mm"
            upstream_pressure = "p_im"
            """);
        Assert.Contains(problems, p => p.Message.Contains("tapping arrangement", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Message.Contains("did you mean 'p_in'", StringComparison.Ordinal));
    }

    [Fact]
    public void Bore_not_smaller_than_pipe_is_rejected()
    {
        var problems = Problems("""
            [flow_meter]
            kind = "orifice"
            tapping = "corner"
            pipe_diameter = "100 mm"
            bore_diameter = "100 mm"
            upstream_pressure = "p_in"
            """);
        Assert.Contains(problems, p => p.Message.Contains("smaller than the pipe", StringComparison.Ordinal));
    }

    [Fact]
    public void Radius_belongs_to_inlet_bulk_temperature_and_lies_inside_the_duct()
    {
        var problems = Problems("""
            [[channel]]
            id = "t_w"
            measures = "wall_temperature"
            position = "0.5 m"
            radius = "10 mm"

            [[channel]]
            id = "t_r"
            measures = "bulk_temperature"
            plane = "inlet"
            radius = "60 mm"
            """);
        Assert.Contains(problems, p => p.Message.Contains("belongs to a rake sensor", StringComparison.Ordinal));
        Assert.Contains(problems, p => p.Message.Contains("outside the duct", StringComparison.Ordinal));
    }

    [Fact]
    public void Rake_is_accepted_at_any_plane_with_distinct_radii()
    {
        // Rakes at the outlet and at any named plane carry a radius (common practice: a rake samples a section).
        var rig = RigLoader.Load(SyntheticDay.Header + Channels + """
            [[channel]]
            id = "t_o1"
            measures = "bulk_temperature"
            plane = "outlet"
            radius = "0 mm"

            [[channel]]
            id = "t_o2"
            measures = "bulk_temperature"
            plane = "outlet"
            radius = "40 mm"

            [[channel]]
            id = "t_m1"
            measures = "bulk_temperature"
            plane = "meter"
            radius = "40 mm"
            """, "rig.toml");
        Assert.Equal(0.04, rig.Channel("t_o2")!.RadiusM!.Value, 1e-12);
        Assert.Equal("meter", rig.Channel("t_m1")!.Plane);

        var problems = Problems("""
            [[channel]]
            id = "t_o1"
            measures = "bulk_temperature"
            plane = "outlet"
            radius = "40 mm"

            [[channel]]
            id = "t_o2"
            measures = "bulk_temperature"
            plane = "outlet"
            radius = "40 mm"
            """);
        var problem = Assert.Single(problems);
        Assert.Contains("'t_o1' and 't_o2' both sit at radius 40 mm of the outlet plane", problem.Message, StringComparison.Ordinal);
        Assert.Equal("channel 't_o2'.radius", problem.Location.Key);
    }

    [Fact]
    public void Wall_table_reads_points_and_clamp_policy()
    {
        var rig = RigLoader.Load(SyntheticDay.Header + Channels + "[wall]\naxial_points = 5\noutside_thermocouples = \"clamp\"\n", "rig.toml");
        Assert.Equal(new WallSettings(5, true), rig.Wall);
        Assert.Equal(WallSettings.Default, RigLoader.Load(SyntheticDay.Header + Channels, "rig.toml").Wall);
        Assert.Contains(Problems("[wall]\naxial_points = 1\n"), p => p.Message.Contains("at least 2", StringComparison.Ordinal));
    }

    [Fact]
    public void Orifice_tapping_words_map_to_the_ISO_arrangements()
    {
        var rig = RigLoader.Load(SyntheticDay.Header + Channels + """
            [flow_meter]
            kind = "orifice"
            tapping = "d_and_d_over_2"
            pipe_diameter = "100 mm"
            bore_diameter = "50 mm"
            upstream_pressure = "p_in"
            """, "rig.toml");
        Assert.Equal(OrificeTapping.DAndDOver2, rig.FlowMeter!.Tapping);
    }
}
