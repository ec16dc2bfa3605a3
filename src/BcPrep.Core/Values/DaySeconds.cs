namespace BcPrep.Values;

/// <summary>
/// A time in seconds since the day's first sample: the frame of steady detection and of every time a person reads
/// in the outputs. A time on the logger's clock is a <see cref="LoggerSeconds"/>; the two convert into each other
/// only through the day's <see cref="DayStart"/>.
/// </summary>
public readonly record struct DaySeconds(double Value) : IComparable<DaySeconds>
{
    /// <summary>The time <paramref name="durationS"/> seconds later.</summary>
    public static DaySeconds operator +(DaySeconds time, double durationS) => new(time.Value + durationS);

    /// <summary>The seconds from <paramref name="earlier"/> to <paramref name="later"/> (a duration, in no frame).</summary>
    public static double operator -(DaySeconds later, DaySeconds earlier) => later.Value - earlier.Value;

    public static bool operator <(DaySeconds a, DaySeconds b) => a.Value < b.Value;

    public static bool operator >(DaySeconds a, DaySeconds b) => a.Value > b.Value;

    public static bool operator <=(DaySeconds a, DaySeconds b) => a.Value <= b.Value;

    public static bool operator >=(DaySeconds a, DaySeconds b) => a.Value >= b.Value;

    public int CompareTo(DaySeconds other) => Value.CompareTo(other.Value);

    public override string ToString() => Value.ToString("R", System.Globalization.CultureInfo.InvariantCulture) + " s since the first sample";
}
