using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

/// <summary>JCGM 101:2008 clause 9 examples; MCM values are the reference sheet 3.3 [CC] numbers (±0.01 relative).</summary>
public class MonteCarloPropagationTests
{
    private static readonly MonteCarloOptions Fixed = new(Seed: 12345, FixedTrials: 200_000);

    private static UncertaintyInput[] Additive(DistributionKind kind, double u4 = 1.0) =>
    [
        new("X1", 0.0, 1.0, distribution: kind),
        new("X2", 0.0, 1.0, distribution: kind),
        new("X3", 0.0, 1.0, distribution: kind),
        new("X4", 0.0, u4, distribution: kind),
    ];

    private static double Sum(double[] x) => x[0] + x[1] + x[2] + x[3];

    [Fact]
    public void JCGM101_9_2_2_normal_inputs_validate_the_GUM_result()
    {
        var inputs = Additive(DistributionKind.Normal);
        var mc = MonteCarloPropagation.Propagate(Sum, inputs, "Y", options: Fixed);
        Assert.Equal(0.0, mc.Estimate, 0.02);
        Assert.Equal(2.00, mc.StandardUncertainty, 0.02);
        Assert.Equal(-3.92, mc.Low, 0.05);
        Assert.Equal(3.92, mc.High, 0.05);
        var validation = GufValidation.Compare(GumPropagation.Propagate(Sum, inputs, "Y"), mc, 2);
        Assert.Equal(0.05, validation.Tolerance, 12);
        Assert.True(validation.IsValidated);
    }

    [Fact]
    public void JCGM101_9_2_3_rectangular_inputs_narrow_the_interval()
    {
        var mc = MonteCarloPropagation.Propagate(Sum, Additive(DistributionKind.Rectangular), "Y", options: Fixed);
        Assert.Equal(2.00, mc.StandardUncertainty, 0.02);
        Assert.Equal(-3.88, mc.Low, 0.04);
        Assert.Equal(3.88, mc.High, 0.04);
    }

    [Fact]
    public void JCGM101_9_2_4_dominant_rectangular_input_fails_validation()
    {
        var inputs = Additive(DistributionKind.Rectangular, 10.0);
        var mc = MonteCarloPropagation.Propagate(Sum, inputs, "Y", options: Fixed);
        Assert.Equal(10.1, mc.StandardUncertainty, 0.1);
        Assert.Equal(-17.0, mc.Low, 0.1);
        Assert.Equal(17.0, mc.High, 0.1);
        var gum = GumPropagation.Propagate(Sum, inputs, "Y");
        Assert.Equal(19.9, gum.ExpandedUncertainty, 0.05);
        Assert.False(GufValidation.Compare(gum, mc, 2).IsValidated);
    }

    private static UncertaintyInput[] MassInputs() =>
    [
        // JCGM 101 9.3 (sheet 3.3): mg and kg/m³.
        new("m_Rc", 100_000.000, 0.050),
        new("dm_Rc", 1.234, 0.020),
        new("rho_a", 1.20, TypeB.FromRectangularHalfWidth(0.10), distribution: DistributionKind.Rectangular),
        new("rho_W", 8000.0, TypeB.FromRectangularHalfWidth(1000.0), distribution: DistributionKind.Rectangular),
        new("rho_R", 8000.0, TypeB.FromRectangularHalfWidth(50.0), distribution: DistributionKind.Rectangular),
    ];

    private static double MassModel(double[] x) =>
        (x[0] + x[1]) * (1.0 + (x[2] - 1.2) * (1.0 / x[3] - 1.0 / x[4])) - 100_000.0;

    [Fact]
    public void JCGM101_9_3_mass_calibration_MCM_exceeds_first_order_GUF_and_validation_flags_it()
    {
        var gum = GumPropagation.Propagate(MassModel, MassInputs(), "dm");
        Assert.Equal(1.2340, gum.Estimate, 0.0001);
        Assert.Equal(0.0539, gum.StandardUncertainty, 0.0001); // first-order GUF [CC]
        Assert.Equal(1.1285, gum.Estimate - gum.ExpandedUncertainty, 0.0002);

        var mc = MonteCarloPropagation.Propagate(MassModel, MassInputs(), "dm", options: Fixed);
        Assert.Equal(1.2340, mc.Estimate, 0.001);
        Assert.Equal(0.0755, mc.StandardUncertainty, 0.001);
        Assert.Equal(1.0844, mc.Low, 0.002);
        Assert.Equal(1.3836, mc.High, 0.002);
        Assert.Equal(1.0842, mc.ShortestLow, 0.002);
        Assert.Equal(1.3834, mc.ShortestHigh, 0.002);

        var validation = GufValidation.Compare(gum, mc, 2);
        Assert.False(validation.IsValidated);
        Assert.True(validation.LowDifference > 0.04);
    }

    [Fact]
    public void Adaptive_procedure_JCGM101_7_9_stops_in_whole_blocks()
    {
        var mc = MonteCarloPropagation.Propagate(x => [MassModel(x)], MassInputs(), ["dm"], options: new MonteCarloOptions(Seed: 5, SignificantDigits: 1));
        Assert.True(mc.Converged);
        Assert.Equal(0, mc.Trials % 10_000);
        Assert.True(mc.Trials >= 20_000);
        Assert.Equal(0.0755, mc.Outputs[0].StandardUncertainty, 0.003);
    }

    [Theory]
    [InlineData(0.025, 2, 0.0005)] // JCGM 101 7.9.2 example
    [InlineData(0.0755, 1, 0.005)]
    [InlineData(10.1, 2, 0.5)]
    [InlineData(0.0996, 2, 0.005)] // rounds up to 0.10
    public void Numerical_tolerance_JCGM101_7_9_2(double u, int digits, double delta)
    {
        Assert.Equal(delta, GufValidation.NumericalTolerance(u, digits), 15);
    }

    [Fact]
    public void Same_seed_same_result_other_seed_other_result()
    {
        var a = MonteCarloPropagation.Propagate(MassModel, MassInputs(), "dm", options: new MonteCarloOptions(Seed: 9, FixedTrials: 5000));
        var b = MonteCarloPropagation.Propagate(MassModel, MassInputs(), "dm", options: new MonteCarloOptions(Seed: 9, FixedTrials: 5000));
        var c = MonteCarloPropagation.Propagate(MassModel, MassInputs(), "dm", options: new MonteCarloOptions(Seed: 10, FixedTrials: 5000));
        Assert.Equal(a, b);
        Assert.NotEqual(a.StandardUncertainty, c.StandardUncertainty);
    }

    [Theory]
    [InlineData(0.5, 1.7320508075688772)]
    [InlineData(1.0, 2.0)]
    public void Correlated_normal_inputs_match_reference_sheet_3_2_d(double r, double expected)
    {
        UncertaintyInput[] inputs = [new("x1", 1.0, 1.0), new("x2", 2.0, 1.0)];
        var corr = CorrelationMatrix.FromPairs(2, [(0, 1, r)]);
        var sum = MonteCarloPropagation.Propagate(x => [x[0] + x[1], x[0] - x[1]], inputs, ["sum", "diff"], corr, Fixed);
        Assert.Equal(expected, sum.Outputs[0].StandardUncertainty, 0.02);
        Assert.Equal(Math.Sqrt(2.0 - 2.0 * r), sum.Outputs[1].StandardUncertainty, 0.02);
    }

    [Fact]
    public void GUM_H_2_output_correlation_agrees_between_MCM_and_GUF()
    {
        UncertaintyInput[] inputs = [new("V", 4.9990, 0.0032), new("I", 19.6610e-3, 0.0095e-3), new("phi", 1.04446, 0.00075)];
        var corr = CorrelationMatrix.FromPairs(3, [(0, 1, -0.36), (0, 2, 0.86), (1, 2, -0.65)]);
        static double[] Model(double[] x) => [x[0] / x[1] * Math.Cos(x[2]), x[0] / x[1] * Math.Sin(x[2]), x[0] / x[1]];
        var mc = MonteCarloPropagation.Propagate(Model, inputs, ["R", "X", "Z"], corr, Fixed);
        var cov = mc.OutputCovariance;
        // GTC summary inputs (sheet 3.2(a)): r(R,X) = −0.59, r(X,Z) = +0.99; u(R) = 0.070–0.071 Ω.
        Assert.Equal(-0.59, cov[0, 1] / Math.Sqrt(cov[0, 0] * cov[1, 1]), 0.02);
        Assert.Equal(0.99, cov[1, 2] / Math.Sqrt(cov[1, 1] * cov[2, 2]), 0.01);
        Assert.Equal(0.0711, mc.Outputs[0].StandardUncertainty, 0.002);
    }

    [Fact]
    public void Correlated_rectangular_input_is_refused()
    {
        UncertaintyInput[] inputs = [new("x1", 0.0, 1.0, distribution: DistributionKind.Rectangular), new("x2", 0.0, 1.0)];
        Assert.Throws<BcPrepDataException>(() =>
            MonteCarloPropagation.Propagate(x => x[0] + x[1], inputs, "y", CorrelationMatrix.FromPairs(2, [(0, 1, 0.3)]), Fixed));
    }
}
