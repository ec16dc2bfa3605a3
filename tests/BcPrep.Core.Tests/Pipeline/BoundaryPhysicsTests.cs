using System.Globalization;
using BcPrep.Physics;
using BcPrep.Pipeline;
using BcPrep.Profiles;
using BcPrep.Writing;

namespace BcPrep.Tests.Pipeline;

/// <summary>End-to-end checks of the boundary physics of a point: flow meter, moist air, rake, wall grid.</summary>
public class BoundaryPhysicsTests
{
    // ρ1 = 1.2 kg/m3 at p1 = 101 325 Pa with R = 287.05 J/(kg K): T1 = p1 / (R ρ1).
    private const double MeterTemperatureK = 101325.0 / (287.05 * 1.2);

    /// <summary>A duct with inlet/outlet pressures and temperatures and a heater power channel, no flow channel.</summary>
    internal static SyntheticDay Duct(bool withInletTemperature = true)
    {
        var day = new SyntheticDay()
            .Channel("p_in", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"inlet\""), 100000, 0.5,
                "{ kind = \"absolute\", value = \"5 Pa\", source = \"test\" }")
            .Channel("p_out", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"outlet\""), 99950, 0.5,
                "{ kind = \"absolute\", value = \"5 Pa\", source = \"test\" }")
            .Channel("t_out", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"outlet\""), 300, 0.01,
                "{ kind = \"absolute\", value = \"0.2 K\", source = \"test\" }")
            .Channel("q_heater", SyntheticDay.Direct("heater_power", "W"), 360, 0.5);
        if (withInletTemperature)
        {
            day.Channel("t_in", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"inlet\""), 294.15, 0.01,
                "{ kind = \"absolute\", value = \"0.2 K\", source = \"test\" }");
        }
        return day;
    }

    internal static SyntheticDay OrificeDay() => Duct()
        .Channel("p_fm", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"meter\""), 101325, 1.0)
        .Channel("dp_fm", SyntheticDay.Direct("differential_pressure", "Pa"), 1000, 0.5)
        .Channel("t_fm", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"meter\""), MeterTemperatureK, 0.01)
        .Table("""
            [flow_meter]
            kind = "orifice"
            pipe_diameter = "100 mm"
            pipe_diameter_uncertainty = "0.02 mm"
            bore_diameter = "50 mm"
            bore_diameter_uncertainty = "0.01 mm"
            tapping = "flange"
            differential_pressure = "dp_fm"
            upstream_pressure = "p_fm"
            upstream_temperature = "t_fm"
            """);

    [Fact]
    public void Orifice_day_reproduces_the_worked_iterative_rating()
    {
        // Worked rating (domain-reference §9, ISO 5167-2:2003 equations, [CC]): D = 0.1 m, d = 0.05 m, flange
        // tappings, ρ1 = 1.2 kg/m3, μ = 1.8e-5 Pa s, Δp = 1000 Pa, p1 = 101 325 Pa, κ = 1.4 →
        // C = 0.6087082, ε = 0.9973835, q_m = 0.0603144 kg/s. Here μ comes from Sutherland at T1 (1.818e-5, 1 % above
        // the example), which moves Re_D by 1 % and C by about 5e-5 relative: tolerance 3e-4 relative on q_m.
        using var day = OrificeDay();
        var point = day.Process().Points.Single();

        var massFlow = point.Output("mass_flow")!;
        Assert.Equal(0.0603144, massFlow.Estimate, 0.0603144 * 3e-4);
        var meter = point.Model.FlowMeter!;
        Assert.Equal(0.9973835, meter.Result.Expansibility, 2e-6);
        Assert.Equal(0.6087082, meter.Result.DischargeCoefficient, 1e-4);
        Assert.Equal(1.2, meter.UpstreamDensityKgPerM3, 1e-4);
    }

    [Fact]
    public void Orifice_discharge_coefficient_uncertainty_enters_the_mass_flow_budget()
    {
        // ISO 5167-2 §5.3.3: U(C) = 0.5 % at β = 0.5, D > 71.12 mm → u = 0.25 % (k = 2). Bore 0.01 mm on 50 mm adds
        // about 2·0.02 % and the pipe 0.02 mm on 100 mm about 0.01 %: the total lies between 0.25 % and 0.27 %.
        using var day = OrificeDay();
        var point = day.Process().Points.Single();

        var massFlow = point.Output("mass_flow")!;
        var relative = massFlow.StandardUncertainty / massFlow.Estimate;
        Assert.InRange(relative, 0.0025, 0.0027);
        var c = massFlow.Budget.Single(b => b.InputName.StartsWith("discharge coefficient C", StringComparison.Ordinal));
        Assert.InRange(c.VarianceShare, 0.85, 1.0);
        Assert.Contains(massFlow.Budget, b => b.InputName == "orifice bore diameter" && b.VarianceShare > 0);
    }

    [Fact]
    public void Relative_humidity_channel_gives_CIPM_2007_density()
    {
        using var day = Duct().Table("""
            [flow_meter]
            kind = "orifice"
            pipe_diameter = "100 mm"
            bore_diameter = "50 mm"
            tapping = "corner"
            upstream_pressure = "p_fm"
            """)
            .Channel("p_fm", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"meter\""), 101325, 1.0)
            .Channel("dp_fm", SyntheticDay.Direct("differential_pressure", "Pa"), 1000, 0.5)
            .Channel("rh", SyntheticDay.Direct("relative_humidity", "%"), 50, 0.05);
        var point = day.Process().Points.Single();

        var p = point.Channels["p_in"].Mean;
        var t = point.Channels["t_in"].Mean;
        var rh = point.Channels["rh"].Mean;
        Assert.Equal(0.5, rh, 0.001);
        var density = point.Output("inlet.density")!.Estimate;
        Assert.Equal(MoistAir.FromRelativeHumidity(p, t, rh).DensityKgPerM3, density, 1e-12);
        // Vapour (M_v/M_a = 0.622) displaces air: x_v ≈ 0.5·2.5 kPa/100 kPa ≈ 0.0124 lowers ρ by ≈ 0.47 %.
        var dryRatio = density / DryAir.Density(p, t);
        Assert.InRange(1 - dryRatio, 0.004, 0.0055);
        Assert.InRange(point.Nominal.VapourMoleFraction, 0.011, 0.014);
        // The upstream temperature defaults to the inlet bulk temperature.
        Assert.Equal(t, point.Model.FlowMeter!.UpstreamTemperatureK, 1e-12);
    }

    [Fact]
    public void Rake_channels_give_the_inlet_temperature_profile_with_uncertainties()
    {
        const string u = "{ kind = \"absolute\", value = \"0.2 K\", source = \"test\" }";
        using var day = OrificeDay_without_inlet_temperature()
            .Channel("t_r0", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"inlet\"\nradius = \"0 mm\""), 300, 0.01, u)
            .Channel("t_r20", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"inlet\"\nradius = \"20 mm\""), 298, 0.01, u)
            .Channel("t_r40", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"inlet\"\nradius = \"40 mm\""), 294, 0.01, u);
        var point = day.Process().Points.Single();

        var means = new[] { point.Channels["t_r0"].Mean, point.Channels["t_r20"].Mean, point.Channels["t_r40"].Mean };
        double Expected(double r) => r >= 0.04 ? means[2] : r <= 0.02 ? means[0] + ((means[1] - means[0]) * r / 0.02) : means[1] + ((means[2] - means[1]) * (r - 0.02) / 0.02);
        var radii = point.Model.ProfileRadiiM;
        for (var i = 0; i < radii.Length; i++)
        {
            Assert.Equal(Expected(radii[i]), point.Output($"inlet.temperature_profile.{i}")!.Estimate, 1e-9);
        }
        // At the axis the profile is the rake sensor itself: u = 0.2 K/√3 (rectangular) plus a tiny Type A part.
        Assert.Equal(0.2 / Math.Sqrt(3), point.Output("inlet.temperature_profile.0")!.StandardUncertainty, 1e-3);
        Assert.True(point.Nominal.TemperatureProfile!.ClampedPointCount > 0);

        // No plane sensor: the bulk inlet temperature is the area mean ∫T 2πr dr/(πR²); reference by a fine trapezoid.
        const int n = 20000;
        var sum = 0.0;
        for (var i = 0; i < n; i++)
        {
            double r0 = 0.05 * i / n, r1 = 0.05 * (i + 1) / n;
            sum += 0.5 * ((Expected(r0) * r0) + (Expected(r1) * r1)) * (r1 - r0);
        }
        Assert.Equal(2 * sum / (0.05 * 0.05), point.Output("inlet.temperature")!.Estimate, 0.02);

        var profileCsv = BoundaryTables.InletProfile(point).ToString().Split('\n').First(l => l.StartsWith('0'));
        Assert.Equal(means[0], double.Parse(profileCsv.Split(',')[3], CultureInfo.InvariantCulture), 1e-9);
    }

    private static SyntheticDay OrificeDay_without_inlet_temperature() => Duct(withInletTemperature: false)
        .Channel("p_fm", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"meter\""), 101325, 1.0)
        .Channel("dp_fm", SyntheticDay.Direct("differential_pressure", "Pa"), 1000, 0.5)
        .Table("""
            [flow_meter]
            kind = "orifice"
            pipe_diameter = "100 mm"
            bore_diameter = "50 mm"
            tapping = "flange"
            upstream_pressure = "p_fm"
            """);

    [Theory]
    [InlineData(false, new[] { 0.3, 0.4, 0.5, 0.6, 0.7 }, new[] { 380.0, 385.0, 390.0, 395.0, 400.0 })]
    [InlineData(true, new[] { 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1 }, new[] { 380.0, 380.0, 380.0, 385.0, 390.0, 395.0, 400.0, 400.0, 400.0, 400.0, 400.0 })]
    public void Wall_temperatures_are_interpolated_on_the_axial_grid_without_extrapolation(bool clamp, double[] z, double[] expected)
    {
        const string u = "{ kind = \"absolute\", value = \"0.5 K\", source = \"test\" }";
        using var day = OrificeDay()
            .Channel("t_w1", SyntheticDay.Direct("wall_temperature", "K", "position = \"0.3 m\""), 380, 1e-4, u)
            .Channel("t_w2", SyntheticDay.Direct("wall_temperature", "K", "position = \"0.7 m\""), 400, 1e-4, u)
            .Table($"[wall]\naxial_points = 11\noutside_thermocouples = \"{(clamp ? "clamp" : "omit")}\"");
        var point = day.Process().Points.Single();

        Assert.Equal(z, point.Model.WallGridM.ToArray(), new ToleranceComparer(1e-12));
        for (var i = 0; i < z.Length; i++)
        {
            Assert.Equal(expected[i], point.Output($"wall.temperature_at.{i}")!.Estimate, 1e-3);
        }
        // Midway between two independent thermocouples u = √(0.25 u1² + 0.25 u2²) = u1/√2 (GUM 5.1.2, linear model).
        var u1 = point.Output("wall.temperature.t_w1")!.StandardUncertainty;
        var middle = Array.FindIndex(z, v => Math.Abs(v - 0.5) < 1e-9);
        Assert.Equal(u1 / Math.Sqrt(2), point.Output($"wall.temperature_at.{middle}")!.StandardUncertainty, u1 * 0.01);
        var wallCsv = BoundaryTables.Wall(point, day.Process()).ToString();
        Assert.Equal(z.Length, wallCsv.Split('\n').Count(l => l.Contains(",interpolated,", StringComparison.Ordinal)));
    }

    private sealed class ToleranceComparer(double tolerance) : IEqualityComparer<double>
    {
        public bool Equals(double x, double y) => Math.Abs(x - y) <= tolerance;

        public int GetHashCode(double obj) => 0;
    }
}
