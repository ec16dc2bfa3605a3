namespace BcPrep.Physics;

/// <summary>Result of the CIPM-2007 moist-air equation of state, SI units.</summary>
/// <param name="DensityKgPerM3">Moist-air density ρ, kg/m³.</param>
/// <param name="VapourMoleFraction">Water-vapour mole fraction x_v, dimensionless.</param>
/// <param name="CompressibilityFactor">Compressibility factor Z, dimensionless.</param>
/// <param name="SaturationVapourPressurePa">Saturation vapour pressure over water at the evaluated temperature, Pa.</param>
/// <param name="WithinCipmValidatedRange">
/// True when 15–27 °C and 60–110 kPa, the range for which CIPM-2007 states its own uncertainty (22e-6 relative);
/// outside it the result is an extrapolation of the compressibility and enhancement-factor fits.
/// </param>
public sealed record MoistAirState(
    double DensityKgPerM3,
    double VapourMoleFraction,
    double CompressibilityFactor,
    double SaturationVapourPressurePa,
    bool WithinCipmValidatedRange);

/// <summary>
/// Moist-air density by the CIPM-2007 formula (Picard, Davis, Gläser, Fujii, Metrologia 45 (2008) 149–155),
/// with its saturation-vapour-pressure fit psv = exp(A T² + B T + C + D/T) and enhancement factor
/// f = α + β p + γ t². Coefficients reproduced from memory of that paper (confidence: medium; the psv fit is
/// cross-checked in tests against the steam-table saturation pressure at 20 °C). CO2 mole fraction 0.0004.
/// Accepted 0–60 °C and 10–200 kPa; see <see cref="MoistAirState.WithinCipmValidatedRange"/>.
/// </summary>
public static class MoistAir
{
    public const double MinTemperatureK = 273.15, MaxTemperatureK = 333.15;
    public const double MinPressurePa = 1.0e4, MaxPressurePa = 2.0e5;

    private const double MolarGasConstant = 8.314472;
    private const double DryAirMolarMassKgPerMol = 28.96546e-3;
    private const double WaterMolarMassKgPerMol = 18.01528e-3;

    /// <summary>Moist-air state from relative humidity h in [0, 1] (not percent).</summary>
    public static MoistAirState FromRelativeHumidity(double pressurePa, double temperatureK, double relativeHumidity)
    {
        CheckState(pressurePa, temperatureK);
        Require.InRange(relativeHumidity, 0.0, 1.0, "relative humidity", "(fraction)", "the CIPM-2007 moist-air formula");
        var psv = SaturationVapourPressure(temperatureK);
        var xv = relativeHumidity * EnhancementFactor(pressurePa, temperatureK) * psv / pressurePa;
        return State(pressurePa, temperatureK, xv, psv);
    }

    /// <summary>Moist-air state from the dew-point temperature (K), which must not exceed the air temperature.</summary>
    public static MoistAirState FromDewPoint(double pressurePa, double temperatureK, double dewPointK)
    {
        CheckState(pressurePa, temperatureK);
        Require.InRange(dewPointK, MinTemperatureK, temperatureK, "dew point", "K", "the CIPM-2007 moist-air formula (dew point <= air temperature)");
        var xv = EnhancementFactor(pressurePa, dewPointK) * SaturationVapourPressure(dewPointK) / pressurePa;
        return State(pressurePa, temperatureK, xv, SaturationVapourPressure(temperatureK));
    }

    /// <summary>CIPM-2007 saturation vapour pressure over liquid water, Pa; accepted 0–60 °C.</summary>
    public static double SaturationVapourPressure(double temperatureK)
    {
        Require.InRange(temperatureK, MinTemperatureK, MaxTemperatureK, "temperature", "K", "the CIPM-2007 saturation vapour pressure");
        const double a = 1.2378847e-5, b = -1.9121316e-2, c = 33.93711047, d = -6.3431645e3;
        return Math.Exp((a * temperatureK * temperatureK) + (b * temperatureK) + c + (d / temperatureK));
    }

    private static double EnhancementFactor(double pressurePa, double temperatureK)
    {
        var t = temperatureK - 273.15;
        return 1.00062 + (3.14e-8 * pressurePa) + (5.6e-7 * t * t);
    }

    private static MoistAirState State(double p, double temperatureK, double xv, double psv)
    {
        var t = temperatureK - 273.15;
        var z = 1.0
            - (p / temperatureK * (1.58123e-6 - (2.9331e-8 * t) + (1.1043e-10 * t * t)
                + ((5.707e-6 - (2.051e-8 * t)) * xv) + ((1.9898e-4 - (2.376e-6 * t)) * xv * xv)))
            + (p * p / (temperatureK * temperatureK) * (1.83e-11 - (0.765e-8 * xv * xv)));
        var rho = p * DryAirMolarMassKgPerMol / (z * MolarGasConstant * temperatureK)
            * (1.0 - (xv * (1.0 - (WaterMolarMassKgPerMol / DryAirMolarMassKgPerMol))));
        var validated = t is >= 15.0 and <= 27.0 && p is >= 6.0e4 and <= 1.1e5;
        return new MoistAirState(rho, xv, z, psv, validated);
    }

    private static void CheckState(double pressurePa, double temperatureK)
    {
        Require.InRange(pressurePa, MinPressurePa, MaxPressurePa, "pressure", "Pa", "the CIPM-2007 moist-air formula");
        Require.InRange(temperatureK, MinTemperatureK, MaxTemperatureK, "temperature", "K", "the CIPM-2007 moist-air formula");
    }
}
