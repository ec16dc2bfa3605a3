using System.Collections.Immutable;
using BcPrep.Physics;
using BcPrep.Profiles;

namespace BcPrep.Pipeline;

/// <summary>The measured values of one operating point that the physics needs, in SI.</summary>
public sealed record PointMeasurements(
    double InletPressurePa,
    double OutletPressurePa,
    double InletTemperatureK,
    double OutletTemperatureK,
    double MassFlowKgS,
    double HeaterPowerW,
    ImmutableArray<double> WallTemperaturesK,
    double DiameterM,
    double HeaterLossFraction,
    double ViscosityFactor,
    double CpFactor)
{
    /// <summary>Relative humidity (fraction) at inlet conditions; NaN for dry air.</summary>
    public double RelativeHumidity { get; init; } = double.NaN;

    /// <summary>Radii (m) of the inlet temperature rake; empty for a uniform inlet temperature.</summary>
    public ImmutableArray<double> RakeRadiiM { get; init; } = [];

    /// <summary>Rake temperatures (K), one per radius.</summary>
    public ImmutableArray<double> RakeTemperaturesK { get; init; } = [];

    /// <summary>Model-form factor on the correlation's turbulence intensity (1 = the correlation as published).</summary>
    public double TurbulenceIntensityFactor { get; init; } = 1.0;

    /// <summary>Model-form factor on the power-law exponent n = 1/√f (1 = the relation as published).</summary>
    public double PowerLawExponentFactor { get; init; } = 1.0;

    /// <summary>Temperature rakes at planes other than the inlet, in the rig file's order.</summary>
    public ImmutableArray<PlaneRake> PlaneRakes { get; init; } = [];
}

/// <summary>Fixed geometry and settings that are not uncertain inputs.</summary>
public sealed record PointSettings(
    double WallRoughnessM,
    double HeatedLengthM,
    double PlaneSpacingM,
    VelocityProfileModel VelocityModel,
    int RadialPoints,
    double? TurbulenceIntensity,
    double? LengthScaleM);

/// <summary>Every derived boundary-condition quantity of a point.</summary>
public sealed record PointQuantities(
    double InletDensity,
    double InletViscosity,
    double BulkVelocity,
    double Reynolds,
    double Mach,
    double WallHeatFlux,
    double TurbulenceIntensity,
    double TurbulentKineticEnergy,
    double TurbulenceLengthScale,
    double DissipationRate,
    double SpecificDissipationRate,
    double PressureDropMeasured,
    double PressureDropExpected,
    double EnergyBalanceMismatch,
    VelocityProfileResult Velocity)
{
    /// <summary>Inlet temperature on the velocity grid from the rake; null when the inlet temperature is uniform.</summary>
    public TemperatureProfileResult? TemperatureProfile { get; init; }

    /// <summary>Water-vapour mole fraction of the air (CIPM-2007); 0 for dry air.</summary>
    public double VapourMoleFraction { get; init; }

    /// <summary>Every plane's temperature rake (the inlet's first) with its mixing-cup temperature; empty without rakes.</summary>
    public ImmutableArray<RakePlaneResult> Rakes { get; init; } = [];
}

/// <summary>
/// The physics of one operating point as a pure function of the measured values, so that the uncertainty stage
/// can re-evaluate it under perturbed inputs (GUM sensitivities, Monte Carlo, ensembles).
/// </summary>
public static class PointPhysics
{
    public static PointQuantities Evaluate(PointMeasurements m, PointSettings s)
    {
        var vapour = VapourMoleFraction(m);
        var rhoIn = InletDensity(m);
        var muIn = DryAir.Viscosity(m.InletTemperatureK) * m.ViscosityFactor;
        var bulk = PipeFlow.BulkVelocity(m.MassFlowKgS, rhoIn, m.DiameterM);
        var reynolds = PipeFlow.ReynoldsFromMassFlow(m.MassFlowKgS, m.DiameterM, muIn);
        var mach = PipeFlow.Mach(bulk, DryAir.SpeedOfSound(m.InletTemperatureK));
        var heatFlux = s.HeatedLengthM > 0 ? HeatTransfer.WallHeatFlux(m.HeaterPowerW, m.HeaterLossFraction, m.DiameterM, s.HeatedLengthM) : 0.0;

        var velocity = VelocityProfiles.Build(new VelocityProfileRequest(
            m.MassFlowKgS, rhoIn, muIn, m.DiameterM, s.VelocityModel, s.RadialPoints, s.WallRoughnessM / m.DiameterM) { PowerLawExponentFactor = m.PowerLawExponentFactor });
        var turbulence = Turbulence(m, s, bulk, muIn / rhoIn, reynolds);

        var (dpMeasured, dpExpected) = PressureDrop(m, s, rhoIn);
        var absorbed = m.HeaterPowerW * (1 - m.HeaterLossFraction);
        var meanT = 0.5 * (m.InletTemperatureK + m.OutletTemperatureK);
        var carried = m.MassFlowKgS * MoistAirMixture.SpecificHeatCp(DryAir.SpecificHeatCp(meanT), vapour) * m.CpFactor * (m.OutletTemperatureK - m.InletTemperatureK);
        var mismatch = absorbed > 0 ? (absorbed - carried) / absorbed : double.NaN;

        return new PointQuantities(rhoIn, muIn, bulk, reynolds, mach, heatFlux,
            turbulence?.Intensity ?? double.NaN, turbulence?.KineticEnergyM2PerS2 ?? double.NaN, turbulence?.LengthScaleM ?? double.NaN,
            turbulence?.DissipationRateM2PerS3 ?? double.NaN, turbulence?.SpecificDissipationRatePerS ?? double.NaN,
            dpMeasured, dpExpected, mismatch, velocity)
        {
            TemperatureProfile = m.RakeRadiiM.IsDefaultOrEmpty
                ? null
                : TemperatureProfiles.FromRake(velocity.Profile.RadiusM, m.RakeRadiiM, m.RakeTemperaturesK, RakeEndPolicy.ClampConstant),
            VapourMoleFraction = vapour,
            Rakes = Rakes(m, s, velocity, rhoIn, vapour),
        };
    }

    private static ImmutableArray<RakePlaneResult> Rakes(PointMeasurements m, PointSettings s, VelocityProfileResult inletVelocity, double rhoIn, double vapour)
    {
        if (m.RakeRadiiM.IsDefaultOrEmpty && m.PlaneRakes.IsDefaultOrEmpty)
        {
            return [];
        }
        var rakes = ImmutableArray.CreateBuilder<RakePlaneResult>();
        if (!m.RakeRadiiM.IsDefaultOrEmpty)
        {
            rakes.Add(RakePlanePhysics.AtInlet(new PlaneRake("inlet", m.RakeRadiiM, m.RakeTemperaturesK), inletVelocity, rhoIn, vapour));
        }
        foreach (var rake in m.PlaneRakes)
        {
            rakes.Add(RakePlanePhysics.AtPlane(rake, m.MassFlowKgS, m.DiameterM, m.ViscosityFactor, m.PowerLawExponentFactor, vapour, s));
        }
        return rakes.ToImmutable();
    }

    /// <summary>Water-vapour mole fraction at (p, T, relative humidity) by CIPM-2007.</summary>
    public static double VapourMoleFraction(double pressurePa, double temperatureK, double relativeHumidity) =>
        MoistAir.FromRelativeHumidity(pressurePa, temperatureK, relativeHumidity).VapourMoleFraction;

    /// <summary>
    /// Density at (p, T): CIPM-2007 moist air when a relative humidity is given (humidity taken at this state),
    /// ideal-gas dry air when it is NaN.
    /// </summary>
    public static double Density(double pressurePa, double temperatureK, double relativeHumidity) =>
        double.IsNaN(relativeHumidity)
            ? DryAir.Density(pressurePa, temperatureK)
            : MoistAir.FromRelativeHumidity(pressurePa, temperatureK, relativeHumidity).DensityKgPerM3;

    private static double InletDensity(PointMeasurements m) => Density(m.InletPressurePa, m.InletTemperatureK, m.RelativeHumidity);

    private static double VapourMoleFraction(PointMeasurements m) => double.IsNaN(m.RelativeHumidity)
        ? 0.0
        : MoistAir.FromRelativeHumidity(m.InletPressurePa, m.InletTemperatureK, m.RelativeHumidity).VapourMoleFraction;

    private static InletTurbulenceState? Turbulence(PointMeasurements m, PointSettings s, double bulk, double kinematic, double reynolds)
    {
        if (reynolds < FrictionFactor.LaminarLimitReynolds && s.TurbulenceIntensity is null)
        {
            return null; // laminar inlet: no turbulence quantities to prescribe
        }
        var intensity = s.TurbulenceIntensity ?? (InletTurbulence.PipeIntensity(reynolds) * m.TurbulenceIntensityFactor);
        var length = s.LengthScaleM ?? InletTurbulence.LengthScaleToDiameter * m.DiameterM;
        return InletTurbulence.FromIntensityAndLengthScale(bulk, intensity, length, kinematic);
    }

    /// <summary>
    /// Measured static-pressure drop between the planes against friction (Colebrook, at the mean bulk state) plus
    /// the momentum change of the heated, accelerating flow G²(1/ρ_out − 1/ρ_in), ρ_out = ρ_in (p_out/p_in)(T_in/T_out).
    /// </summary>
    private static (double Measured, double Expected) PressureDrop(PointMeasurements m, PointSettings s, double rhoIn)
    {
        var measured = m.InletPressurePa - m.OutletPressurePa;
        // Scaled from the inlet state (ideal gas, same composition) so that moist and dry air are treated alike and
        // the outlet may lie outside the moist-air formula's 0–60 °C range.
        var rhoOut = rhoIn * (m.OutletPressurePa / m.InletPressurePa) * (m.InletTemperatureK / m.OutletTemperatureK);
        var meanT = 0.5 * (m.InletTemperatureK + m.OutletTemperatureK);
        var rhoMean = 0.5 * (rhoIn + rhoOut);
        var mu = DryAir.Viscosity(meanT) * m.ViscosityFactor;
        var re = PipeFlow.ReynoldsFromMassFlow(m.MassFlowKgS, m.DiameterM, mu);
        var f = re <= FrictionFactor.LaminarLimitReynolds ? FrictionFactor.Laminar(re) : FrictionFactor.Colebrook(re, s.WallRoughnessM / m.DiameterM);
        var u = PipeFlow.BulkVelocity(m.MassFlowKgS, rhoMean, m.DiameterM);
        var friction = f * s.PlaneSpacingM / m.DiameterM * 0.5 * rhoMean * u * u;
        var g = m.MassFlowKgS / PipeFlow.Area(m.DiameterM);
        var acceleration = g * g * ((1 / rhoOut) - (1 / rhoIn));
        return (measured, friction + acceleration);
    }
}
