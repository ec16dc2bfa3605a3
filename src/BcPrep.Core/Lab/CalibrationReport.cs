namespace BcPrep.Lab;

/// <summary>
/// The calibration section of a run: the test dates used, every channel's certificate and due date with its
/// standing, the channels whose expired calibration was explicitly allowed, and warnings for a person.
/// </summary>
public sealed record CalibrationReport(
    TestDates Dates,
    IReadOnlyList<ChannelCalibration> Channels,
    IReadOnlyList<string> AllowExpired,
    IReadOnlyList<string> Warnings)
{
    public IEnumerable<ChannelCalibration> Expired => Channels.Where(c => c.State == CalibrationState.Expired);
}
