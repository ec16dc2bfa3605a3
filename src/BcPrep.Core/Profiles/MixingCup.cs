using System.Collections.Immutable;
using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>
/// The mixing-cup (bulk) temperature of a duct section: the temperature the fluid crossing the section would take
/// if it were mixed adiabatically, T_b = ∫ρ u cp T dA / ∫ρ u cp dA (the definition of the mean or bulk temperature
/// of internal flow, e.g. Incropera &amp; DeWitt, Fundamentals of Heat and Mass Transfer, §8.2; equation number from
/// memory). It weights each ring by the enthalpy it carries, so it is the temperature an energy balance needs; the
/// area mean ∫T dA / A is not, unless the flow or the temperature is uniform.
/// </summary>
public static class MixingCup
{
    /// <summary>
    /// T_b on a radial grid by the trapezoid rule in r (dA = 2πr dr), from the mass flux ρu, the temperature and
    /// the specific heat at each grid radius. The three lists have the grid's length; the mass flux is ≥ 0 and not
    /// zero everywhere, cp &gt; 0. The trapezoid rule makes a constant T come out exactly.
    /// </summary>
    public static double Temperature(ImmutableArray<double> radiusM, IReadOnlyList<double> massFluxKgPerM2S, IReadOnlyList<double> temperatureK,
        IReadOnlyList<double> specificHeatJPerKgK)
    {
        ArgumentNullException.ThrowIfNull(massFluxKgPerM2S);
        ArgumentNullException.ThrowIfNull(temperatureK);
        ArgumentNullException.ThrowIfNull(specificHeatJPerKgK);
        if (radiusM.IsDefault || radiusM.Length < 2 || massFluxKgPerM2S.Count != radiusM.Length || temperatureK.Count != radiusM.Length
            || specificHeatJPerKgK.Count != radiusM.Length)
        {
            throw new ArgumentException("The mixing-cup temperature needs a radial grid of at least 2 points and one mass flux, temperature and cp per grid point.");
        }
        var enthalpyFlux = Interpolation.AreaIntegral(radiusM, i => massFluxKgPerM2S[i] * specificHeatJPerKgK[i] * temperatureK[i]);
        var capacityFlux = Interpolation.AreaIntegral(radiusM, i => massFluxKgPerM2S[i] * specificHeatJPerKgK[i]);
        Require.Positive(capacityFlux, "heat-capacity flux ∫ρ u cp dA", "W/K");
        return enthalpyFlux / capacityFlux;
    }

    /// <summary>The area mean ∫T dA / (πR²) on the same grid (trapezoid rule), for comparison with <see cref="Temperature"/>.</summary>
    public static double AreaMean(ImmutableArray<double> radiusM, IReadOnlyList<double> temperatureK)
    {
        ArgumentNullException.ThrowIfNull(temperatureK);
        if (radiusM.IsDefault || radiusM.Length < 2 || temperatureK.Count != radiusM.Length)
        {
            throw new ArgumentException("The area mean needs a radial grid of at least 2 points and one temperature per grid point.");
        }
        var outer = radiusM[^1];
        return Interpolation.AreaIntegral(radiusM, i => temperatureK[i]) / (Math.PI * outer * outer);
    }
}
