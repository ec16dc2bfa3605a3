using System.Globalization;
using BcPrep.Rig;

namespace BcPrep.Lab;

/// <summary>
/// Checks every channel's calibration due date against the test day. A sensor whose due date lies before the last
/// date of the test day was used out of calibration: its data are not traceable, so this is a failure unless the
/// person allows it explicitly for that channel (or for all), in which case it becomes a recorded warning. A due
/// date is taken to be the last day the calibration is valid (common practice for "cal due" labels).
/// </summary>
public static class CalibrationCheck
{
    /// <summary>The word that allows every expired channel at once.</summary>
    public const string AllChannels = "all";

    /// <summary>
    /// Evaluates every channel. Throws <see cref="BcPrepFailure"/> (<see cref="FailureKind.Configuration"/>) naming
    /// each expired channel that is not allowed (channel, certificate, due date, test date, file, line and key), and
    /// for an allowed name that is no channel id. Unknown dates make due dates uncheckable: a warning, not a failure.
    /// </summary>
    public static CalibrationReport Evaluate(RigDescription rig, TestDates dates, IReadOnlyCollection<string> allowExpired)
    {
        var (report, problems) = Review(rig, dates, allowExpired);
        return problems.Count > 0 ? throw new BcPrepFailure(FailureKind.Configuration, problems) : report;
    }

    /// <summary>
    /// As <see cref="Evaluate"/>, but returns the expired channels that are not allowed as problems instead of
    /// throwing (for a check against a date that is not a test day's, where they are only warnings). Still
    /// throws for an allowed name that is no channel id.
    /// </summary>
    public static (CalibrationReport Report, IReadOnlyList<Problem> Expired) Review(RigDescription rig, TestDates dates, IReadOnlyCollection<string> allowExpired)
    {
        CheckAllowedNames(rig, allowExpired);
        var allowAll = allowExpired.Contains(AllChannels, StringComparer.Ordinal);
        var channels = new List<ChannelCalibration>();
        var problems = new List<Problem>();
        var warnings = new List<string>();
        foreach (var channel in rig.Channels)
        {
            var record = channel.Record;
            var location = record?.DueLocation ?? channel.Location;
            var state = StateOf(record?.DueOn, dates.Last);
            var allowed = allowAll || allowExpired.Contains(channel.Id, StringComparer.Ordinal);
            channels.Add(new ChannelCalibration(channel.Id, record?.Certificate, record?.CalibratedOn, record?.DueOn, record?.Interval?.ToString(),
                state, state == CalibrationState.Expired && allowed, location));
            if (state == CalibrationState.Expired)
            {
                var text = ExpiredText(channel.Id, record!, dates);
                if (allowed)
                {
                    warnings.Add(text + "; its data are used because the expired calibration was explicitly allowed");
                }
                else
                {
                    problems.Add(new Problem(location, text + $"; recalibrate it, or allow it explicitly (--allow-expired {channel.Id}), which is recorded in the manifest"));
                }
            }
            if (record?.CalibratedOn is { } calibrated && dates.First is { } first && calibrated > first)
            {
                warnings.Add($"channel '{channel.Id}': calibrated on {Iso(calibrated)}, after the test day {Iso(first)}: the certificate in force on the test day is another one");
            }
        }
        if (dates.Source == TestDateSource.Unknown && channels.Any(c => c.State == CalibrationState.NotChecked))
        {
            warnings.Add("the log times carry no date and [log] test_date is not given: calibration due dates cannot be checked");
        }
        return (new CalibrationReport(dates, channels, allowExpired.Order(StringComparer.Ordinal).ToList(), warnings), problems);
    }

    /// <summary>Expired when the last test date lies after the due date; the due date itself is still valid.</summary>
    public static CalibrationState StateOf(DateOnly? due, DateOnly? lastTestDate) => (due, lastTestDate) switch
    {
        (null, _) => CalibrationState.NoDueDate,
        (_, null) => CalibrationState.NotChecked,
        ({ } d, { } t) => t > d ? CalibrationState.Expired : CalibrationState.Valid,
    };

    private static void CheckAllowedNames(RigDescription rig, IReadOnlyCollection<string> allowExpired)
    {
        var ids = rig.Channels.Select(c => c.Id).ToList();
        var unknown = allowExpired.Where(a => a != AllChannels && !ids.Contains(a, StringComparer.Ordinal))
            .Select(a => new Problem(new SourceLocation("(command line)", Key: "--allow-expired"), $"no channel with id '{a}'{TableReader.Suggest(a, ids)} (give a channel id or '{AllChannels}')"))
            .ToList();
        if (unknown.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, unknown);
        }
    }

    private static string ExpiredText(string channel, CalibrationRecord record, TestDates dates)
    {
        var certificate = record.Certificate is null ? "no certificate reference" : $"certificate {record.Certificate}";
        var interval = record.Interval is null ? "" : $" ({Iso(record.CalibratedOn!.Value)} + {record.Interval})";
        var day = dates.First == dates.Last ? Iso(dates.Last!.Value) : $"{Iso(dates.First!.Value)} to {Iso(dates.Last!.Value)}";
        return $"channel '{channel}' ({certificate}) is used on {day}, after its calibration due date {Iso(record.DueOn!.Value)}{interval}";
    }

    private static string Iso(DateOnly date) => date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
}
