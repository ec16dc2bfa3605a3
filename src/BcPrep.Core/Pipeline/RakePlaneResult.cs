using BcPrep.Profiles;

namespace BcPrep.Pipeline;

/// <summary>
/// What a plane's temperature rake gives: the temperature profile on the radial grid, the mass flux ρu that weights
/// it, and the section's mixing-cup and area-mean temperatures.
/// </summary>
/// <param name="Plane">The plane's name in [duct.planes].</param>
/// <param name="Temperature">T(r) interpolated linearly between the rake sensors, nearest value held beyond the rake's ends.</param>
/// <param name="MassFluxKgPerM2S">ρu(r) on the same grid, integrating to the measured mass flow.</param>
/// <param name="MixingCupK">T_b = ∫ρ u cp T dA / ∫ρ u cp dA.</param>
/// <param name="AreaMeanK">∫T dA / A, for comparison.</param>
/// <param name="Velocity">The velocity profile whose shape weights the rake (the inlet's own, or one built at this plane's Reynolds number).</param>
public sealed record RakePlaneResult(
    string Plane,
    TemperatureProfileResult Temperature,
    RadialProfile MassFluxKgPerM2S,
    double MixingCupK,
    double AreaMeanK,
    VelocityProfileResult Velocity);
