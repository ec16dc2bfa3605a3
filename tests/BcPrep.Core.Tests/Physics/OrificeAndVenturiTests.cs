using BcPrep.Physics;

namespace BcPrep.Tests.Physics;

public class OrificeAndVenturiTests
{
    private static void AssertRelative(double expected, double actual, double relativeTolerance) =>
        Assert.InRange(actual / expected - 1.0, -relativeTolerance, relativeTolerance);

    private static double ReynoldsOf(double massFlow, double diameter, double viscosity) => 4.0 * massFlow / (Math.PI * diameter * viscosity);

    [Fact]
    public void Reader_Harris_Gallagher_flange_matches_the_fluids_docstring()
    {
        // [CS] fluids library docstring (ISO 5167-2:2003): D = 0.07391, d = 0.0222, μ = 1.85e-5, q_m = 0.12, flange → 0.5990326277163659.
        var re = ReynoldsOf(0.12, 0.07391, 1.85e-5);
        AssertRelative(0.5990326277163659, OrificePlate.DischargeCoefficient(0.07391, 0.0222, re, OrificeTapping.Flange), 1e-9);
    }

    [Theory]
    [InlineData(OrificeTapping.Corner, 0.6000370)]
    [InlineData(OrificeTapping.DAndDOver2, 0.5988503)]
    public void Reader_Harris_Gallagher_corner_and_D_D2_match_the_computed_check_values(OrificeTapping tapping, double expected)
    {
        // [CC] domain reference sheet §9, same inputs as the docstring case; 7 decimals printed.
        var re = ReynoldsOf(0.12, 0.07391, 1.85e-5);
        Assert.Equal(expected, OrificePlate.DischargeCoefficient(0.07391, 0.0222, re, tapping), 7);
    }

    [Theory]
    [InlineData(0.3, 1e5, 0.599304)]
    [InlineData(0.5, 1e5, 0.606201)]
    [InlineData(0.6, 1e5, 0.610845)]
    [InlineData(0.7, 1e5, 0.613595)]
    [InlineData(0.5, 1e4, 0.617739)]
    [InlineData(0.5, 1e6, 0.603132)]
    [InlineData(0.5, 1e8, 0.601571)]
    public void Flange_C_over_beta_and_Re_matches_the_computed_table(double beta, double reynolds, double expected)
    {
        // [CC] domain reference sheet §9, D = 0.1 m, flange tappings, 6 decimals printed.
        Assert.Equal(expected, OrificePlate.DischargeCoefficient(0.1, 0.1 * beta, reynolds, OrificeTapping.Flange), 6);
    }

    [Fact]
    public void Small_pipe_term_is_added_below_71_12_mm()
    {
        // ISO 5167-2 §5.3.2.1: + 0.011(0.75 − β)(2.8 − D/25.4) for D < 71.12 mm. At D = 60 mm, β = 0.5 the
        // term is 0.011·0.25·(2.8 − 2.3622) = 1.2039e-3; compare with the same β just above the limit, where
        // everything else except the flange L terms is equal — so use corner tappings (L independent of D).
        var small = OrificePlate.DischargeCoefficient(0.060, 0.030, 1e5, OrificeTapping.Corner);
        var withoutTerm = OrificePlate.DischargeCoefficient(0.080, 0.040, 1e5, OrificeTapping.Corner);
        Assert.Equal(0.011 * 0.25 * (2.8 - (60.0 / 25.4)), small - withoutTerm, 12);
    }

    [Fact]
    public void Expansibility_matches_the_fluids_docstring()
    {
        // [CS] fluids docstring: ε(D = 0.0739, d = 0.0222, p1 = 1e5, p2 = 9.9e4, κ = 1.4) = 0.9974739057343425.
        AssertRelative(0.9974739057343425, OrificePlate.Expansibility(0.0739, 0.0222, 1e5, 9.9e4, 1.4), 1e-9);
        Assert.Throws<BcPrepDataException>(() => OrificePlate.Expansibility(0.0739, 0.0222, 1e5, 7.0e4, 1.4));
    }

    [Fact]
    public void Iterative_rating_matches_the_computed_check_case()
    {
        // [CC] domain reference sheet §9: D = 0.1, d = 0.05, ρ1 = 1.2, μ = 1.8e-5, Δp = 1000, p1 = 101325, κ = 1.4, flange.
        var result = OrificeMeter.MassFlow(new DifferentialPressureFlowInput(0.1, 0.05, 1000.0, 101325.0, 1.2, 1.8e-5, 1.4), OrificeTapping.Flange);
        AssertRelative(0.0603144, result.MassFlowKgPerS, 1e-6);
        Assert.Equal(0.9973835, result.Expansibility, 7);
        Assert.Equal(1.0327956, result.VelocityOfApproachFactor, 7);
        Assert.Equal(0.6087082, result.DischargeCoefficient, 7);
        Assert.Equal(42664.0, result.PipeReynolds, 0);
        Assert.Equal(0.0247, result.ExpansibilityExpandedUncertaintyPercent, 4);
        Assert.Equal(0.5, result.DischargeCoefficientExpandedUncertaintyPercent, 12);
        Assert.Empty(result.Warnings);
    }

    [Fact]
    public void Converged_rating_is_self_consistent_to_1e_10()
    {
        var input = new DifferentialPressureFlowInput(0.08, 0.05, 2500.0, 2.0e5, 2.3, 1.85e-5, 1.4);
        var r = OrificeMeter.MassFlow(input, OrificeTapping.DAndDOver2);
        var c = OrificePlate.DischargeCoefficient(0.08, 0.05, r.PipeReynolds, OrificeTapping.DAndDOver2);
        var q = c * r.VelocityOfApproachFactor * r.Expansibility * Math.PI / 4.0 * 0.05 * 0.05 * Math.Sqrt(2.0 * 2500.0 * 2.3);
        AssertRelative(q, r.MassFlowKgPerS, 1e-10);
    }

    [Theory]
    [InlineData(0.1, 0.05, 0.5, 1e5, 0.5)]         // 0.2 ≤ β ≤ 0.6
    [InlineData(0.1, 0.015, 0.15, 1e5, 0.55)]      // β < 0.2: 0.7 − β
    [InlineData(0.1, 0.07, 0.7, 1e5, 0.6669)]      // β > 0.6: 1.667β − 0.5
    [InlineData(0.1, 0.07, 0.7, 8e3, 1.1669)]      // + 0.5 for β > 0.5 and Re < 10 000
    public void Discharge_coefficient_uncertainty_follows_ISO_5167_2_clause_5_3_3(double diameter, double bore, double beta, double reynolds, double expectedPercent)
    {
        Assert.Equal(beta, bore / diameter, 12);
        Assert.Equal(expectedPercent, OrificePlate.DischargeCoefficientExpandedUncertaintyPercent(diameter, bore, reynolds), 10);
    }

    [Fact]
    public void Discharge_coefficient_uncertainty_adds_the_small_pipe_term()
    {
        // ISO 5167-2 §5.3.3: + 0.9(0.75 − β)(2.8 − D/25.4) % for D < 71.12 mm.
        var expected = 0.5 + (0.9 * 0.25 * (2.8 - (60.0 / 25.4)));
        Assert.Equal(expected, OrificePlate.DischargeCoefficientExpandedUncertaintyPercent(0.060, 0.030, 1e5), 12);
    }

    [Fact]
    public void Out_of_standard_geometry_throws_and_low_Reynolds_only_warns()
    {
        Assert.Throws<BcPrepDataException>(() => OrificeMeter.MassFlow(new DifferentialPressureFlowInput(0.04, 0.02, 1000, 101325, 1.2, 1.8e-5, 1.4), OrificeTapping.Corner));
        Assert.Throws<BcPrepDataException>(() => OrificeMeter.MassFlow(new DifferentialPressureFlowInput(0.1, 0.08, 1000, 101325, 1.2, 1.8e-5, 1.4), OrificeTapping.Corner));
        var lowFlow = OrificeMeter.MassFlow(new DifferentialPressureFlowInput(0.1, 0.05, 1.0, 101325, 1.2, 1.8e-5, 1.4), OrificeTapping.Corner);
        Assert.True(lowFlow.PipeReynolds < 5000.0);
        Assert.Single(lowFlow.Warnings);
    }

    [Fact]
    public void Venturi_expansibility_reproduces_isentropic_nozzle_flow()
    {
        // Textbook isentropic nozzle flow (St Venant–Wantzel) with C = 1:
        // q = A2 √(2ρ1p1 κ/(κ−1)(τ^{2/κ} − τ^{(κ+1)/κ})/(1 − β⁴τ^{2/κ})) must equal ε E A2 √(2Δpρ1). Relative 1e-12.
        const double kappa = 1.4, beta = 0.5, p1 = 101325.0, dp = 5000.0, rho = 1.2, d = 0.05;
        var tau = (p1 - dp) / p1;
        var t2 = Math.Pow(tau, 2.0 / kappa);
        var area = Math.PI / 4.0 * d * d;
        var nozzle = area * Math.Sqrt(2.0 * rho * p1 * kappa / (kappa - 1.0) * (t2 - Math.Pow(tau, (kappa + 1.0) / kappa)) / (1.0 - (Math.Pow(beta, 4) * t2)));
        var eps = VenturiTube.Expansibility(0.1, d, p1, p1 - dp, kappa);
        var viaEpsilon = eps / Math.Sqrt(1.0 - Math.Pow(beta, 4)) * area * Math.Sqrt(2.0 * dp * rho);
        AssertRelative(nozzle, viaEpsilon, 1e-12);
        Assert.Equal(0.9709519353060233, eps, 12); // [CC] Python evaluation of the same ISO 5167-4 expression.
    }

    [Fact]
    public void Venturi_mass_flow_uses_C_0p995_and_warns_below_its_Reynolds_range()
    {
        var r = VenturiTube.MassFlow(new DifferentialPressureFlowInput(0.1, 0.05, 5000.0, 101325.0, 1.2, 1.8e-5, 1.4));
        AssertRelative(0.995 * 0.21569128935714887, r.MassFlowKgPerS, 1e-12); // [CC]
        Assert.Equal(1.0, r.DischargeCoefficientExpandedUncertaintyPercent);
        Assert.Equal((4.0 + (100.0 * Math.Pow(0.5, 8))) * 5000.0 / 101325.0, r.ExpansibilityExpandedUncertaintyPercent, 12);
        Assert.Single(r.Warnings); // Re_D ≈ 1.5e5 < 2e5
        Assert.Equal(1.0, VenturiTube.Expansibility(0.1, 0.05, 1e5, 1e5, 1.4));
    }
}
