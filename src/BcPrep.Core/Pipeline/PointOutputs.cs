namespace BcPrep.Pipeline;

/// <summary>
/// The one table of the point model's scalar outputs, in output order: name, unit, description and how each value is
/// read from the measurements and the physics. Definitions, values, covariance labels, budget rows and every table
/// are produced from it (with the per-point runs of <see cref="PointModel"/>: wall thermocouples, then the profile
/// points of <see cref="ProfileOutputs"/>); code that needs one output names its entry here, not a string.
/// </summary>
public static class PointOutputs
{
    public static readonly ScalarOutput InletStaticPressure = new("inlet.static_pressure", "Pa", "absolute static pressure at the inlet plane", (m, _) => m.InletPressurePa);
    public static readonly ScalarOutput OutletStaticPressure = new("outlet.static_pressure", "Pa", "absolute static pressure at the outlet plane", (m, _) => m.OutletPressurePa);
    public static readonly ScalarOutput InletTemperature = new("inlet.temperature", "K", "bulk temperature at the inlet plane", (m, _) => m.InletTemperatureK);
    public static readonly ScalarOutput OutletTemperature = new("outlet.temperature", "K", "bulk temperature at the outlet plane", (m, _) => m.OutletTemperatureK);
    public static readonly ScalarOutput InletMixingCupTemperature = MixingCupTemperature("inlet");
    public static readonly ScalarOutput OutletMixingCupTemperature = MixingCupTemperature("outlet");
    public static readonly ScalarOutput MassFlow = new("mass_flow", "kg/s", "mass flow through the duct", (m, _) => m.MassFlowKgS);
    public static readonly ScalarOutput HeaterPower = new("heater_power", "W", "electrical heater power", (m, _) => m.HeaterPowerW);
    public static readonly ScalarOutput WallHeatFlux = new("wall.heat_flux", "W/m2", "wall heat flux over the heated length, losses removed", (_, q) => q.WallHeatFlux);
    public static readonly ScalarOutput InletDensity = new("inlet.density", "kg/m3", "density at the inlet plane (ideal-gas dry air, or CIPM-2007 moist air with a humidity channel)", (_, q) => q.InletDensity);
    public static readonly ScalarOutput InletViscosity = new("inlet.viscosity", "Pa s", "dynamic viscosity at the inlet plane (Sutherland)", (_, q) => q.InletViscosity);
    public static readonly ScalarOutput InletBulkVelocity = new("inlet.bulk_velocity", "m/s", "bulk velocity at the inlet plane", (_, q) => q.BulkVelocity);
    public static readonly ScalarOutput Reynolds = new("reynolds", "1", "Reynolds number on diameter at inlet conditions", (_, q) => q.Reynolds);
    public static readonly ScalarOutput Mach = new("mach", "1", "Mach number at the inlet plane", (_, q) => q.Mach);
    public static readonly ScalarOutput TurbulenceIntensity = new("inlet.turbulence_intensity", "1", "turbulence intensity", (_, q) => q.TurbulenceIntensity);
    public static readonly ScalarOutput TurbulentKineticEnergy = new("inlet.turbulent_kinetic_energy", "m2/s2", "k", (_, q) => q.TurbulentKineticEnergy);
    public static readonly ScalarOutput TurbulenceLengthScale = new("inlet.turbulence_length_scale", "m", "length scale l", (_, q) => q.TurbulenceLengthScale);
    public static readonly ScalarOutput DissipationRate = new("inlet.dissipation_rate", "m2/s3", "epsilon = Cmu^(3/4) k^(3/2) / l", (_, q) => q.DissipationRate);
    public static readonly ScalarOutput SpecificDissipationRate = new("inlet.specific_dissipation_rate", "1/s", "omega = k^(1/2) / (Cmu^(1/4) l)", (_, q) => q.SpecificDissipationRate);
    public static readonly ScalarOutput PressureDropMeasured = new("pressure_drop.measured", "Pa", "inlet minus outlet static pressure", (_, q) => q.PressureDropMeasured);
    public static readonly ScalarOutput PressureDropExpected = new("pressure_drop.expected", "Pa", "friction (Colebrook) plus flow acceleration between the planes", (_, q) => q.PressureDropExpected);
    public static readonly ScalarOutput EnergyBalanceMismatch = new("energy_balance.mismatch", "1", "(P(1-loss) - m cp (T_out - T_in)) / (P(1-loss))", (_, q) => q.EnergyBalanceMismatch);

    /// <summary>
    /// The mixing-cup temperature of a plane with a temperature rake (NaN, so left out, at a point without one). The
    /// inlet's and outlet's are entries of <see cref="Scalars"/>; other planes' come after the profile runs.
    /// </summary>
    public static ScalarOutput MixingCupTemperature(string plane) => new($"{plane}.mixing_cup_temperature", "K",
        $"mixing-cup (bulk) temperature at the {plane} plane from its rake: integral of rho u cp T dA over integral of rho u cp dA",
        (_, q) => q.Rakes.FirstOrDefault(r => r.Plane == plane)?.MixingCupK ?? double.NaN);

    /// <summary>Every scalar output, in output order (declared after the entries: static fields initialise in text order).</summary>
    public static readonly IReadOnlyList<ScalarOutput> Scalars =
    [
        InletStaticPressure, OutletStaticPressure, InletTemperature, OutletTemperature, InletMixingCupTemperature, OutletMixingCupTemperature, MassFlow, HeaterPower,
        WallHeatFlux, InletDensity, InletViscosity, InletBulkVelocity, Reynolds, Mach,
        TurbulenceIntensity, TurbulentKineticEnergy, TurbulenceLengthScale, DissipationRate, SpecificDissipationRate,
        PressureDropMeasured, PressureDropExpected, EnergyBalanceMismatch,
    ];
}
