namespace BcPrep.Calibration;

/// <summary>
/// Reference-junction (cold-junction) compensation: the measured emf is referred to 0 °C by adding the emf the
/// thermocouple would produce between 0 °C and the reference-junction temperature, then converted once:
/// T_hot = T(E_meas + E(T_cj)). Emfs are added, never temperatures (the E–T relation is not linear).
/// </summary>
public static class ColdJunction
{
    /// <summary>
    /// Measuring-junction temperature (K) from the emf <paramref name="measuredEmfV"/> (V) read at terminals held at
    /// <paramref name="referenceJunctionK"/> (K). Throws <see cref="BcPrepDataException"/> when the reference
    /// temperature is outside the direct range or the compensated emf is outside the inverse range. NaN → NaN.
    /// </summary>
    public static double HotJunctionTemperatureK(
        ThermocoupleType type,
        double measuredEmfV,
        double referenceJunctionK,
        ThermocoupleInverseMethod method = ThermocoupleInverseMethod.NistPolynomial)
    {
        double compensatedEmfV = measuredEmfV + Its90Thermocouple.EmfV(type, referenceJunctionK);
        return Its90Thermocouple.TemperatureK(type, compensatedEmfV, method);
    }

    /// <summary>
    /// Sensitivity ∂T_hot/∂E_meas (K/V) = 1 / S(T_hot), S the Seebeck coefficient of the direct function.
    /// </summary>
    public static double SensitivityToEmfKPerV(ThermocoupleType type, double hotJunctionK) =>
        1.0 / Its90Thermocouple.SeebeckVPerK(type, hotJunctionK);

    /// <summary>
    /// Sensitivity ∂T_hot/∂T_cj (dimensionless) = S(T_cj) / S(T_hot): the weight with which the reference-junction
    /// temperature uncertainty reaches the measured temperature.
    /// </summary>
    public static double SensitivityToReferenceJunction(ThermocoupleType type, double hotJunctionK, double referenceJunctionK) =>
        Its90Thermocouple.SeebeckVPerK(type, referenceJunctionK) / Its90Thermocouple.SeebeckVPerK(type, hotJunctionK);
}
