namespace BcPrep.Physics;

/// <summary>
/// Thermophysical properties of dry air as pure functions of temperature (K) and pressure (Pa), SI units.
/// Every function rejects inputs outside its stated validity range with <see cref="BcPrepDataException"/>
/// (NaN and infinities included).
/// </summary>
public static class DryAir
{
    /// <summary>
    /// Specific gas constant of dry air, J/(kg·K): R*/M = 8314.32/28.9644 = 287.053 from the
    /// US Standard Atmosphere 1976 (same values in ISO 2533), rounded to 287.05.
    /// </summary>
    public const double GasConstantJPerKgK = 287.05;

    /// <summary>Ratio of specific heats used for the speed of sound, calorically perfect air.</summary>
    public const double HeatCapacityRatio = 1.4;

    /// <summary>Sutherland viscosity constant β_s, kg/(m·s·K^½) (US Standard Atmosphere 1976).</summary>
    public const double SutherlandBeta = 1.458e-6;

    /// <summary>Sutherland temperature S for viscosity, K (US Standard Atmosphere 1976).</summary>
    public const double SutherlandViscosityTemperatureK = 110.4;

    /// <summary>Reference conductivity k0 of White's Sutherland-type law, W/(m·K), at T0 = 273 K (S_k = 194 K).</summary>
    public const double ConductivityReferenceWPerMK = 0.0241;

    private const double ConductivityReferenceTemperatureK = 273.0;
    private const double ConductivitySutherlandTemperatureK = 194.0;

    /// <summary>Lowest/highest temperature accepted by the ideal-gas density, K.</summary>
    public const double DensityMinTemperatureK = 200.0, DensityMaxTemperatureK = 1000.0;

    /// <summary>Lowest/highest pressure accepted by the ideal-gas density, Pa.</summary>
    public const double DensityMinPressurePa = 1.0e3, DensityMaxPressurePa = 3.0e5;

    /// <summary>Range of the Sutherland viscosity law accepted here, K.</summary>
    public const double ViscosityMinTemperatureK = 170.0, ViscosityMaxTemperatureK = 1900.0;

    /// <summary>Range of the Sutherland-type conductivity law accepted here, K.</summary>
    public const double ConductivityMinTemperatureK = 200.0, ConductivityMaxTemperatureK = 1000.0;

    /// <summary>Range of the rigid-rotor/harmonic-oscillator cp accepted here, K.</summary>
    public const double HeatCapacityMinTemperatureK = 200.0, HeatCapacityMaxTemperatureK = 1000.0;

    /// <summary>Range where a constant γ = 1.4 keeps the speed of sound within ~0.4 %, K.</summary>
    public const double SoundSpeedMinTemperatureK = 200.0, SoundSpeedMaxTemperatureK = 600.0;

    /// <summary>One-line statement of the property methods, for the header of a written boundary-condition file.</summary>
    public const string PropertySourceDescription =
        "dry air: ideal gas R = 287.05 J/(kg K) (US Std Atm 1976); mu Sutherland beta = 1.458e-6, S = 110.4 K; " +
        "k Sutherland-type k0 = 0.0241 W/(m K), T0 = 273 K, S = 194 K (White); cp ideal-gas N2/O2/Ar " +
        "rigid rotor + harmonic oscillator; gamma = 1.4 for speed of sound";

    // Standard dry-air mole fractions of N2, O2, Ar; vibrational temperatures from the fundamental band
    // wavenumbers (N2 2329.9, O2 1556.4 cm^-1, times hc/k = 1.4388 cm·K) — from memory.
    private const double NitrogenMoleFraction = 0.78084, NitrogenVibrationalTemperatureK = 3352.0;
    private const double OxygenMoleFraction = 0.20946, OxygenVibrationalTemperatureK = 2239.0;
    private const double ArgonMoleFraction = 0.00934;

    /// <summary>
    /// Ideal-gas density ρ = p/(R T), kg/m³. Valid 200–1000 K and 1–300 kPa, where air's
    /// compressibility factor stays within about 0.3 % of 1 (second virial coefficient, from memory).
    /// </summary>
    public static double Density(double pressurePa, double temperatureK)
    {
        Require.InRange(pressurePa, DensityMinPressurePa, DensityMaxPressurePa, "pressure", "Pa", "the dry-air ideal-gas density");
        Require.InRange(temperatureK, DensityMinTemperatureK, DensityMaxTemperatureK, "temperature", "K", "the dry-air ideal-gas density");
        return pressurePa / (GasConstantJPerKgK * temperatureK);
    }

    /// <summary>
    /// Dynamic viscosity by Sutherland's law μ = β_s T^{3/2}/(T + S), Pa·s, β_s = 1.458e-6, S = 110.4 K.
    /// Valid 170–1900 K (range usually quoted for about 2 % accuracy, from memory).
    /// </summary>
    public static double Viscosity(double temperatureK)
    {
        Require.InRange(temperatureK, ViscosityMinTemperatureK, ViscosityMaxTemperatureK, "temperature", "K", "the Sutherland viscosity law");
        return SutherlandBeta * Math.Pow(temperatureK, 1.5) / (temperatureK + SutherlandViscosityTemperatureK);
    }

    /// <summary>
    /// Thermal conductivity by White's Sutherland-type law k = k0 (T/T0)^{3/2}(T0 + S_k)/(T + S_k), W/(m·K),
    /// k0 = 0.0241, T0 = 273 K, S_k = 194 K. Accepted 200–1000 K. Handbook tables differ from each other by
    /// about 2.5 % near 300 K, so treat k as uncertain by at least 2 %.
    /// </summary>
    public static double ThermalConductivity(double temperatureK)
    {
        Require.InRange(temperatureK, ConductivityMinTemperatureK, ConductivityMaxTemperatureK, "temperature", "K", "the Sutherland-type conductivity law");
        double t0 = ConductivityReferenceTemperatureK, s = ConductivitySutherlandTemperatureK;
        return ConductivityReferenceWPerMK * Math.Pow(temperatureK / t0, 1.5) * (t0 + s) / (temperatureK + s);
    }

    /// <summary>
    /// Ideal-gas (zero-pressure) isobaric specific heat, J/(kg·K): cp/R = Σ x_i [7/2 + E(θ_i/T)] for N2 and O2
    /// (rigid rotor, harmonic oscillator with Einstein function E(x) = x² eˣ/(eˣ − 1)²) plus 5/2 for argon,
    /// normalised to the three gases, times R = 287.05. Accepted 200–1000 K (no dissociation, anharmonic terms small).
    /// 1-atm tables read 0.2–0.4 % higher near room temperature.
    /// </summary>
    public static double SpecificHeatCp(double temperatureK)
    {
        Require.InRange(temperatureK, HeatCapacityMinTemperatureK, HeatCapacityMaxTemperatureK, "temperature", "K", "the ideal-gas cp model");
        var sum = ArgonMoleFraction * 2.5
            + NitrogenMoleFraction * (3.5 + EinsteinFunction(NitrogenVibrationalTemperatureK / temperatureK))
            + OxygenMoleFraction * (3.5 + EinsteinFunction(OxygenVibrationalTemperatureK / temperatureK));
        const double total = ArgonMoleFraction + NitrogenMoleFraction + OxygenMoleFraction;
        return sum / total * GasConstantJPerKgK;
    }

    /// <summary>Prandtl number μ cp / k from the three property functions above; accepted 200–1000 K.</summary>
    public static double Prandtl(double temperatureK) =>
        Viscosity(temperatureK) * SpecificHeatCp(temperatureK) / ThermalConductivity(temperatureK);

    /// <summary>Speed of sound √(γ R T), m/s, γ = 1.4. Accepted 200–600 K, where real γ stays within 1.4 ± 0.01.</summary>
    public static double SpeedOfSound(double temperatureK)
    {
        Require.InRange(temperatureK, SoundSpeedMinTemperatureK, SoundSpeedMaxTemperatureK, "temperature", "K", "the constant-gamma speed of sound");
        return Math.Sqrt(HeatCapacityRatio * GasConstantJPerKgK * temperatureK);
    }

    private static double EinsteinFunction(double x)
    {
        var ex = Math.Exp(-x);
        var denominator = 1.0 - ex;
        return x * x * ex / (denominator * denominator);
    }
}
