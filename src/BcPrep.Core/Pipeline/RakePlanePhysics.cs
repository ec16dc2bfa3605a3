using System.Collections.Immutable;
using BcPrep.Physics;
using BcPrep.Profiles;

namespace BcPrep.Pipeline;

/// <summary>
/// The mixing-cup temperature of a plane from its temperature rake and the velocity profile there. At the inlet the
/// inlet velocity profile weights the rake. At any other plane the profile is built by the same velocity model at
/// that plane's Reynolds number, 4ṁ/(πDμ), with μ at the rake's area-mean temperature: the density cancels, because
/// ρu of a profile scaled to ṁ does not depend on ρ. Density is taken uniform over the section, as in the inlet
/// profile.
/// </summary>
public static class RakePlanePhysics
{
    /// <summary>Reference pressure for the density that cancels in ρu (any positive value gives the same ρu).</summary>
    private const double ReferencePressurePa = 101325.0;

    /// <summary>The rake weighted by the inlet velocity profile <paramref name="inletVelocity"/> at density <paramref name="densityKgPerM3"/>.</summary>
    public static RakePlaneResult AtInlet(PlaneRake rake, VelocityProfileResult inletVelocity, double densityKgPerM3, double vapourMoleFraction)
    {
        ArgumentNullException.ThrowIfNull(rake);
        ArgumentNullException.ThrowIfNull(inletVelocity);
        return Weighted(rake, inletVelocity, densityKgPerM3, vapourMoleFraction);
    }

    /// <summary>
    /// The rake at a plane downstream: the velocity model of <paramref name="settings"/> at this plane's Reynolds number
    /// (μ from Sutherland at the rake's area mean, times <paramref name="viscosityFactor"/>; the power-law exponent
    /// times <paramref name="exponentFactor"/>).
    /// </summary>
    public static RakePlaneResult AtPlane(PlaneRake rake, double massFlowKgS, double diameterM, double viscosityFactor, double exponentFactor,
        double vapourMoleFraction, PointSettings settings)
    {
        ArgumentNullException.ThrowIfNull(rake);
        ArgumentNullException.ThrowIfNull(settings);
        var grid = RadialGrid.WallClustered(diameterM / 2, settings.RadialPoints);
        var areaMean = MixingCup.AreaMean(grid, TemperatureProfiles.FromRake(grid, rake.RadiiM, rake.TemperaturesK, RakeEndPolicy.ClampConstant).Profile.Values);
        var density = DryAir.Density(ReferencePressurePa, areaMean);
        var velocity = VelocityProfiles.Build(new VelocityProfileRequest(massFlowKgS, density, DryAir.Viscosity(areaMean) * viscosityFactor, diameterM,
            settings.VelocityModel, settings.RadialPoints, settings.WallRoughnessM / diameterM) { PowerLawExponentFactor = exponentFactor });
        return Weighted(rake, velocity, density, vapourMoleFraction);
    }

    private static RakePlaneResult Weighted(PlaneRake rake, VelocityProfileResult velocity, double densityKgPerM3, double vapourMoleFraction)
    {
        var grid = velocity.Profile.RadiusM;
        var temperature = TemperatureProfiles.FromRake(grid, rake.RadiiM, rake.TemperaturesK, RakeEndPolicy.ClampConstant);
        ImmutableArray<double> massFlux = [.. velocity.Profile.Values.Select(u => densityKgPerM3 * u)];
        ImmutableArray<double> cp = [.. temperature.Profile.Values.Select(t => MoistAirMixture.SpecificHeatCp(DryAir.SpecificHeatCp(t), vapourMoleFraction))];
        return new RakePlaneResult(rake.Plane, temperature, RadialProfile.Create("mass flux", "kg/(m2 s)", grid, massFlux),
            MixingCup.Temperature(grid, massFlux, temperature.Profile.Values, cp), MixingCup.AreaMean(grid, temperature.Profile.Values), velocity);
    }
}
