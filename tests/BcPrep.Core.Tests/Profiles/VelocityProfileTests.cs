using BcPrep.Physics;
using BcPrep.Profiles;
using CsCheck;

namespace BcPrep.Tests.Profiles;

public class VelocityProfileTests
{
    private const double Mu = 1.846e-5, Rho = 1.1766;

    private static double MassFlowFor(double reynolds, double diameter) => reynolds * Math.PI * diameter * Mu / 4.0;

    private static double TrapezoidMassFlow(RadialProfile p, double rho)
    {
        var sum = 0.0;
        for (var i = 1; i < p.RadiusM.Length; i++)
        {
            sum += 0.5 * ((p.Values[i] * p.RadiusM[i]) + (p.Values[i - 1] * p.RadiusM[i - 1])) * (p.RadiusM[i] - p.RadiusM[i - 1]);
        }

        return 2.0 * Math.PI * rho * sum;
    }

    // [CC] domain reference sheet §8.1: U_b/u_max = 2n²/((n+1)(2n+1)), printed to 5 decimals.
    [Theory]
    [InlineData(6.0, 0.79121)]
    [InlineData(7.0, 0.81667)]
    [InlineData(8.0, 0.83660)]
    [InlineData(9.0, 0.85263)]
    [InlineData(10.0, 0.86580)]
    public void Power_law_bulk_to_centreline_ratio(double n, double expected)
    {
        Assert.Equal(expected, VelocityProfiles.PowerLawBulkToCentrelineRatio(n), 6e-6);
        var result = VelocityProfiles.Build(new VelocityProfileRequest(MassFlowFor(1e5, 0.05), Rho, Mu, 0.05, VelocityProfileModel.PowerLaw, 2001, PowerLawExponent: n));
        Assert.InRange(result.BulkVelocityMPerS / result.Profile.Values[0] / expected - 1.0, -2e-4, 2e-4);
    }

    [Fact]
    public void Laminar_centreline_is_twice_the_bulk_velocity()
    {
        // Hagen–Poiseuille u_max = 2 U_b (textbook).
        var result = VelocityProfiles.Build(new VelocityProfileRequest(MassFlowFor(1500.0, 0.05), Rho, Mu, 0.05));
        Assert.Equal(VelocityProfileModel.Laminar, result.ModelUsed);
        Assert.InRange(result.Profile.Values[0] / (2.0 * result.BulkVelocityMPerS) - 1.0, -1e-4, 1e-4);
        Assert.Equal(0.0, result.Profile.Values[^1], 12);
        Assert.Equal(64.0 / 1500.0, result.DarcyFrictionFactor, 9);
    }

    [Fact]
    public void Auto_uses_the_power_law_with_n_from_Colebrook_for_the_worked_case()
    {
        // [CC] §8.5: Re 27 589 → f = 0.023952 (Colebrook smooth), n = 1/√f = 6.46.
        var result = VelocityProfiles.Build(new VelocityProfileRequest(0.02, 1.17662, 1.846e-5, 0.05));
        Assert.Equal(VelocityProfileModel.PowerLaw, result.ModelUsed);
        Assert.Equal(0.023952, result.DarcyFrictionFactor, 6e-6);
        Assert.Equal(6.46, result.PowerLawExponent, 5e-3);
        Assert.Empty(result.Diagnostics);
    }

    [Fact]
    public void Transitional_Reynolds_number_is_flagged()
    {
        var result = VelocityProfiles.Build(new VelocityProfileRequest(MassFlowFor(3000.0, 0.05), Rho, Mu, 0.05));
        Assert.Single(result.Diagnostics);
    }

    [Fact]
    public void Spalding_profile_follows_the_wall_law_near_the_wall()
    {
        var result = VelocityProfiles.Build(new VelocityProfileRequest(MassFlowFor(5e4, 0.05), Rho, Mu, 0.05, VelocityProfileModel.Spalding, 401));
        var nu = Mu / Rho;
        var r = result.Profile.RadiusM;
        var yPlus = (r[^1] - r[^10]) * result.FrictionVelocityMPerS / nu;
        var expected = result.ScaleFactor * result.FrictionVelocityMPerS * WallLaw.Spalding(yPlus);
        Assert.Equal(expected, result.Profile.Values[^10], 1e-12);
        // The wall law has no wake, so the model's own mass flow misses ṁ by a few percent: reported, then rescaled.
        Assert.InRange(Math.Abs(result.ModelMassFlowRelativeError), 1e-4, 0.1);
        Assert.Equal(1.0 / (1.0 + result.ModelMassFlowRelativeError) / (1.0 + result.RawDiscretisationRelativeError), result.ScaleFactor, 12);
    }

    [Fact]
    public void Every_model_reproduces_the_mass_flow_and_its_raw_grid_error_stays_below_0p1_percent()
    {
        var models = new[] { VelocityProfileModel.Uniform, VelocityProfileModel.Laminar, VelocityProfileModel.PowerLaw, VelocityProfileModel.Spalding, VelocityProfileModel.Reichardt, VelocityProfileModel.Auto };
        Gen.Select(Gen.Double[Math.Log10(4000.0), 6.0], Gen.Double[0.02, 0.3], Gen.Int[0, models.Length - 1], Gen.Double[0.8, 3.0])
            .Sample((logRe, diameter, modelIndex, rho) =>
            {
                var model = models[modelIndex];
                var re = model == VelocityProfileModel.Laminar ? Math.Pow(10.0, logRe) / 1000.0 * 2.0 : Math.Pow(10.0, logRe);
                var massFlow = re * Math.PI * diameter * Mu / 4.0;
                var result = VelocityProfiles.Build(new VelocityProfileRequest(massFlow, rho, Mu, diameter, model));
                Assert.InRange(TrapezoidMassFlow(result.Profile, rho) / massFlow - 1.0, -1e-12, 1e-12);
                Assert.InRange(result.RawDiscretisationRelativeError, -1e-3, 1e-3);
                Assert.Equal(result.Profile.RadiusM.Length, result.Profile.Values.Length);
            }, iter: 200, threads: 1, seed: "0N0XIzNsQ0O2");
    }

    [Fact]
    public void Profile_is_a_pure_function_of_its_request()
    {
        var request = new VelocityProfileRequest(0.02, 1.17662, 1.846e-5, 0.05, VelocityProfileModel.Reichardt);
        var a = VelocityProfiles.Build(request);
        var b = VelocityProfiles.Build(request with { });
        Assert.Equal(a.Profile.Values.ToArray(), b.Profile.Values.ToArray());
        var perturbed = VelocityProfiles.Build(request with { MassFlowKgPerS = 0.0202 });
        Assert.Equal(1.01, perturbed.BulkVelocityMPerS / a.BulkVelocityMPerS, 12);
    }

    [Fact]
    public void Invalid_requests_throw()
    {
        Assert.Throws<BcPrepDataException>(() => VelocityProfiles.Build(new VelocityProfileRequest(0.0, Rho, Mu, 0.05)));
        Assert.Throws<BcPrepDataException>(() => VelocityProfiles.Build(new VelocityProfileRequest(0.02, Rho, Mu, 0.05, VelocityProfileModel.Spalding, 10)));
        Assert.Throws<BcPrepDataException>(() => VelocityProfiles.Build(new VelocityProfileRequest(MassFlowFor(1000.0, 0.05), Rho, Mu, 0.05, VelocityProfileModel.Spalding)));
        Assert.Throws<BcPrepDataException>(() => VelocityProfiles.Build(new VelocityProfileRequest(0.02, Rho, Mu, 0.05, PointCount: 200_000)));
    }

    [Fact]
    public void Given_power_law_exponent_works_in_laminar_flow_and_reports_no_friction_factor()
    {
        var result = VelocityProfiles.Build(new VelocityProfileRequest(MassFlowFor(1000.0, 0.05), Rho, Mu, 0.05, VelocityProfileModel.PowerLaw, PowerLawExponent: 7.0));
        Assert.True(double.IsNaN(result.DarcyFrictionFactor));
        Assert.Equal(7.0, result.PowerLawExponent);
    }

    [Fact]
    public void Uniform_profile_equals_bulk_velocity()
    {
        var result = VelocityProfiles.Build(new VelocityProfileRequest(0.02, 1.17662, 1.846e-5, 0.05, VelocityProfileModel.Uniform));
        Assert.All(result.Profile.Values, u => Assert.Equal(PipeFlow.BulkVelocity(0.02, 1.17662, 0.05), u, 9));
    }
}
