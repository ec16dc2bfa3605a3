using BcPrep.Physics;
using BcPrep.Profiles;

namespace BcPrep.Tests.Profiles;

/// <summary>
/// Worked inlet-BC check case, domain reference sheet §8.5 [CC]: D = 0.05 m, ṁ = 0.02 kg/s, T = 300 K,
/// p = 101 325 Pa, R = 287.05, Sutherland μ, C_μ = 0.09. Compared to 4 significant digits (relative 5e-4).
/// </summary>
public class InletTurbulenceTests
{
    private static void Sig4(double expected, double actual) => Assert.InRange(actual / expected - 1.0, -5e-4, 5e-4);

    [Fact]
    public void Worked_heated_air_pipe_case()
    {
        const double d = 0.05, massFlow = 0.02;
        var rho = DryAir.Density(101325.0, 300.0);
        var mu = DryAir.Viscosity(300.0);
        var u = PipeFlow.BulkVelocity(massFlow, rho, d);
        var re = PipeFlow.Reynolds(rho, u, d, mu);
        var turbulence = InletTurbulence.ForFullyDevelopedPipe(u, d, mu / rho);
        var f = FrictionFactor.Colebrook(re);

        Sig4(1.17662, rho);
        Sig4(1.84600e-5, mu);
        Sig4(8.6569, u);
        Sig4(27589.0, re);
        Sig4(0.04457, turbulence.Intensity);
        Sig4(0.22329, turbulence.KineticEnergyM2PerS2);
        Sig4(0.0035, turbulence.LengthScaleM);
        Sig4(4.9536, turbulence.DissipationRateM2PerS3);
        Sig4(246.49, turbulence.SpecificDissipationRatePerS);
        Assert.InRange(turbulence.ViscosityRatio / 57.7 - 1.0, -1e-3, 1e-3); // printed to 3 digits
        Sig4(0.023952, f);
        Sig4(0.024550, FrictionFactor.Blasius(re));
        Sig4(0.024128, FrictionFactor.Petukhov(re));
        Sig4(0.26400, PipeFlow.WallShearStress(f, rho, u));
        var uTau = PipeFlow.FrictionVelocity(u, f);
        Sig4(0.47368, uTau);
        Sig4(754.8, uTau * (d / 2.0) / (mu / rho));
        Sig4(21.12, PipeFlow.PressureGradient(f, d, rho, u));
        Sig4(71.46, HeatTransfer.DittusBoelter(re, 0.707, true));
        Sig4(66.23, HeatTransfer.GnielinskiSmooth(re, 0.707));
    }

    [Fact]
    public void The_other_length_scale_convention_differs_by_cmu_to_the_quarter()
    {
        // [CC] §8.5: ε with ε = C_μ k^{3/2}/ℓ would be 2.7132 — ours is larger by C_μ^{-1/4}.
        var t = InletTurbulence.FromIntensityAndLengthScale(8.6569, 0.04457, 0.0035, 1.5689e-5);
        Sig4(2.7132, t.DissipationRateM2PerS3 * Math.Pow(0.09, 0.25));
        Assert.Equal(t.DissipationRateM2PerS3 / (0.09 * t.KineticEnergyM2PerS2), t.SpecificDissipationRatePerS, 9);
        Assert.Contains("Cmu^(3/4)", t.Convention, StringComparison.Ordinal);
    }

    [Fact]
    public void Intensity_correlation_refuses_laminar_flow()
    {
        Assert.Throws<BcPrepDataException>(() => InletTurbulence.PipeIntensity(1000.0));
    }
}
