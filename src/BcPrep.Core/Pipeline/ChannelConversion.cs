using BcPrep.Calibration;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// Builds, from a channel's sensor declaration, the function that turns a logged number into SI, and the
/// calibration objects the uncertainty model needs (slopes, fit residuals).
/// </summary>
public static class ChannelConversion
{
    public static SampleConverter For(ChannelSpec channel)
    {
        switch (channel.Sensor)
        {
            case ThermocoupleSensor tc:
            {
                var type = tc.Type;
                var rawToSi = tc.RawToSi;
                return (raw, referenceEmfV) => Its90Thermocouple.TemperatureK(type, rawToSi.Apply(raw) + referenceEmfV);
            }
            case RtdSensor rtd:
            {
                var nominal = rtd.Nominal;
                var rawToSi = rtd.RawToSi;
                return (raw, _) => CallendarVanDusen.TemperatureK(nominal, rawToSi.Apply(raw));
            }
            case DirectSensor direct:
            {
                var toSi = direct.UnitToSi;
                return (raw, _) => toSi.Apply(raw);
            }
            default:
            {
                var calibration = UserUnitCalibration(channel.Sensor);
                var toSi = channel.Sensor.UnitToSi;
                return (raw, _) => toSi.Apply(calibration.Apply(raw));
            }
        }
    }

    /// <summary>The calibration of a generic sensor in the user's units (raw unit in, engineering unit out).</summary>
    public static ISignalCalibration UserUnitCalibration(SensorSpec sensor) => sensor switch
    {
        LinearSensor l => new LinearCalibration(l.Gain, l.Offset),
        PolynomialSensor p => new PolynomialCalibration(p.Coefficients.ToArray()),
        TableSensor t => Fit(t),
        _ => throw new ArgumentException("not a generic sensor", nameof(sensor)),
    };

    public static FittedTableCalibration Fit(TableSensor table) =>
        FittedTableCalibration.Fit(table.Raw.ToArray(), table.Values.ToArray(), table.Degree);
}
