namespace BcPrep.Values;

/// <summary>
/// A time on the data logger's clock, in seconds: Unix seconds for ISO 8601 logs, the log's own count otherwise.
/// Samples, pinned and tare windows and gaps live on this clock. A time since the day's first sample is a
/// <see cref="DaySeconds"/>; the two convert into each other only through the day's <see cref="DayStart"/>, so one
/// cannot be used for the other by accident.
/// </summary>
public readonly record struct LoggerSeconds(double Value) : IComparable<LoggerSeconds>
{
    /// <summary>The time <paramref name="durationS"/> seconds later.</summary>
    public static LoggerSeconds operator +(LoggerSeconds time, double durationS) => new(time.Value + durationS);

    /// <summary>The seconds from <paramref name="earlier"/> to <paramref name="later"/> (a duration, in no frame).</summary>
    public static double operator -(LoggerSeconds later, LoggerSeconds earlier) => later.Value - earlier.Value;

    public static bool operator <(LoggerSeconds a, LoggerSeconds b) => a.Value < b.Value;

    public static bool operator >(LoggerSeconds a, LoggerSeconds b) => a.Value > b.Value;

    public static bool operator <=(LoggerSeconds a, LoggerSeconds b) => a.Value <= b.Value;

    public static bool operator >=(LoggerSeconds a, LoggerSeconds b) => a.Value >= b.Value;

    public int CompareTo(LoggerSeconds other) => Value.CompareTo(other.Value);

    public override string ToString() => Value.ToString("R", System.Globalization.CultureInfo.InvariantCulture) + " s on the logger clock";
}
