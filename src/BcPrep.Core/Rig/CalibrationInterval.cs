using System.Globalization;
using UnitsNet;
using UnitsNet.Units;

namespace BcPrep.Rig;

/// <summary>
/// A recalibration interval as written on a certificate or in a lab's recall system: "12 months", "1 year",
/// "26 weeks", "365 d". Months and years are calendar months and years (2026-03-10 + 12 months = 2027-03-10),
/// because that is how recall dates are set; a month has no fixed length in seconds, so it is not a unit
/// conversion. Days, weeks and hours are parsed by UnitsNet and must come to a whole number of days.
/// </summary>
public sealed record CalibrationInterval(int Count, CalibrationInterval.Unit Step)
{
    public enum Unit
    {
        Days,
        Months,
        Years,
    }

    private static readonly string[] MonthWords = ["month", "months", "mo", "mon"];
    private static readonly string[] YearWords = ["year", "years", "yr", "yrs", "a", "y"];

    /// <summary>The due date: <paramref name="calibratedOn"/> plus the interval (calendar arithmetic for months
    /// and years; the 31st plus one month gives the last day of the next month).</summary>
    public DateOnly DueFrom(DateOnly calibratedOn) => Step switch
    {
        Unit.Months => calibratedOn.AddMonths(Count),
        Unit.Years => calibratedOn.AddYears(Count),
        _ => calibratedOn.AddDays(Count),
    };

    /// <summary>As written back in messages and the manifest ("12 months", "365 days").</summary>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Count} {Step.ToString().ToLowerInvariant()}");

    /// <summary>Parses "N months", "N years" (whole numbers, 1 to 1200 months or 100 years) or any duration that
    /// UnitsNet reads ("365 d", "26 wk") and that is a whole number of days between 1 and 36 500.</summary>
    public static bool TryParse(string text, out CalibrationInterval? interval, out string error)
    {
        interval = null;
        error = $"'{text}' is not a calibration interval (write e.g. \"12 months\", \"1 year\", \"26 weeks\" or \"365 d\")";
        var parts = text.Trim().Split(' ', 2, StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        if (parts.Length != 2 || !double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out var count))
        {
            return false;
        }
        var unit = parts[1].ToLowerInvariant();
        if (MonthWords.Contains(unit) || YearWords.Contains(unit))
        {
            var isMonths = MonthWords.Contains(unit);
            if (count != Math.Round(count) || count < 1 || count > (isMonths ? 1200 : 100))
            {
                error = $"'{text}': the number of {(isMonths ? "months" : "years")} must be a whole number from 1 to {(isMonths ? 1200 : 100)}";
                return false;
            }
            interval = new CalibrationInterval((int)count, isMonths ? Unit.Months : Unit.Years);
            return true;
        }
        if (!Duration.TryParse(text.Trim(), CultureInfo.InvariantCulture, out var duration))
        {
            return false;
        }
        var days = duration.As(DurationUnit.Day);
        if (Math.Abs(days - Math.Round(days)) > 1e-9 || days < 1 || days > 36_500)
        {
            error = $"'{text}' is not a whole number of days between 1 and 36500";
            return false;
        }
        interval = new CalibrationInterval((int)Math.Round(days), Unit.Days);
        return true;
    }
}
