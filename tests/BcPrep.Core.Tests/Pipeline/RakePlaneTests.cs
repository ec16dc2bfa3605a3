using System.Text.Json.Nodes;
using BcPrep.Physics;
using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// Temperature rakes at planes other than the inlet: the mixing-cup temperature T_b = ∫ρ u cp T dA / ∫ρ u cp dA
/// (definition of the bulk temperature of internal flow, Incropera &amp; DeWitt §8.2, equation numbers from memory),
/// its uncertainty by the GUM, and where it is written.
/// </summary>
public class RakePlaneTests
{
    private const string U = "{ kind = \"absolute\", value = \"0.2 K\", source = \"test\" }";

    /// <summary>A turbulent duct (ṁ 0.05 kg/s in D 100 mm: Re_D ≈ 3.4·10⁴) with a three-sensor rake at <paramref name="plane"/>.</summary>
    private static SyntheticDay RakeDay(string plane, bool plainOutlet = false)
    {
        var day = new SyntheticDay()
            .Channel("p_in", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"inlet\""), 100000, 0.5, "{ kind = \"absolute\", value = \"5 Pa\", source = \"test\" }")
            .Channel("p_out", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"outlet\""), 99950, 0.5, "{ kind = \"absolute\", value = \"5 Pa\", source = \"test\" }")
            .Channel("t_in", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"inlet\""), 294.15, 0.01, U)
            .Channel("m_dot", SyntheticDay.Direct("mass_flow", "kg/s"), 0.05, 1e-5)
            .Channel("q_heater", SyntheticDay.Direct("heater_power", "W"), 360, 0.5)
            .Channel("t_r0", SyntheticDay.Direct("bulk_temperature", "K", $"plane = \"{plane}\"\nradius = \"0 mm\""), 300, 0.01, U)
            .Channel("t_r25", SyntheticDay.Direct("bulk_temperature", "K", $"plane = \"{plane}\"\nradius = \"25 mm\""), 302, 0.01, U)
            .Channel("t_r50", SyntheticDay.Direct("bulk_temperature", "K", $"plane = \"{plane}\"\nradius = \"50 mm\""), 310, 0.01, U);
        if (plainOutlet)
        {
            day.Channel("t_out", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"outlet\""), 301, 0.01, U);
        }
        return day;
    }

    /// <summary>
    /// The definition evaluated independently: T(r) linear between the rake's window means, u ∝ (1 − r/R)^(1/n) with
    /// the exponent the point used, cp(T) of dry air, integrated by a uniform trapezoid of 200 000 steps.
    /// </summary>
    private static (double MixingCup, double AreaMean) Reference(PointResult point, double exponent)
    {
        double[] means = [point.Channels["t_r0"].Mean, point.Channels["t_r25"].Mean, point.Channels["t_r50"].Mean];
        double T(double s) => s <= 0.5 ? means[0] + ((means[1] - means[0]) * s / 0.5) : means[1] + ((means[2] - means[1]) * (s - 0.5) / 0.5);
        const int steps = 200_000;
        double enthalpy = 0, capacity = 0, area = 0;
        for (var i = 0; i <= steps; i++)
        {
            var s = (double)i / steps;
            var w = i is 0 or steps ? 0.5 : 1.0;
            var u = Math.Pow(1 - s, 1 / exponent);
            var cp = DryAir.SpecificHeatCp(T(s));
            enthalpy += w * u * cp * T(s) * s;
            capacity += w * u * cp * s;
            area += w * T(s) * s;
        }
        return (enthalpy / capacity, area / (0.5 * steps));
    }

    [Fact]
    public void Outlet_rake_gives_the_outlet_mixing_cup_temperature_with_its_uncertainty()
    {
        using var day = RakeDay("outlet");
        var point = day.Process().Points.Single();
        var cup = point.Output(PointOutputs.OutletMixingCupTemperature)!;
        var rake = point.Nominal.Rakes.Single(r => r.Plane == "outlet");
        // n = 1/√f at the outlet's Re (Colebrook, De Chant 2005 from memory): about 6.4 at Re 3·10⁴.
        Assert.InRange(rake.Velocity.PowerLawExponent, 6.0, 6.8);
        var (mixingCup, areaMean) = Reference(point, rake.Velocity.PowerLawExponent);
        // The default 201-point grid against the fine reference: within 0.01 K (see MixingCupTests); the area mean
        // is far enough away (more than 0.3 K) that a wrong weighting fails this check.
        Assert.Equal(mixingCup, cup.Estimate, 0.01);
        Assert.True(areaMean - mixingCup > 0.3, $"area mean {areaMean} K, mixing cup {mixingCup} K");
        Assert.Equal(areaMean, rake.AreaMeanK, 0.01);

        // Without an outlet channel the outlet bulk temperature (energy balance, pressure drop) is the mixing cup.
        Assert.False(point.Model.HasPlainOutletTemperature);
        Assert.Equal(cup.Estimate, point.Output(PointOutputs.OutletTemperature)!.Estimate, 1e-9);

        // GUM: a common shift of every rake sensor shifts T_b by the same amount (T_b is a weighted mean, definition),
        // so the sensitivities to the three sensors' terms add up to 1 (cp(T) moves the weights by < 1e-3).
        var sensorTerms = cup.Budget.Where(b => b.InputName is "t_r0: test" or "t_r25: test" or "t_r50: test").ToList();
        Assert.Equal(3, sensorTerms.Count);
        Assert.Equal(1.0, sensorTerms.Sum(b => b.SensitivityCoefficient), 1e-3);
        Assert.All(sensorTerms, b => Assert.InRange(b.SensitivityCoefficient, 0.05, 0.95));
        // u is at least the smallest weighted share of the 0.2 K rectangular terms and at most one whole term.
        Assert.InRange(cup.StandardUncertainty, 0.2 / Math.Sqrt(3) / Math.Sqrt(3), 0.2 / Math.Sqrt(3) * 1.01);
        Assert.Contains(cup.Budget, b => b.InputName == PointModel.ProfileShapeInputName && b.SensitivityCoefficient != 0);
    }

    [Fact]
    public void With_an_outlet_channel_the_mixing_cup_is_written_beside_it()
    {
        using var day = RakeDay("outlet", plainOutlet: true);
        var result = day.Process();
        var point = result.Points.Single();
        Assert.True(point.Model.HasPlainOutletTemperature);
        Assert.Equal(point.Channels["t_out"].Mean, point.Output(PointOutputs.OutletTemperature)!.Estimate, 1e-9);
        var cup = point.Output(PointOutputs.OutletMixingCupTemperature)!;

        var outletCsv = BoundaryTables.OutletPlane(point).ToString();
        Assert.Contains("outlet.mixing_cup_temperature,K,", outletCsv, StringComparison.Ordinal);
        var summary = BoundaryTables.Summary(result).ToString().Split('\n').First(l => l.StartsWith("point,", StringComparison.Ordinal));
        Assert.Contains("outlet.mixing_cup_temperature [K],u(outlet.mixing_cup_temperature) [K]", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("inlet.mixing_cup_temperature", summary, StringComparison.Ordinal);
        Assert.Contains("outlet.mixing_cup_temperature", BoundaryTables.Scalars(point).ToString(), StringComparison.Ordinal);

        var rakes = BoundaryTables.Rakes(point)!.ToString().Split('\n');
        Assert.Equal(point.Model.ProfileRadiiM.Length, rakes.Count(l => l.StartsWith("outlet,", StringComparison.Ordinal)));
        Assert.Contains(rakes, l => l.StartsWith("# outlet: mixing-cup temperature", StringComparison.Ordinal));

        var manifest = JsonNode.Parse(ManifestWriter.Write(result, new RunProvenance("test", new InputFingerprint("rig.toml", 1, new string('0', 64)), []), ["summary.csv"]))!;
        var written = manifest["points"]![0]!["boundary"]!["temperature_rakes"]![0]!;
        Assert.Equal("outlet", (string?)written["plane"]);
        Assert.Equal("K", (string?)written["unit"]);
        Assert.Equal(cup.Estimate, (double)written["mixing_cup_temperature"]!, 1e-12);
        Assert.False((bool)written["is_plane_bulk_temperature"]!);
        var quantity = manifest["points"]![0]!["quantities"]!.AsArray().Single(q => (string?)q!["name"] == "outlet.mixing_cup_temperature")!;
        Assert.Equal("K", (string?)quantity["unit"]);
    }

    [Fact]
    public void A_rake_at_any_other_plane_gives_that_planes_mixing_cup_and_profile()
    {
        using var day = RakeDay("meter");
        var point = day.Process().Points.Single();
        var cup = point.Output("meter.mixing_cup_temperature")!;
        var rake = point.Nominal.Rakes.Single(r => r.Plane == "meter");
        Assert.Equal(Reference(point, rake.Velocity.PowerLawExponent).MixingCup, cup.Estimate, 0.01);
        Assert.True(cup.StandardUncertainty > 0);
        // Its profile points are profile outputs (rakes.csv), not scalars; the mixing cup is a scalar with a budget.
        Assert.Equal(QuantityKind.ProfilePoint, point.Model.Outputs.Single(o => o.Name == "meter.temperature_profile.0").Kind);
        Assert.Equal(point.Channels["t_r0"].Mean, point.Output("meter.temperature_profile.0")!.Estimate, 1e-9);
        Assert.Contains("meter.mixing_cup_temperature", BoundaryTables.Budget(point).ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("meter.temperature_profile", BoundaryTables.Scalars(point).ToString(), StringComparison.Ordinal);
        // The outlet keeps its own temperature (here none: the inlet's, as before).
        Assert.Null(point.Output(PointOutputs.OutletMixingCupTemperature));
    }

    [Fact]
    public void Inlet_rake_reports_its_mixing_cup_beside_the_area_mean_bulk_temperature()
    {
        using var day = RakeDay("inlet");
        var point = day.Process().Points.Single();
        var rake = point.Nominal.Rakes.Single(r => r.Plane == "inlet");
        Assert.Equal(Reference(point, point.Nominal.Velocity.PowerLawExponent).MixingCup, point.Output(PointOutputs.InletMixingCupTemperature)!.Estimate, 0.01);
        Assert.Equal(rake.MixingCupK, point.Output(PointOutputs.InletMixingCupTemperature)!.Estimate, 1e-9);
    }
}
