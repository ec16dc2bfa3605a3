using BcPrep.Values;

namespace BcPrep.Calibration;

/// <summary>
/// Zero (tare) correction: y = Inner(x) − Tare.Value, where Tare is the calibrated value of the channel during a
/// declared no-flow / zero-load interval. Tare.StandardUncertainty is carried for the uncertainty stage (it is fully
/// correlated across all samples corrected with it). Derivative and range are the inner calibration's.
/// </summary>
public sealed record TaredCalibration(ISignalCalibration Inner, MeasuredValue Tare) : ISignalCalibration
{
    /// <summary>
    /// Tare from the mean raw reading over the zero interval: Tare = Inner(x̄), u(Tare) = |dy/dx(x̄)|·u(x̄),
    /// degrees of freedom passed through. Throws <see cref="BcPrepDataException"/> when the mean is NaN, its
    /// uncertainty negative/NaN, or the mean is outside the inner calibration's range.
    /// </summary>
    public static TaredCalibration FromZeroReading(ISignalCalibration inner, MeasuredValue zeroRawMean)
    {
        ArgumentNullException.ThrowIfNull(inner);
        if (double.IsNaN(zeroRawMean.Value) || !(zeroRawMean.StandardUncertainty >= 0.0))
        {
            throw new BcPrepDataException("Tare needs a numeric mean raw reading with a non-negative standard uncertainty.");
        }

        double tare = inner.Apply(zeroRawMean.Value);
        double sensitivity = Math.Abs(inner.Derivative(zeroRawMean.Value));
        return new TaredCalibration(
            inner, new MeasuredValue(tare, sensitivity * zeroRawMean.StandardUncertainty, zeroRawMean.DegreesOfFreedom));
    }

    public CalibrationRange? ValidRawRange => Inner.ValidRawRange;

    public double Apply(double raw) => Inner.Apply(raw) - Tare.Value;

    public double Derivative(double raw) => Inner.Derivative(raw);

    public double Inverse(double engineering) => Inner.Inverse(engineering + Tare.Value);
}
