using BcPrep.Rig;

namespace BcPrep.Lab;

/// <summary>Where the test day's date came from.</summary>
public enum TestDateSource
{
    /// <summary>The ISO-8601 timestamps of the logs (first and last sample).</summary>
    LogTimestamps,
    /// <summary><c>[log] test_date</c> of the rig file (logs in seconds on the logger's clock).</summary>
    RigFile,
    /// <summary>Given by the caller, e.g. <c>check --date</c> (no logs at hand).</summary>
    Given,
    /// <summary>Not known: the logs carry no dates and the rig file gives none.</summary>
    Unknown,
}

/// <summary>
/// The calendar dates a test day spans: the date of its first and of its last sample. Dates of ISO-8601 logs are
/// those of the UTC instant (a timestamp without an offset is read as UTC, so its date is the one written).
/// </summary>
public sealed record TestDates(DateOnly? First, DateOnly? Last, TestDateSource Source)
{
    public static TestDates Unknown { get; } = new(null, null, TestDateSource.Unknown);

    /// <summary>A single given date (no logs).</summary>
    public static TestDates On(DateOnly date) => new(date, date, TestDateSource.Given);

    /// <summary>
    /// Dates of a day whose samples run from <paramref name="firstS"/> to <paramref name="lastS"/> on the log
    /// clock. ISO-8601 logs: the dates of those instants. Seconds-only logs: <c>[log] test_date</c> for the first
    /// sample and that date plus the whole days elapsed for the last (the logger's time of day is unknown), or
    /// <see cref="Unknown"/> when no test_date is given. Non-finite times give <see cref="Unknown"/>.
    /// </summary>
    public static TestDates FromLogs(LogFormat log, double firstS, double lastS)
    {
        if (!double.IsFinite(firstS) || !double.IsFinite(lastS))
        {
            return Unknown;
        }
        if (log.TimeFormat == TimeFormat.Iso8601)
        {
            return new TestDates(DateOf(firstS), DateOf(lastS), TestDateSource.LogTimestamps);
        }
        if (log.TestDate is { } date)
        {
            var elapsedDays = (int)Math.Floor(Math.Max(0, lastS - firstS) / 86400.0);
            return new TestDates(date, date.AddDays(elapsedDays), TestDateSource.RigFile);
        }
        return Unknown;
    }

    private static DateOnly DateOf(double unixSeconds) =>
        DateOnly.FromDateTime(DateTime.UnixEpoch.AddTicks((long)Math.Round(unixSeconds * TimeSpan.TicksPerSecond)));
}
