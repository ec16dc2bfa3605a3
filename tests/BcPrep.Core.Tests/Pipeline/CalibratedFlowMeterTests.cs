using BcPrep.Physics;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// A flow meter's own calibration (a constant C or C(Re_D) from a flow-calibration certificate) and the ISO 5167-4
/// Venturi convergent forms, end to end through the point model. Worked example: the iterative rating of the
/// reference sheet §9 ([CC] from the ISO 5167-2:2003 equations): D = 0.1 m, d = 0.05 m, ρ1 = 1.2 kg/m3, Δp = 1000 Pa,
/// p1 = 101 325 Pa, κ = 1.4 → ε = 0.9973835, E = 1.0327956, C = 0.6087082, q_m = 0.0603144 kg/s.
/// </summary>
public class CalibratedFlowMeterTests
{
    private const double WorkedMassFlow = 0.0603144;
    private const double WorkedC = 0.6087082;

    private static SyntheticDay Meter(string table, string pipe = "100 mm") => BoundaryPhysicsTests.Duct()
        .Channel("p_fm", SyntheticDay.Direct("static_pressure", "Pa", "plane = \"meter\""), 101325, 1.0)
        .Channel("dp_fm", SyntheticDay.Direct("differential_pressure", "Pa"), 1000, 0.5)
        .Channel("t_fm", SyntheticDay.Direct("bulk_temperature", "K", "plane = \"meter\""), 101325.0 / (287.05 * 1.2), 0.01)
        .Table("""
            [flow_meter]
            pipe_diameter = "PIPE"
            differential_pressure = "dp_fm"
            upstream_pressure = "p_fm"
            upstream_temperature = "t_fm"

            """.Replace("PIPE", pipe, StringComparison.Ordinal) + table);

    [Fact]
    public void Orifice_with_a_certificate_constant_C_reproduces_the_worked_rating_and_budgets_the_certificate()
    {
        // With the worked example's C as the certificate's constant, q_m = C·E·ε·(π/4)d²√(2Δpρ1) (ISO 5167-1 eq. 1)
        // must equal the worked 0.0603144 kg/s to its printed digits (no Re_D iteration is involved).
        using var day = Meter("""
            kind = "orifice"
            tapping = "flange"
            bore_diameter = "50 mm"
            discharge_coefficient = 0.6087082
            discharge_coefficient_uncertainty = "0.3 %"
            discharge_coefficient_certificate = "FM-0042"
            """);
        var point = day.Process().Points.Single();
        var massFlow = point.Output("mass_flow")!;
        // The synthetic day's noise moves the Δp and ρ1 means by ~2e-5; q_m scales with √(Δp ρ1).
        var scale = Math.Sqrt(point.Channels["dp_fm"].Mean * point.Model.FlowMeter!.UpstreamDensityKgPerM3 / (1000.0 * 1.2));
        Assert.Equal(WorkedMassFlow * scale, massFlow.Estimate, WorkedMassFlow * 2e-6);
        Assert.Equal(WorkedC, point.Model.FlowMeter!.Result.DischargeCoefficient);
        Assert.StartsWith("flow calibration FM-0042", point.Model.FlowMeter.DischargeCoefficientSource, StringComparison.Ordinal);
        // Certificate U = 0.3 % with k = 2 → u = 0.15 % of q_m (GUM 4.3.3), sensitivity 1 on the factor.
        var c = massFlow.Budget.Single(b => b.InputName == "discharge coefficient C (flow calibration FM-0042)");
        Assert.Equal(0.0015, c.StandardUncertainty, 1e-12);
        Assert.Equal(0.0015 * massFlow.Estimate, c.Contribution, 1e-9);
    }

    [Fact]
    public void Calibrated_Venturi_is_read_with_its_certificate_C_not_the_machined_0_995()
    {
        // The example: a Venturi calibrated at C = 0.985 ± 0.5 % read with the machined-convergent 0.995
        // (ISO 5167-4, [FM] reference sheet §11) is biased by 1 %. Same meter, same day: q_m scales with C.
        const string venturi = """
            kind = "venturi"
            throat_diameter = "50 mm"
            """;
        using var standard = Meter(venturi);
        using var calibrated = Meter(venturi + "\ndischarge_coefficient = 0.985\ndischarge_coefficient_uncertainty = \"0.5 %\"\n");
        var qStandard = standard.Process().Points.Single();
        var qCalibrated = calibrated.Process().Points.Single();
        Assert.Equal(0.995, qStandard.Model.FlowMeter!.Result.DischargeCoefficient);
        Assert.Equal(0.985 / 0.995, qCalibrated.Output("mass_flow")!.Estimate / qStandard.Output("mass_flow")!.Estimate, 1e-12);
        var c = qCalibrated.Output("mass_flow")!.Budget.Single(b => b.InputName.StartsWith("discharge coefficient C (flow calibration", StringComparison.Ordinal));
        Assert.Equal(0.0025, c.StandardUncertainty, 1e-12);
    }

    [Fact]
    public void Venturi_at_the_edge_of_its_diameter_and_beta_range_gets_its_uncertainty()
    {
        // D = 50 mm and β = 0.4 are the lower ends of the machined convergent's range (ISO 5167-4, reference sheet §11,
        // from memory). The range describes the meter as built, so it is judged at the declared geometry: the GUM's
        // numerical derivative steps D and d a little below the edge, and that must not fail the point.
        using var day = Meter("""
            kind = "venturi"
            pipe_diameter_uncertainty = "0.02 mm"
            throat_diameter = "20 mm"
            throat_diameter_uncertainty = "0.01 mm"
            """, pipe: "50 mm");
        var point = day.Process().Points.Single();
        var massFlow = point.Output("mass_flow")!;
        Assert.Equal(0.4, point.Model.FlowMeter!.Result.DiameterRatio, 1e-12);
        // q_m ∝ d²/√(1 − β⁴) (ISO 5167-1 eq. 1): ∂ln q/∂d = 2/d + 2β⁴/(d(1 − β⁴)) = 2.0526/d, so the throat term is
        // 0.01 mm × 2.0526 / 20 mm = 0.1026 % of q_m.
        var throat = massFlow.Budget.Single(b => b.InputName == "Venturi throat diameter");
        Assert.Equal(0.01 * (2 + (2 * Math.Pow(0.4, 4) / (1 - Math.Pow(0.4, 4)))) / 20.0, Math.Abs(throat.Contribution) / massFlow.Estimate, 1e-5);
        Assert.Contains(massFlow.Budget, b => b.InputName == "flow meter pipe diameter" && b.SensitivityCoefficient != 0);
    }

    [Fact]
    public void Orifice_at_the_edge_of_its_diameter_range_gets_its_uncertainty()
    {
        // D = 50 mm and d = 12.5 mm are the lower ends of ISO 5167-2's range (reference sheet §9, ISO 5167-2 §5.3.1,
        // from memory); as for the Venturi, the range is judged at the declared geometry.
        using var day = Meter("""
            kind = "orifice"
            tapping = "corner"
            pipe_diameter_uncertainty = "0.02 mm"
            bore_diameter = "12.5 mm"
            bore_diameter_uncertainty = "0.005 mm"
            """, pipe: "50 mm");
        var massFlow = day.Process().Points.Single().Output("mass_flow")!;
        Assert.Contains(massFlow.Budget, b => b.InputName == "orifice bore diameter" && b.SensitivityCoefficient > 0);
        Assert.Contains(massFlow.Budget, b => b.InputName == "flow meter pipe diameter" && b.SensitivityCoefficient != 0);
    }

    [Fact]
    public void Meter_outside_its_range_is_still_refused_at_its_declared_geometry()
    {
        // β = 0.8 is above the machined convergent's 0.75 (ISO 5167-4, reference sheet §11, from memory).
        using var day = Meter("""
            kind = "venturi"
            throat_diameter = "80 mm"
            """);
        var failure = Assert.Throws<BcPrepFailure>(() => day.Process());
        Assert.Contains(failure.Problems, p => p.Message.Contains("diameter ratio beta", StringComparison.Ordinal));
    }

    [Fact]
    public void As_cast_convergent_takes_its_own_C_and_uncertainty()
    {
        // ISO 5167-4 as-cast convergent: C = 0.984, U = 0.7 % (reference sheet §11, from memory of the standard).
        using var day = Meter("""
            kind = "venturi"
            throat_diameter = "60 mm"
            convergent = "as_cast"
            """, pipe: "120 mm");
        var point = day.Process().Points.Single();
        var meter = point.Model.FlowMeter!;
        Assert.Equal(0.984, meter.Result.DischargeCoefficient);
        Assert.Equal(0.7, meter.Result.DischargeCoefficientExpandedUncertaintyPercent);
        Assert.Equal("ISO 5167-4, as-cast convergent", meter.DischargeCoefficientSource);
        var c = point.Output("mass_flow")!.Budget.Single(b => b.InputName.StartsWith("discharge coefficient C", StringComparison.Ordinal));
        Assert.Equal(0.0035, c.StandardUncertainty, 1e-12);
    }

    [Fact]
    public void Reynolds_table_is_interpolated_at_the_converged_Re_D()
    {
        // ISO 5167-1 eq. 1 with ε and E of the worked example: q_m/C = 0.0603144/0.6087082 kg/s; the table's C is
        // linear in Re_D between its points, and Re_D = 4 q_m/(π D μ) closes the loop.
        var calibration = new DischargeCalibration([(3.0e4, 0.600), (6.0e4, 0.615)], 0.4, 2.0, "FM-7");
        var input = new DifferentialPressureFlowInput(0.1, 0.05, 1000.0, 101325.0, 1.2, 1.8e-5, 1.4);
        var r = CalibratedMeter.MassFlow(input, calibration, venturi: false);
        var expectedC = 0.600 + (0.015 * (r.PipeReynolds - 3.0e4) / 3.0e4);
        Assert.Equal(expectedC, r.DischargeCoefficient, 1e-9);
        Assert.Equal(WorkedMassFlow / WorkedC * r.DischargeCoefficient, r.MassFlowKgPerS, r.MassFlowKgPerS * 2e-6);
        Assert.Equal(4.0 * r.MassFlowKgPerS / (Math.PI * 0.1 * 1.8e-5), r.PipeReynolds, 1e-6);
        Assert.Empty(r.Warnings);
        var outside = CalibratedMeter.MassFlow(input with { DifferentialPressurePa = 100.0 }, calibration, venturi: false);
        Assert.Equal(0.600, outside.DischargeCoefficient);
        Assert.Contains("outside the calibrated span", Assert.Single(outside.Warnings), StringComparison.Ordinal);
    }

    [Fact]
    public void Rough_welded_convergent_needs_its_larger_pipes()
    {
        // ISO 5167-4 rough-welded sheet-iron convergent: C = 0.985, 1.5 %, 200–1200 mm (reference sheet §11, [FM]).
        var input = new DifferentialPressureFlowInput(0.25, 0.125, 1000.0, 101325.0, 1.2, 1.8e-5, 1.4);
        var r = VenturiTube.MassFlow(input, VenturiConvergent.RoughWelded);
        Assert.Equal(0.985, r.DischargeCoefficient);
        Assert.Equal(1.5, r.DischargeCoefficientExpandedUncertaintyPercent);
        Assert.Throws<BcPrepDataException>(() => VenturiTube.MassFlow(input with { PipeDiameterM = 0.1, ThroatDiameterM = 0.05 }, VenturiConvergent.RoughWelded));
    }

    [Fact]
    public void Calibrated_C_without_its_uncertainty_or_a_convergent_on_an_orifice_is_refused_naming_the_key()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(SyntheticDay.Header + """
            [[channel]]
            id = "p_in"
            measures = "static_pressure"
            plane = "inlet"

            [flow_meter]
            kind = "orifice"
            tapping = "corner"
            pipe_diameter = "100 mm"
            bore_diameter = "50 mm"
            upstream_pressure = "p_in"
            convergent = "as_cast"
            discharge_coefficient = [[1e4, 0.61], [1e5, "x"]]
            """, "rig.toml"));
        Assert.Contains(failure.Problems, p => p.Location.Key!.EndsWith("convergent", StringComparison.Ordinal) && p.Message.Contains("only a Venturi", StringComparison.Ordinal));
        Assert.Contains(failure.Problems, p => p.Location.Key!.EndsWith("discharge_coefficient", StringComparison.Ordinal) && p.Message.Contains("uncertainty", StringComparison.Ordinal));
        Assert.Contains(failure.Problems, p => p.Message.Contains("[Re_D, C]", StringComparison.Ordinal));
    }
}
