namespace BcPrep.Calibration;

/// <summary>
/// A thermocouple channel whose reference junction is at 0 °C (or already compensated in hardware): raw emf (V) →
/// temperature (K). For terminals at another temperature use <see cref="ColdJunction"/>. Derivative is 1/S(T) of
/// the direct function (the NIST inverse polynomial's own slope differs by well under 1 %).
/// </summary>
public sealed record ThermocoupleCalibration(
    ThermocoupleType Type, ThermocoupleInverseMethod Method = ThermocoupleInverseMethod.NistPolynomial) : ISignalCalibration
{
    public CalibrationRange? ValidRawRange => Its90Thermocouple.InverseRangeV(Type);

    public double Apply(double raw) => Its90Thermocouple.TemperatureK(Type, raw, Method);

    public double Derivative(double raw) => 1.0 / Its90Thermocouple.SeebeckVPerK(Type, Apply(raw));

    public double Inverse(double engineering) => Its90Thermocouple.EmfV(Type, engineering);
}
