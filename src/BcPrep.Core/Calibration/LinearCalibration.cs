using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// y = Gain·x + Offset (Gain in engineering unit per raw unit, Offset in engineering unit).
/// Gain must be finite and non-zero, Offset finite; otherwise the constructor throws <see cref="BcPrepDataException"/>.
/// </summary>
public sealed record LinearCalibration : ISignalCalibration
{
    public LinearCalibration(double gain, double offset, CalibrationRange? validRawRange = null)
    {
        if (!double.IsFinite(gain) || gain == 0.0 || !double.IsFinite(offset))
        {
            throw new BcPrepDataException(Invariant($"Linear calibration needs a finite non-zero gain and a finite offset (gain {gain:R}, offset {offset:R})."));
        }

        Gain = gain;
        Offset = offset;
        ValidRawRange = validRawRange;
    }

    public double Gain { get; }

    public double Offset { get; }

    public CalibrationRange? ValidRawRange { get; }

    public double Apply(double raw)
    {
        ValidRawRange?.Require(raw, "Raw signal");
        return (Gain * raw) + Offset;
    }

    public double Derivative(double raw)
    {
        ValidRawRange?.Require(raw, "Raw signal");
        return double.IsNaN(raw) ? double.NaN : Gain;
    }

    /// <summary>x = (y − Offset)/Gain; throws when that x is outside <see cref="ValidRawRange"/>.</summary>
    public double Inverse(double engineering)
    {
        double raw = (engineering - Offset) / Gain;
        if (ValidRawRange is not { } range)
        {
            return raw;
        }

        raw = range.ClampRounding(raw);
        if (!range.Contains(raw) && !double.IsNaN(raw))
        {
            throw new BcPrepDataException(Invariant(
                $"Engineering value {engineering:R} maps to raw {raw:R}, outside the valid raw range {range}; refusing to extrapolate."));
        }

        return raw;
    }
}
