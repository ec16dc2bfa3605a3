using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// A closed interval [<see cref="Min"/>, <see cref="Max"/>] of valid values (raw or engineering, in the unit of the
/// quantity it guards). Used so that a calibration is never evaluated outside the span it was established over.
/// </summary>
public readonly record struct CalibrationRange
{
    /// <summary>Creates the interval; throws <see cref="BcPrepDataException"/> unless both ends are finite and Min ≤ Max.</summary>
    public CalibrationRange(double min, double max)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max) || min > max)
        {
            throw new BcPrepDataException(Invariant($"Calibration range [{min}, {max}] is not a finite interval with min <= max."));
        }

        Min = min;
        Max = max;
    }

    public double Min { get; }

    public double Max { get; }

    /// <summary>True when <paramref name="value"/> lies in [Min, Max]; false for NaN.</summary>
    public bool Contains(double value) => value >= Min && value <= Max;

    /// <summary>
    /// Throws <see cref="BcPrepDataException"/> naming <paramref name="quantity"/>, the value and this range when the
    /// value is outside it. NaN passes (a missing sample stays missing; the caller propagates it).
    /// </summary>
    public void Require(double value, string quantity)
    {
        if (!Contains(value) && !double.IsNaN(value))
        {
            throw OutOfRange(value, quantity);
        }
    }

    /// <summary>The exception <see cref="Require"/> throws, for callers that test the range themselves.</summary>
    public BcPrepDataException OutOfRange(double value, string quantity) =>
        new(Invariant($"{quantity} {value:R} is outside the valid range [{Min:R}, {Max:R}]; refusing to extrapolate."));

    /// <summary>
    /// Returns <paramref name="value"/> clamped into the range when it lies outside by no more than rounding
    /// (1e-9 of the range's scale), so that an inverse computed at an end point is not rejected; otherwise returns
    /// the value unchanged for the caller to reject.
    /// </summary>
    internal double ClampRounding(double value)
    {
        double slack = 1e-9 * Math.Max(Max - Min, Math.Max(Math.Abs(Min), Math.Abs(Max)));
        if (value < Min && value >= Min - slack)
        {
            return Min;
        }

        return value > Max && value <= Max + slack ? Max : value;
    }

    public override string ToString() => Invariant($"[{Min:R}, {Max:R}]");
}
