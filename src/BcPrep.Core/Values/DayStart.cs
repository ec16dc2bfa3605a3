using BcPrep.Rig;

namespace BcPrep.Values;

/// <summary>
/// The day's first sample on the logger clock: the one place where a <see cref="LoggerSeconds"/> becomes a
/// <see cref="DaySeconds"/> and back. Both conversions are the plain difference and sum, so a time converted there
/// and back is the same double as before.
/// </summary>
public readonly record struct DayStart(LoggerSeconds FirstSample)
{
    /// <summary>Seconds since the first sample of <paramref name="time"/> on the logger clock.</summary>
    public DaySeconds Since(LoggerSeconds time) => new(time.Value - FirstSample.Value);

    /// <summary>The logger-clock time of <paramref name="time"/> since the first sample.</summary>
    public LoggerSeconds OnClock(DaySeconds time) => new(FirstSample.Value + time.Value);

    /// <summary>A rig-file time bound on the logger clock: absolute bounds are already there, relative ones count from the first sample.</summary>
    public LoggerSeconds Resolve(TimeBound bound) => bound.IsAbsolute ? new(bound.Seconds) : OnClock(new DaySeconds(bound.Seconds));
}
