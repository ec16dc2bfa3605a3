using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class OutputCovarianceTests
{
    /// <summary>GUM H.2 raw data (JCGM 100 Table H.2, five simultaneous sets of V, I, φ), SI units.</summary>
    private static GumResult H2Result()
    {
        var m = SimultaneousMeans.FromSets(
        [
            [5.007, 19.663e-3, 1.0456],
            [4.994, 19.639e-3, 1.0438],
            [5.005, 19.640e-3, 1.0468],
            [4.990, 19.685e-3, 1.0428],
            [4.999, 19.678e-3, 1.0433],
        ]);
        string[] names = ["V", "I", "phi"];
        var inputs = Enumerable.Range(0, 3)
            .Select(i => new UncertaintyInput(names[i], m.Means[i], m.StandardUncertainties[i], m.DegreesOfFreedom, DistributionKind.Normal, EvaluationType.TypeA, "GUM H.2"))
            .ToArray();
        return GumPropagation.Propagate(x => [x[0] / x[1] * Math.Cos(x[2]), x[0] / x[1] * Math.Sin(x[2]), x[0] / x[1]], inputs, ["R", "X", "Z"], m.Correlation);
    }

    [Fact]
    public void GUM_H_2_check_case_output_correlations_reproduced_through_the_covariance_selection()
    {
        var c = OutputCovariance.Select(H2Result(), _ => true);

        // JCGM 100 H.2.4 (Table H.3): r(R,X) = −0.588, r(R,Z) = −0.485, r(X,Z) = 0.993; u(R) = 0.071 Ω, u(X) = 0.295 Ω, u(Z) = 0.236 Ω.
        Assert.Equal(["R", "X", "Z"], c.Names);
        Assert.Equal(-0.588, c.Correlation(0, 1), 0.001);
        Assert.Equal(-0.485, c.Correlation(0, 2), 0.001);
        Assert.Equal(0.993, c.Correlation(1, 2), 0.001);
        Assert.Equal(0.071, c.StandardUncertainty(0), 0.001);
        Assert.Equal(0.295, c.StandardUncertainty(1), 0.001);
        Assert.Equal(0.236, c.StandardUncertainty(2), 0.001);
        Assert.Equal(c.Covariance[0, 1], c.Covariance[1, 0]);
        Assert.Equal(1.0, c.Correlation(2, 2));
    }

    [Fact]
    public void Selecting_a_subset_keeps_the_entries_of_the_full_matrix_in_output_order()
    {
        var full = H2Result();
        var c = OutputCovariance.Select(full, name => name != "X");

        Assert.Equal(["R", "Z"], c.Names);
        Assert.Equal(full.OutputCovariance[0, 2], c.Covariance[0, 1]);
        Assert.Equal(full.OutputCovariance[2, 2], c.Covariance[1, 1]);
        Assert.Equal(-0.485, c.Correlation(0, 1), 0.001); // GUM H.2 r(R,Z)
        Assert.Equal(-1, c.IndexOf("X"));
    }

    [Fact]
    public void Correlation_with_a_zero_uncertainty_is_undefined_not_zero()
    {
        var inputs = new[] { new UncertaintyInput("a", 1.0, 0.1), new UncertaintyInput("b", 2.0, 0.0) };
        var c = OutputCovariance.Select(GumPropagation.Propagate(x => [x[0], x[1]], inputs, ["ya", "yb"]), _ => true);

        Assert.True(double.IsNaN(c.Correlation(0, 1)));
        Assert.True(double.IsNaN(c.Correlation(1, 1)));
        Assert.Equal(0.01, c.Covariance[0, 0], 1e-12);
    }
}
