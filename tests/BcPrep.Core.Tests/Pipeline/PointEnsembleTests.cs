using BcPrep.Pipeline;
using BcPrep.Uncertainty;
using MathNet.Numerics.Distributions;

namespace BcPrep.Tests.Pipeline;

/// <summary>Ensembles of boundary-condition sets drawn for the sample day's points.</summary>
public class PointEnsembleTests
{
    [Fact]
    public void Same_seed_gives_identical_members_and_the_first_members_do_not_change_when_more_are_drawn()
    {
        var model = SampleDayResult.Point("OP1").Model;
        var a = PointEnsemble.Draw(model, 5, 42, EnsembleSampling.Random).ToList();
        var b = PointEnsemble.Draw(model, 8, 42, EnsembleSampling.Random).ToList();
        var c = PointEnsemble.Draw(model, 5, 43, EnsembleSampling.Random).ToList();

        for (var i = 0; i < 5; i++)
        {
            Assert.Equal(a[i].Inputs, b[i].Inputs);
            Assert.Equal(a[i].Outputs, b[i].Outputs);
            Assert.Equal(a[i].DrawSeed, b[i].DrawSeed);
            Assert.NotEqual(a[i].Inputs, c[i].Inputs);
        }

        Assert.Equal(IndependentDraws.Draw(model.Inputs, a[2].DrawSeed!.Value), a[2].Inputs);
        Assert.Equal([1, 2, 3, 4, 5], a.Select(m => m.Number));
    }

    [Fact]
    public void Every_member_profile_integrates_to_its_own_mass_flow()
    {
        var point = SampleDayResult.Point("OP2");
        var massFlow = point.OutputIndex("mass_flow");
        var density = point.OutputIndex("inlet.density");
        var flows = new List<double>();
        foreach (var member in PointEnsemble.Draw(point.Model, 200, 5, EnsembleSampling.Random))
        {
            var profile = member.Quantities.Velocity.Profile;
            var integral = member.Outputs[density] * Trapezoid(profile.RadiusM.ToArray(), profile.Values.ToArray());
            Assert.Equal(member.Outputs[massFlow], integral, member.Outputs[massFlow] * 1e-3);
            flows.Add(member.Outputs[massFlow]);
        }

        // The members really differ: their mass flows spread by about u(ṁ).
        var u = point.Output("mass_flow")!.StandardUncertainty;
        Assert.InRange(StandardDeviation(flows), 0.7 * u, 1.3 * u);
    }

    [Theory]
    [InlineData(EnsembleSampling.Random)]
    [InlineData(EnsembleSampling.LatinHypercube)]
    public void Member_mean_and_covariance_approach_the_GUM_values_for_near_linear_quantities(EnsembleSampling sampling)
    {
        const int count = 4000;
        var point = SampleDayResult.Point("OP2");
        string[] names = ["inlet.static_pressure", "outlet.static_pressure", "mass_flow", "inlet.temperature", "inlet.density", "inlet.bulk_velocity"];
        var index = names.Select(point.OutputIndex).ToArray();
        var values = names.Select(_ => new double[count]).ToArray();
        foreach (var member in PointEnsemble.Draw(point.Model, count, 11, sampling))
        {
            for (var q = 0; q < names.Length; q++)
            {
                values[q][member.Number - 1] = member.Outputs[index[q]];
            }
        }

        for (var q = 0; q < names.Length; q++)
        {
            var gum = point.Gum.Outputs[index[q]];
            var mean = values[q].Average();
            var sd = StandardDeviation(values[q]);
            // Statistical tolerances: the mean within 4 u/√N, the standard deviation within 6 % (1/√(2N) ≈ 1.1 % is its
            // own scatter for a normal output; the margin covers the slight non-linearity of ρ and U_b).
            Assert.Equal(gum.Estimate, mean, 4 * gum.StandardUncertainty / Math.Sqrt(count));
            Assert.Equal(gum.StandardUncertainty, sd, 0.06 * gum.StandardUncertainty);
        }

        // Correlations: r(p_in, p_out) through the barometer and r(T_in, ρ_in) through the ideal-gas law, within 0.05
        // (their sampling scatter is (1 − r²)/√N ≤ 0.016).
        Assert.Equal(point.Gum.CorrelationBetween(index[0], index[1]), Correlation(values[0], values[1]), 0.05);
        Assert.Equal(point.Gum.CorrelationBetween(index[3], index[4]), Correlation(values[3], values[4]), 0.05);
    }

    [Fact]
    public void Latin_hypercube_members_hit_every_stratum_of_a_normal_input_exactly_once()
    {
        const int count = 250;
        var model = SampleDayResult.Point("OP1").Model;
        var members = PointEnsemble.Draw(model, count, 9, EnsembleSampling.LatinHypercube).ToList();
        Assert.All(members, m => Assert.Null(m.DrawSeed));
        foreach (var j in Enumerable.Range(0, model.Inputs.Count).Where(j => model.Inputs[j].Distribution == DistributionKind.Normal && model.Inputs[j].StandardUncertainty > 0).Take(5))
        {
            var input = model.Inputs[j];
            var strata = members.Select(m => (int)Math.Floor(Normal.CDF(input.Estimate, input.StandardUncertainty, m.Inputs[j]) * count)).Order().ToArray();
            Assert.Equal(Enumerable.Range(0, count), strata);
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(PointEnsemble.MaxMembers + 1)]
    public void Ensemble_size_outside_the_bound_is_a_configuration_failure(int count)
    {
        var model = SampleDayResult.Point("OP1").Model;
        var failure = Assert.Throws<BcPrepFailure>(() => PointEnsemble.Draw(model, count, 1, EnsembleSampling.Random));
        Assert.Equal(FailureKind.Configuration, failure.Kind);
        Assert.Contains("100000", failure.Message, StringComparison.Ordinal);
    }

    /// <summary>∫ u 2πr dr by the trapezoid rule on the profile's own points.</summary>
    internal static double Trapezoid(double[] radiusM, double[] velocity)
    {
        var sum = 0.0;
        for (var i = 1; i < radiusM.Length; i++)
        {
            sum += 0.5 * ((velocity[i] * radiusM[i]) + (velocity[i - 1] * radiusM[i - 1])) * (radiusM[i] - radiusM[i - 1]);
        }

        return 2 * Math.PI * Math.Abs(sum);
    }

    private static double StandardDeviation(IReadOnlyList<double> v)
    {
        var mean = v.Average();
        return Math.Sqrt(v.Sum(x => (x - mean) * (x - mean)) / (v.Count - 1));
    }

    private static double Correlation(double[] a, double[] b)
    {
        var ma = a.Average();
        var mb = b.Average();
        var cov = a.Zip(b).Sum(p => (p.First - ma) * (p.Second - mb));
        return cov / Math.Sqrt(a.Sum(x => (x - ma) * (x - ma)) * b.Sum(x => (x - mb) * (x - mb)));
    }
}
