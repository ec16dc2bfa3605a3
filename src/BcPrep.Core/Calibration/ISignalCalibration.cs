namespace BcPrep.Calibration;

/// <summary>
/// Maps a raw logged signal x (V, mA, Ω, counts …) to an engineering SI value y, and back.
/// Contract for every implementation: NaN in → NaN out (a missing sample stays missing); a raw value outside
/// <see cref="ValidRawRange"/> (or an engineering value whose inverse would be) throws
/// <see cref="BcPrepDataException"/> naming the value and the range. Apply and Derivative do not allocate.
/// </summary>
public interface ISignalCalibration
{
    /// <summary>y = f(x).</summary>
    double Apply(double raw);

    /// <summary>dy/dx at x (engineering unit per raw unit): the sensitivity coefficient of the raw reading.</summary>
    double Derivative(double raw);

    /// <summary>x = f⁻¹(y), within <see cref="ValidRawRange"/> when one is declared.</summary>
    double Inverse(double engineering);

    /// <summary>Raw span the calibration is valid for; null when unrestricted.</summary>
    CalibrationRange? ValidRawRange { get; }
}
