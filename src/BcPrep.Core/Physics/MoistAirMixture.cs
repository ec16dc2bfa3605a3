namespace BcPrep.Physics;

/// <summary>
/// Moist air as a mixture of dry air and water vapour at a known vapour mole fraction x_v (from
/// <see cref="MoistAir"/>): vapour mass fraction and the mass-weighted specific heat. Heating a duct flow does not
/// change x_v, so a humidity measured at one plane serves every plane.
/// </summary>
public static class MoistAirMixture
{
    /// <summary>
    /// Ideal-gas specific heat of water vapour near 300 K, J/(kg K): 1872 (Çengel, Thermodynamics, Table A-2,
    /// from memory); it rises by about 1 % to 350 K, negligible at the vapour fractions of air.
    /// </summary>
    public const double VapourSpecificHeatJPerKgK = 1872.0;

    private const double DryAirMolarMassKgPerMol = 28.96546e-3;
    private const double WaterMolarMassKgPerMol = 18.01528e-3;

    /// <summary>y_v = x_v M_v / (x_v M_v + (1 − x_v) M_a); x_v in [0, 1], else <see cref="BcPrepDataException"/>.</summary>
    public static double VapourMassFraction(double vapourMoleFraction)
    {
        Require.InRange(vapourMoleFraction, 0.0, 1.0, "vapour mole fraction", "", "a moist-air mixture");
        var vapour = vapourMoleFraction * WaterMolarMassKgPerMol;
        return vapour / (vapour + ((1.0 - vapourMoleFraction) * DryAirMolarMassKgPerMol));
    }

    /// <summary>c_p = (1 − y_v) c_p,dry + y_v c_p,vapour, J/(kg K); x_v = 0 returns the dry-air value unchanged.</summary>
    public static double SpecificHeatCp(double dryAirCpJPerKgK, double vapourMoleFraction)
    {
        var y = VapourMassFraction(vapourMoleFraction);
        return ((1.0 - y) * dryAirCpJPerKgK) + (y * VapourSpecificHeatJPerKgK);
    }
}
