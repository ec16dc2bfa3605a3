using BcPrep.Physics;
using BcPrep.Tests.Pipeline;

namespace BcPrep.Tests.Physics;

/// <summary>Model-form terms: the property models and the turbulence correlation carry their own uncertainty.</summary>
public class ModelFormTests
{
    [Theory]
    [InlineData(250.0, 1.6037e-5)] // Lemmon & Jacobsen (2004) via the reference sheet §11 [CC]
    [InlineData(300.0, 1.8538e-5)]
    [InlineData(400.0, 2.3056e-5)]
    [InlineData(500.0, 2.7090e-5)]
    public void Sutherland_bound_covers_the_reference_viscosity_at_every_temperature(double temperatureK, double referencePaS)
    {
        var deviation = Math.Abs((DryAir.Viscosity(temperatureK) / referencePaS) - 1.0);
        Assert.True(deviation <= ModelForm.ViscosityHalfWidth(temperatureK), $"{temperatureK} K: deviation {deviation:P2} > bound {ModelForm.ViscosityHalfWidth(temperatureK):P2}");
    }

    [Fact]
    public void The_old_constant_bound_would_not_cover_400_K()
    {
        // Reference sheet §11: Sutherland −0.9 % at 400 K, beyond the ±0.7 % that holds below ~380 K.
        Assert.True(Math.Abs((DryAir.Viscosity(400.0) / 2.3056e-5) - 1.0) > 0.007);
        Assert.Equal(0.007, ModelForm.ViscosityHalfWidth(300.0));
    }

    [Theory]
    [InlineData(273.15, 1006.0, 1.0)] // Çengel Table A-15 [CS]: 1006 J/(kg K) at 0 °C
    [InlineData(298.15, 1007.0, 1.0)] // 1007 at 25 °C [CS]
    [InlineData(373.15, 1009.0, 3.0)] // 1009 at 100 °C [CS]; Incropera A.4 (from memory) 1014 at 400 K, so ±3
    public void Corrected_cp_matches_the_one_atmosphere_tables(double temperatureK, double tableCp, double toleranceCp)
    {
        Assert.Equal(tableCp, 1004.7 * ModelForm.CpCorrection(temperatureK), toleranceCp);
    }

    [Fact]
    public void Turbulent_kinetic_energy_budget_carries_the_correlation_model_form()
    {
        // k = 1.5 (U I)², I = 0.16 Re^(−1/8) × f with f rectangular ±50 % (reference sheet §11, from memory: estimates
        // differ by about a factor of 2): u(k)/k ≈ 2 · 0.5/√3 = 0.577 from that term alone (GUM 4.3.7, first order).
        using var day = BoundaryPhysicsTests.Duct().Channel("m_dot", SyntheticDay.Direct("mass_flow", "kg/s"), 0.05, 0.00001);
        var k = day.Process().Points.Single().Output("inlet.turbulent_kinetic_energy")!;
        var term = k.Budget.Single(b => b.InputName == "turbulence intensity model (0.16 Re^-1/8)");
        Assert.Equal(2.0 * 0.5 / Math.Sqrt(3.0), Math.Abs(term.Contribution) / k.Estimate, 0.01);
        Assert.True(term.VarianceShare > 0.99, $"share {term.VarianceShare}");
    }

    [Fact]
    public void Pressure_drop_check_allows_the_quoted_15_percent_of_the_Moody_chart()
    {
        // White, Fluid Mechanics (from memory, reference sheet §11): ±15 % on the friction prediction; the check's
        // limit is the root sum of squares of that and the two expanded uncertainties, so it is at least 15 %.
        using var day = BoundaryPhysicsTests.Duct().Channel("m_dot", SyntheticDay.Direct("mass_flow", "kg/s"), 0.05, 0.00001);
        var point = day.Process().Points.Single();
        var check = point.Checks.Single(c => c.Name == "pressure drop");
        var expected = point.Output("pressure_drop.expected")!.Estimate;
        Assert.True(check.Limit >= 0.15 * Math.Abs(expected), $"limit {check.Limit} Pa against 15 % of {expected} Pa");
        Assert.Contains("15 %", check.Basis, StringComparison.Ordinal);
    }
}
