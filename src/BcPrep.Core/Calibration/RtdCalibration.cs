namespace BcPrep.Calibration;

/// <summary>A platinum RTD channel: raw resistance (Ω) → temperature (K) by IEC 60751 (<see cref="CallendarVanDusen"/>).</summary>
public sealed record RtdCalibration(RtdNominal Nominal) : ISignalCalibration
{
    public CalibrationRange? ValidRawRange => CallendarVanDusen.ResistanceRangeOhm(Nominal);

    public double Apply(double raw) => CallendarVanDusen.TemperatureK(Nominal, raw);

    public double Derivative(double raw) => 1.0 / CallendarVanDusen.SlopeOhmPerK(Nominal, Apply(raw));

    public double Inverse(double engineering) => CallendarVanDusen.ResistanceOhm(Nominal, engineering);
}
