namespace BcPrep.Rig;

/// <summary>Reads <c>calibration_interval</c> of a channel and works out the due date it implies.</summary>
internal static class CalibrationDueReader
{
    /// <summary>
    /// The interval and the due date it gives (calibrated + interval). Both null when no interval is written.
    /// An interval needs <c>calibrated</c>, and may not be given together with <c>calibration_due</c> (two
    /// statements of one date that could disagree).
    /// </summary>
    public static (CalibrationInterval? Interval, DateOnly? Due) Interval(TableReader t, DateOnly? calibrated, DateOnly? due)
    {
        var text = t.String("calibration_interval");
        if (text is null)
        {
            return (null, null);
        }
        if (!CalibrationInterval.TryParse(text, out var interval, out var error))
        {
            t.Report("calibration_interval", error);
            return (null, null);
        }
        if (due is not null)
        {
            t.Report("calibration_interval", "give either calibration_due or calibration_interval, not both");
            return (null, null);
        }
        if (calibrated is null)
        {
            t.Report("calibration_interval", "a calibration interval needs the calibration date: calibrated = \"yyyy-mm-dd\"");
            return (null, null);
        }
        return (interval, interval!.DueFrom(calibrated.Value));
    }
}
