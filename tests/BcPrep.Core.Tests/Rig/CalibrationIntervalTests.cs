using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

public class CalibrationIntervalTests
{
    [Theory]
    [InlineData("12 months", "2026-03-10", "2027-03-10")]
    [InlineData("1 month", "2026-01-31", "2026-02-28")] // calendar month: the last day of a shorter month
    [InlineData("1 year", "2024-02-29", "2025-02-28")]
    [InlineData("365 d", "2026-03-10", "2027-03-10")]
    [InlineData("2 wk", "2026-03-10", "2026-03-24")]
    [InlineData("48 h", "2026-03-10", "2026-03-12")]
    public void Due_date_is_calibration_date_plus_interval(string interval, string calibrated, string due)
    {
        Assert.True(CalibrationInterval.TryParse(interval, out var parsed, out var error), error);
        Assert.Equal(DateOnly.Parse(due, System.Globalization.CultureInfo.InvariantCulture), parsed!.DueFrom(DateOnly.Parse(calibrated, System.Globalization.CultureInfo.InvariantCulture)));
    }

    [Theory]
    [InlineData("1.5 d", "whole number of days")]
    [InlineData("1.5 months", "whole number")]
    [InlineData("12 parsecs", "not a calibration interval")]
    [InlineData("12", "not a calibration interval")]
    public void Rejects_intervals_that_are_no_whole_calendar_steps(string text, string fragment)
    {
        Assert.False(CalibrationInterval.TryParse(text, out _, out var error));
        Assert.Contains(fragment, error, StringComparison.Ordinal);
    }
}
