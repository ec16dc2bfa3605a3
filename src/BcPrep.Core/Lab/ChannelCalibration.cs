namespace BcPrep.Lab;

/// <summary>The standing of a channel's calibration on the test day.</summary>
public enum CalibrationState
{
    /// <summary>The test day lies on or before the due date.</summary>
    Valid,
    /// <summary>The sensor was used after its due date.</summary>
    Expired,
    /// <summary>No due date is written for the channel.</summary>
    NoDueDate,
    /// <summary>A due date is written but the test day's date is not known.</summary>
    NotChecked,
}

/// <summary>One channel's calibration paperwork and its standing on the test day; <c>Overridden</c> is true when
/// the channel is expired and its use was allowed explicitly.</summary>
public sealed record ChannelCalibration(
    string Channel,
    string? Certificate,
    DateOnly? CalibratedOn,
    DateOnly? DueOn,
    string? Interval,
    CalibrationState State,
    bool Overridden,
    SourceLocation Location);
