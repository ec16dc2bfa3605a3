using BcPrep.Calibration;
using BcPrep.Pipeline;
using BcPrep.Uncertainty;
using BcPrep.Writing;
using MathNet.Numerics.LinearAlgebra;

namespace BcPrep.Tests.Pipeline;

/// <summary>Uncertainty claims checked end to end on the bundled sample day (sample-logs/).</summary>
public class PointUncertaintyTests
{
    [Fact]
    public void Inlet_temperature_budget_is_dominated_by_the_thermocouple_class_and_carries_the_cold_junction_scaled_by_the_Seebeck_ratio()
    {
        foreach (var point in SampleDayResult.Gum.Points)
        {
            var t = point.Output("inlet.temperature")!;
            var tolerance = t.Budget.Single(b => b.InputName == "t_in: IEC 60584-1 class 1");
            var coldJunction = t.Budget.Single(b => b.InputName == "t_cj: IEC 60751 class A");

            // IEC 60584-1 class 1, type K below 375 °C: ±1.5 K, rectangular → u = 1.5/√3 K.
            Assert.Equal(1.5 / Math.Sqrt(3), tolerance.StandardUncertainty, 1e-12);
            Assert.True(tolerance.VarianceShare > 0.9, $"{point.Id}: class term share {tolerance.VarianceShare}");
            Assert.Equal(tolerance.VarianceShare, t.Budget.Max(b => b.VarianceShare));

            // IEC 60751 class A: ±(0.15 + 0.002|t|) °C, rectangular, at the cold-junction window mean.
            var tcjK = point.Channels["t_cj"].Mean;
            Assert.Equal((0.15 + 0.002 * Math.Abs(tcjK - 273.15)) / Math.Sqrt(3), coldJunction.StandardUncertainty, 1e-9);

            // Emf addition: ∂T_hot/∂T_cj = S(T_cj)/S(T_hot), S from a central difference of the NIST ITS-90 type K emf
            // (Monograph 175), independent of the analytic Seebeck function the model uses.
            var hotK = point.Channels["t_in"].Mean;
            var ratio = Seebeck(tcjK) / Seebeck(hotK);
            Assert.Equal(ratio, coldJunction.SensitivityCoefficient, 1e-5);
            Assert.True(coldJunction.VarianceShare is > 0.005 and < 0.05, $"{point.Id}: cold-junction share {coldJunction.VarianceShare}");
        }
    }

    [Fact]
    public void Every_profile_point_has_a_finite_positive_standard_uncertainty()
    {
        foreach (var point in SampleDayResult.Gum.Points)
        {
            var profile = point.Model.Outputs.Select((o, i) => (o, i)).Where(p => p.o.Name.StartsWith(ProfileOutputs.VelocityPrefix, StringComparison.Ordinal)).ToList();
            Assert.Equal(point.Model.ProfileRadiiM.Length, profile.Count);
            Assert.True(profile.Count >= 10);
            foreach (var (_, i) in profile.Take(profile.Count - 1))
            {
                var u = point.Gum.Outputs[i];
                Assert.True(double.IsFinite(u.StandardUncertainty) && u.StandardUncertainty > 0, $"{point.Id} {u.Name}: u = {u.StandardUncertainty}");
                // The profile is ṁ-scaled, so its relative u is of the order of the mass flow's (≈ 0.6 %), never orders off.
                Assert.InRange(u.StandardUncertainty / u.Estimate, 1e-3, 0.05);
            }
        }
    }

    [Fact]
    public void Scalar_covariance_of_every_sample_point_is_symmetric_and_positive_semidefinite()
    {
        foreach (var point in SampleDayResult.Gum.Points)
        {
            var c = CovarianceTables.Of(point);
            Assert.True(c.Size >= 20);
            Assert.DoesNotContain(c.Names, ProfileOutputs.IsProfilePoint);
            for (var i = 0; i < c.Size; i++)
            {
                Assert.Equal(point.Output(c.Names[i])!.StandardUncertainty, c.StandardUncertainty(i), 1e-12 * Math.Max(1, c.StandardUncertainty(i)));
                for (var j = 0; j < c.Size; j++)
                {
                    Assert.Equal(c.Covariance[i, j], c.Covariance[j, i]);
                }
            }

            // PSD test on the correlation matrix: scale-free, whereas covariance entries span 20 orders of magnitude.
            var withUncertainty = Enumerable.Range(0, c.Size).Where(i => c.StandardUncertainty(i) > 0).ToArray();
            var r = Matrix<double>.Build.Dense(withUncertainty.Length, withUncertainty.Length, (a, b) => c.Correlation(withUncertainty[a], withUncertainty[b]));
            var eigenvalues = r.Evd(Symmetricity.Symmetric).EigenValues.Select(e => e.Real).ToArray();
            Assert.True(eigenvalues.Min() >= -1e-9, $"{point.Id}: smallest eigenvalue {eigenvalues.Min()}");
            Assert.Equal(withUncertainty.Length, eigenvalues.Sum(), 1e-6); // trace of a correlation matrix
        }
    }

    [Fact]
    public void Inlet_and_outlet_absolute_pressures_are_strongly_correlated_through_the_shared_barometer()
    {
        foreach (var point in SampleDayResult.Gum.Points)
        {
            var c = CovarianceTables.Of(point);
            var pin = c.IndexOf("inlet.static_pressure");
            var pout = c.IndexOf("outlet.static_pressure");
            Assert.True(c.Correlation(pin, pout) > 0.7, $"{point.Id}: r = {c.Correlation(pin, pout)}");

            // The covariance is exactly the barometer's variance (sensitivity 1 in both), and nothing else is shared.
            var baro = point.Output("inlet.static_pressure")!.Budget.Where(b => b.InputName.StartsWith("p_baro", StringComparison.Ordinal)).Sum(b => b.StandardUncertainty * b.StandardUncertainty);
            Assert.Equal(baro, c.Covariance[pin, pout], baro * 1e-6);

            // The measured pressure drop does not see the barometer at all.
            var drop = point.Output("pressure_drop.measured")!;
            Assert.All(drop.Budget.Where(b => b.InputName.StartsWith("p_baro", StringComparison.Ordinal)), b => Assert.True(Math.Abs(b.VarianceShare) < 1e-9));
        }
    }

    [Fact]
    public void Temperature_difference_cancels_most_of_the_shared_cold_junction_error()
    {
        foreach (var point in SampleDayResult.Gum.Points)
        {
            var c = CovarianceTables.Of(point);
            var tin = c.IndexOf("inlet.temperature");
            var tout = c.IndexOf("outlet.temperature");
            var inBudget = point.Output("inlet.temperature")!.Budget;
            var outBudget = point.Output("outlet.temperature")!.Budget;

            // Independent inputs: u²(T_out − T_in) = Σ (c_out,j − c_in,j)² u_j², which the covariance must reproduce.
            var expected = inBudget.Zip(outBudget).Sum(p => Math.Pow((p.Second.SensitivityCoefficient - p.First.SensitivityCoefficient) * p.First.StandardUncertainty, 2));
            var fromCovariance = c.Covariance[tin, tin] + c.Covariance[tout, tout] - (2 * c.Covariance[tin, tout]);
            Assert.Equal(expected, fromCovariance, expected * 1e-6);

            // The cold junction's part: alone in each temperature u_cj·S(T_cj)/S(T_hot) ≈ 0.11 K, in the difference only the
            // difference of the two Seebeck ratios remains (≈ 2 % of it on this day).
            var j = inBudget.Select((b, i) => (b, i)).Single(p => p.b.InputName == "t_cj: IEC 60751 class A").i;
            var alone = Math.Abs(inBudget[j].Contribution);
            var inDifference = Math.Abs((outBudget[j].SensitivityCoefficient - inBudget[j].SensitivityCoefficient) * inBudget[j].StandardUncertainty);
            Assert.True(inDifference < 0.1 * alone, $"{point.Id}: {inDifference} K of {alone} K left");
            Assert.True(c.Covariance[tin, tout] > 0);
        }
    }

    [Fact]
    public void Monte_Carlo_on_the_sample_day_validates_GUM_where_the_model_is_near_normal_and_flags_a_rectangular_dominated_temperature()
    {
        // Two adaptive blocks of 10⁴ trials per point (JCGM 101 7.9.4) keep the run short; tolerance at one significant digit.
        var day = SampleDayResult.Process(new ProcessOptions(MonteCarlo: true, Seed: 3, MonteCarloMaxTrials: 20_000));
        foreach (var point in day.Points)
        {
            Assert.NotNull(point.MonteCarlo);
            bool Validated(string name) => point.Validation![point.OutputIndex(name)].IsValidated;
            string Why(string name) => $"{point.Id} {name}: {point.Validation![point.OutputIndex(name)]}, GUM U {point.Output(name)!.ExpandedUncertainty}";

            // Normal-dominated (barometer certificate) and the sum of two equal rectangles (heater V and I): GUM holds.
            Assert.True(Validated("inlet.static_pressure"), Why("inlet.static_pressure"));
            Assert.True(Validated("outlet.static_pressure"), Why("outlet.static_pressure"));
            Assert.True(Validated("heater_power"), Why("heater_power"));

            // 98 % of u(T_in) is one rectangular class term: the 95 % interval is ≈ ±1.65u, not the ±1.96u of GUM, so
            // JCGM 101 8.2 says the GUM interval is not validated. This is the comparison doing its job.
            Assert.False(Validated("inlet.temperature"), Why("inlet.temperature"));
            var i = point.OutputIndex("inlet.temperature");
            var mc = point.MonteCarlo!.Outputs[i];
            Assert.Equal(point.Gum.Outputs[i].StandardUncertainty, mc.StandardUncertainty, 0.02 * mc.StandardUncertainty);
            Assert.True(mc.High - mc.Estimate < point.Gum.Outputs[i].ExpandedUncertainty);
        }
    }

    private static double Seebeck(double temperatureK) =>
        (Its90Thermocouple.EmfV(ThermocoupleType.K, temperatureK + 0.01) - Its90Thermocouple.EmfV(ThermocoupleType.K, temperatureK - 0.01)) / 0.02;
}
