using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class GumPropagationTests
{
    private static readonly UncertaintyInput[] TwoUnitInputs = [new("x1", 1.0, 1.0), new("x2", 2.0, 1.0)];

    [Theory]
    [InlineData(0.0, 1.4142135623730951)]
    [InlineData(0.5, 1.7320508075688772)]
    [InlineData(1.0, 2.0)]
    [InlineData(-1.0, 0.0)]
    public void Sum_with_correlation_reference_sheet_3_2_d(double r, double expected)
    {
        var y = GumPropagation.Propagate(x => x[0] + x[1], TwoUnitInputs, "y", CorrelationMatrix.FromPairs(2, [(0, 1, r)]));
        Assert.Equal(expected, y.StandardUncertainty, 1e-7);
    }

    [Fact]
    public void Difference_with_full_correlation_cancels_reference_sheet_3_2_d()
    {
        var y = GumPropagation.Propagate(x => x[0] - x[1], TwoUnitInputs, "dT", CorrelationMatrix.FromPairs(2, [(0, 1, 1.0)]));
        Assert.Equal(0.0, y.StandardUncertainty, 1e-7);
        // Diagonal part 1 + 1 = 2 is cancelled entirely by the correlation term −2 (GUM eq. 13).
        Assert.Equal(-2.0, y.CorrelationVariance, 1e-9);
        Assert.Equal(double.PositiveInfinity, y.DegreesOfFreedom);
    }

    [Fact]
    public void Correlation_line_and_input_shares_add_to_one()
    {
        var y = GumPropagation.Propagate(x => x[0] + 2 * x[1], TwoUnitInputs, "y", CorrelationMatrix.FromPairs(2, [(0, 1, 0.5)]));
        // u² = 1 + 4 + 2·1·2·0.5 = 7: shares 1/7, 4/7 and correlation 2/7 (GUM eq. 13).
        Assert.Equal(7.0, y.StandardUncertainty * y.StandardUncertainty, 1e-7);
        Assert.Equal(1.0 / 7.0, y.Budget[0].VarianceShare, 1e-9);
        Assert.Equal(4.0 / 7.0, y.Budget[1].VarianceShare, 1e-9);
        Assert.Equal(2.0 / 7.0, y.CorrelationVarianceShare, 1e-9);
        Assert.Equal(2.0, y.Budget[1].SensitivityCoefficient, 1e-9);
    }

    [Fact]
    public void Type_B_dominated_budget_with_huge_welch_satterthwaite_dof_gets_the_normal_k()
    {
        // A Type B term (ν = ∞) of u = 1 and a Type A term of u = 1e-4 with ν = 9: ν_eff = u_c⁴ / (1e-16 / 9) ≈ 9e16
        // (GUM G.2b), where the library's t inverse gave k ≈ 1.7 to 2.8. GUM Table G.2 / G.3: k → 1.960 as ν → ∞
        // (1.9599639845400539, mpmath 1.3 [CC]).
        UncertaintyInput[] inputs = [new("b", 1.0, 1.0), new("a", 0.0, 1e-4, 9.0, evaluation: EvaluationType.TypeA)];
        var y = GumPropagation.Propagate(x => x[0] + x[1], inputs, "y", CorrelationMatrix.Identity(2));
        Assert.True(y.DegreesOfFreedom > 1e16, $"ν_eff = {y.DegreesOfFreedom}");
        Assert.Equal(1.9599639845400539, y.CoverageFactor, 1e-12);
        Assert.Equal(1.9599639845400539 * y.StandardUncertainty, y.ExpandedUncertainty, 1e-12);
    }

    /// <summary>GUM H.2 raw data (five simultaneous sets; reference sheet 3.2(a)), SI units (A, not mA).</summary>
    private static SimultaneousMeans H2Means() => SimultaneousMeans.FromSets(
    [
        [5.007, 19.663e-3, 1.0456],
        [4.994, 19.639e-3, 1.0438],
        [5.005, 19.640e-3, 1.0468],
        [4.990, 19.685e-3, 1.0428],
        [4.999, 19.678e-3, 1.0433],
    ]);

    [Fact]
    public void GUM_H_2_input_means_and_correlations_from_raw_sets_eq_17()
    {
        var m = H2Means();
        // Sheet 3.2(a): V̄ = 4.9990 V, u = 0.0032 V; Ī = 19.6610 mA, u = 0.0095 mA; φ̄ = 1.04446 rad, u = 0.00075 rad;
        // computed r = −0.355, 0.858, −0.645.
        Assert.Equal(4.9990, m.Means[0], 4);
        Assert.Equal(19.6610e-3, m.Means[1], 7);
        Assert.Equal(1.04446, m.Means[2], 5);
        Assert.Equal(0.0032, m.StandardUncertainties[0], 4);
        Assert.Equal(0.0095e-3, m.StandardUncertainties[1], 7);
        Assert.Equal(0.00075, m.StandardUncertainties[2], 5);
        Assert.Equal(-0.355, m.Correlation[0, 1], 0.0005);
        Assert.Equal(0.858, m.Correlation[0, 2], 0.0005);
        Assert.Equal(-0.645, m.Correlation[1, 2], 0.0005);
        Assert.Equal(4.0, m.DegreesOfFreedom);
    }

    [Fact]
    public void GUM_H_2_resistance_reactance_impedance_with_output_correlations()
    {
        var m = H2Means();
        string[] names = ["V", "I", "phi"];
        var inputs = Enumerable.Range(0, 3)
            .Select(i => new UncertaintyInput(names[i], m.Means[i], m.StandardUncertainties[i], m.DegreesOfFreedom,
                DistributionKind.Normal, EvaluationType.TypeA, "five simultaneous sets, GUM H.2"))
            .ToArray();
        var result = GumPropagation.Propagate(
            x => [x[0] / x[1] * Math.Cos(x[2]), x[0] / x[1] * Math.Sin(x[2]), x[0] / x[1]],
            inputs, ["R", "X", "Z"], m.Correlation);

        // GUM H.2 tables (sheet 3.2(a)): 127.732 ± 0.071 Ω, 219.847 ± 0.295 Ω, 254.260 ± 0.236 Ω; tolerance 1 in the last printed digit.
        var (r, xr, z) = (result.Outputs[0], result.Outputs[1], result.Outputs[2]);
        Assert.Equal(127.732, r.Estimate, 0.001);
        Assert.Equal(219.847, xr.Estimate, 0.001);
        Assert.Equal(254.260, z.Estimate, 0.001);
        Assert.Equal(0.071, r.StandardUncertainty, 0.001);
        Assert.Equal(0.295, xr.StandardUncertainty, 0.001);
        Assert.Equal(0.236, z.StandardUncertainty, 0.001);
        // Output correlations r(R,X) = −0.588, r(R,Z) = −0.485, r(X,Z) = 0.993 (GUM H.2, sheet [CC] agrees).
        Assert.Equal(-0.588, result.CorrelationBetween(0, 1), 0.001);
        Assert.Equal(-0.485, result.CorrelationBetween(0, 2), 0.001);
        Assert.Equal(0.993, result.CorrelationBetween(1, 2), 0.001);
        Assert.Equal(result.CorrelationBetween(1, 0), result.CorrelationBetween(0, 1));
        // Correlated Type A inputs with ν = 4: the conservative rule caps ν_eff at 4 (GUM H.2 uses ν = 4).
        Assert.All(result.Outputs, o =>
        {
            Assert.Equal(DegreesOfFreedomRule.ConservativeCorrelated, o.DegreesOfFreedomRule);
            Assert.True(o.DegreesOfFreedom <= 4.0);
        });
    }

    private static UncertaintyInput[] H1Inputs() =>
    [
        // GUM H.1 end gauge, inputs per the reference sheet 3.2(c) (GTC GUM_H1), nm and °C.
        new("l_s", 50_000_623.0, 25.0, 18, DistributionKind.Normal, EvaluationType.TypeB, "calibration certificate"),
        new("d_bar", 215.0, 5.8, 24, DistributionKind.Normal, EvaluationType.TypeA, "repeated comparisons"),
        new("d1", 0.0, 3.9, 5, DistributionKind.Normal, EvaluationType.TypeA, "comparator random effects"),
        new("d2", 0.0, 6.7, 8, DistributionKind.Normal, EvaluationType.TypeB, "comparator systematic effects"),
        new("alpha_s", 11.5e-6, TypeB.FromRectangularHalfWidth(2e-6), double.PositiveInfinity, DistributionKind.Rectangular, EvaluationType.TypeB, "handbook"),
        new("delta_alpha", 0.0, TypeB.FromRectangularHalfWidth(1e-6), 50, DistributionKind.Rectangular, EvaluationType.TypeB, "estimate"),
        new("theta_bar", -0.1, 0.2, double.PositiveInfinity, DistributionKind.Normal, EvaluationType.TypeA, "temperature record"),
        new("Delta", 0.0, TypeB.FromArcSineHalfWidth(0.5), double.PositiveInfinity, DistributionKind.ArcSine, EvaluationType.TypeB, "cyclic variation"),
        new("delta_theta", 0.0, TypeB.FromRectangularHalfWidth(0.05), 2, DistributionKind.Rectangular, EvaluationType.TypeB, "thermometer"),
    ];

    private static double H1Model(double[] x)
    {
        var theta = x[6] + x[7];
        var d = x[1] + x[2] + x[3];
        return x[0] + d - x[0] * (x[5] * theta + x[4] * x[8]);
    }

    [Fact]
    public void GUM_H_1_end_gauge_budget_and_welch_satterthwaite()
    {
        var l = GumPropagation.Propagate(H1Model, H1Inputs(), "l", coverageProbability: 0.99);

        // GTC budget (sheet 3.2(c)): l_s 25, δθ 16.599, d2 6.7, d̄ 5.8, d1 3.9, δα 2.88679 nm; α_s, θ̄, Δ 0 at first order.
        double[] expected = [25.0, 5.8, 3.9, 6.7, 0.0, 2.88679, 0.0, 0.0, 16.599];
        for (var i = 0; i < expected.Length; i++)
        {
            Assert.Equal(expected[i], Math.Abs(l.Budget[i].Contribution), 0.001);
        }

        Assert.Equal(50_000_838.0, l.Estimate, 0.5);
        Assert.Equal(31.66, l.StandardUncertainty, 0.01); // [CC] 31.66 nm, GUM 32 nm
        Assert.Equal(DegreesOfFreedomRule.WelchSatterthwaite, l.DegreesOfFreedomRule);
        Assert.InRange(l.EffectiveDegreesOfFreedom, 16.6, 16.9); // [CC] 16.75
        Assert.Equal(16.0, l.DegreesOfFreedom); // truncated, GUM G.6.4
        Assert.Equal(2.921, l.CoverageFactor, 0.001); // t99(16)
        Assert.Equal(92.5, l.ExpandedUncertainty, 0.1); // sheet: U99 = 92.5 nm from unrounded u_c
        Assert.Equal(1.0, l.Budget.Sum(b => b.VarianceShare) + l.CorrelationVarianceShare, 12);
        Assert.Equal("calibration certificate", l.Budget[0].Source);
    }

    [Fact]
    public void Output_names_must_match_output_count()
    {
        Assert.Throws<ArgumentException>(() => GumPropagation.Propagate(x => [x[0], x[0]], TwoUnitInputs, ["only one"]));
    }

    [Fact]
    public void All_exact_inputs_give_infinite_dof_and_normal_k()
    {
        var y = GumPropagation.Propagate(x => x[0] * x[1], TwoUnitInputs, "y");
        Assert.Equal(DegreesOfFreedomRule.Infinite, y.DegreesOfFreedomRule);
        Assert.Equal(1.960, y.CoverageFactor, 0.0005);
        Assert.Equal(Math.Sqrt(5.0), y.StandardUncertainty, 1e-7);
    }
}
