using System.Collections.Immutable;
using BcPrep.Profiles;
using MathNet.Numerics.Integration;

namespace BcPrep.Tests.Profiles;

/// <summary>
/// The mixing-cup temperature T_b = ∫ρ u cp T dA / ∫ρ u cp dA (definition of the mean or bulk temperature of internal
/// flow: Incropera &amp; DeWitt, Fundamentals of Heat and Mass Transfer, §8.2, eqs. 8.25–8.27; equation numbers from
/// memory) against cases whose integral is known.
/// </summary>
public class MixingCupTests
{
    private const double RadiusM = 0.05;

    private static ImmutableArray<double> Constant(ImmutableArray<double> grid, double value) => [.. grid.Select(_ => value)];

    [Fact]
    public void Uniform_temperature_is_its_own_mixing_cup_whatever_the_flow()
    {
        // Definition: a constant T leaves the integral as T·∫ρ u cp dA / ∫ρ u cp dA = T, exactly.
        var grid = RadialGrid.WallClustered(RadiusM, 201);
        ImmutableArray<double> massFlux = [.. grid.Select(r => 3.0 * Math.Pow(1 - (r / RadiusM), 1.0 / 7.0))];
        ImmutableArray<double> cp = [.. grid.Select(r => 1005.0 + (10.0 * r / RadiusM))];
        Assert.Equal(312.5, MixingCup.Temperature(grid, massFlux, Constant(grid, 312.5), cp), 1e-12);
    }

    [Theory]
    [InlineData(20001, 0, 1e-6)]  // uniform fine grid: trapezoid error O(h²) ~ 1e-8 of ΔT
    [InlineData(201, 2, 1e-3)]    // BcPrep's default grid (201 points, tanh stretching 2)
    public void Laminar_profile_with_a_linear_temperature_gives_eight_fifteenths_of_the_rise(int points, double stretching, double toleranceK)
    {
        // By hand, s = r/R, u = 2U(1 − s²), T = T0 + ΔT s, cp constant:
        // ∫(1 − s²) s ds = 1/4, ∫(1 − s²) s² ds = 1/3 − 1/5 = 2/15, so T_b = T0 + ΔT (2/15)/(1/4) = T0 + (8/15) ΔT,
        // while the area mean is T0 + ΔT (1/3)/(1/2) = T0 + (2/3) ΔT (definition of T_b: Incropera & DeWitt §8.2).
        const double t0 = 300.0, rise = 30.0, bulkVelocity = 4.0;
        var grid = RadialGrid.WallClustered(RadiusM, points, stretching);
        ImmutableArray<double> massFlux = [.. grid.Select(r => 1.2 * 2 * bulkVelocity * (1 - (r * r / (RadiusM * RadiusM))))];
        ImmutableArray<double> temperature = [.. grid.Select(r => t0 + (rise * r / RadiusM))];
        Assert.Equal(t0 + (8.0 / 15.0 * rise), MixingCup.Temperature(grid, massFlux, temperature, Constant(grid, 1006.0)), toleranceK);
        Assert.Equal(t0 + (2.0 / 3.0 * rise), MixingCup.AreaMean(grid, temperature), toleranceK * 10);
    }

    [Fact]
    public void Power_law_profile_matches_a_fine_quadrature()
    {
        // u ∝ (1 − s)^(1/7), T = T0 + ΔT s², cp(T) = 1000 + 0.1 T (a made-up cp, so that its weighting is checked too).
        // Reference: Gauss–Legendre on the substitution 1 − s = t⁷, which makes the integrand a smooth polynomial in t
        // (common practice for the wall singularity of the power law).
        const double n = 7.0, t0 = 290.0, rise = 40.0;
        static double Temperature(double s) => t0 + (rise * s * s);
        static double Cp(double t) => 1000.0 + (0.1 * t);
        double Integral(Func<double, double> weight) => GaussLegendreRule.Integrate(t =>
        {
            var s = 1 - Math.Pow(t, n);
            return t * weight(Temperature(s)) * s * n * Math.Pow(t, n - 1);
        }, 0.0, 1.0, 128);
        var reference = Integral(t => Cp(t) * t) / Integral(Cp);

        var grid = RadialGrid.WallClustered(RadiusM, 201);
        ImmutableArray<double> massFlux = [.. grid.Select(r => Math.Pow(Math.Max(1 - (r / RadiusM), 0.0), 1.0 / n))];
        ImmutableArray<double> temperature = [.. grid.Select(r => Temperature(r / RadiusM))];
        ImmutableArray<double> cp = [.. temperature.Select(Cp)];
        // The trapezoid rule on the default grid meets the wall's infinite slope of (1 − s)^(1/7): 0.01 K on a 40 K rise.
        Assert.Equal(reference, MixingCup.Temperature(grid, massFlux, temperature, cp), 0.01);
        var fine = RadialGrid.WallClustered(RadiusM, 20001);
        Assert.Equal(reference, MixingCup.Temperature(fine,
            [.. fine.Select(r => Math.Pow(Math.Max(1 - (r / RadiusM), 0.0), 1.0 / n))],
            [.. fine.Select(r => Temperature(r / RadiusM))],
            [.. fine.Select(r => Cp(Temperature(r / RadiusM)))]), 1e-4);
        // It lies between the area mean (more weight near the hot wall) and the centre value (common practice check).
        Assert.InRange(reference, t0, MixingCup.AreaMean(fine, [.. fine.Select(r => Temperature(r / RadiusM))]));
    }

    [Fact]
    public void Lists_of_the_wrong_length_are_a_caller_mistake()
    {
        var grid = RadialGrid.WallClustered(RadiusM, 11);
        Assert.Throws<ArgumentException>(() => MixingCup.Temperature(grid, Constant(grid, 1.0), [300.0], Constant(grid, 1005.0)));
    }
}
