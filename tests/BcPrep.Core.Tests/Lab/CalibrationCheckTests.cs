using BcPrep.Lab;
using BcPrep.Rig;

namespace BcPrep.Tests.Lab;

public class CalibrationCheckTests
{
    private static readonly string SamplePath = Path.Combine(RepoRoot.Path, "sample-logs", "marten-rig.toml");

    // Sample rig: p_baro certificate BAR-0412 due 2027-03-10; mdot certificate FM-2291 due 2027-06-02.
    private static RigDescription Sample() => RigLoader.Load(File.ReadAllText(SamplePath), "marten-rig.toml");

    private static int LineOf(string text) => Array.IndexOf(File.ReadAllLines(SamplePath), text) + 1;

    [Fact]
    public void Use_on_the_due_date_itself_is_valid()
    {
        var report = CalibrationCheck.Evaluate(Sample(), TestDates.On(new DateOnly(2027, 3, 10)), []);
        Assert.Equal(CalibrationState.Valid, report.Channels.Single(c => c.Channel == "p_baro").State);
        Assert.Equal(CalibrationState.NoDueDate, report.Channels.Single(c => c.Channel == "p_in").State);
        Assert.Empty(report.Expired);
        Assert.Empty(report.Warnings);
    }

    [Fact]
    public void Use_after_the_due_date_fails_naming_channel_certificate_dates_and_line()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => CalibrationCheck.Evaluate(Sample(), TestDates.On(new DateOnly(2027, 3, 11)), []));
        Assert.Equal(FailureKind.Configuration, failure.Kind);
        var problem = Assert.Single(failure.Problems);
        Assert.Equal("marten-rig.toml", problem.Location.File);
        Assert.Equal(LineOf("calibration_due = \"2027-03-10\""), problem.Location.Line);
        Assert.Contains("calibration_due", problem.Location.Key, StringComparison.Ordinal);
        foreach (var fragment in new[] { "'p_baro'", "BAR-0412", "2027-03-10", "2027-03-11", "--allow-expired p_baro" })
        {
            Assert.Contains(fragment, problem.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Every_expired_channel_is_reported_at_once()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => CalibrationCheck.Evaluate(Sample(), TestDates.On(new DateOnly(2028, 1, 1)), []));
        Assert.Equal(2, failure.Problems.Count);
        Assert.Contains(failure.Problems, p => p.Message.Contains("FM-2291", StringComparison.Ordinal));
    }

    [Fact]
    public void Explicit_override_turns_the_failure_into_a_recorded_warning()
    {
        var report = CalibrationCheck.Evaluate(Sample(), TestDates.On(new DateOnly(2027, 4, 1)), ["p_baro"]);
        var baro = report.Channels.Single(c => c.Channel == "p_baro");
        Assert.Equal(CalibrationState.Expired, baro.State);
        Assert.True(baro.Overridden);
        Assert.Equal(["p_baro"], report.AllowExpired);
        var warning = Assert.Single(report.Warnings);
        Assert.Contains("explicitly allowed", warning, StringComparison.Ordinal);
    }

    [Fact]
    public void Override_all_covers_every_channel_but_only_the_named_one_otherwise()
    {
        var date = TestDates.On(new DateOnly(2028, 1, 1));
        Assert.Equal(2, CalibrationCheck.Evaluate(Sample(), date, [CalibrationCheck.AllChannels]).Expired.Count(c => c.Overridden));
        var failure = Assert.Throws<BcPrepFailure>(() => CalibrationCheck.Evaluate(Sample(), date, ["p_baro"]));
        Assert.Contains("mdot", Assert.Single(failure.Problems).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Override_of_a_channel_that_does_not_exist_is_an_error()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => CalibrationCheck.Evaluate(Sample(), TestDates.On(new DateOnly(2026, 11, 24)), ["p_bar"]));
        Assert.Contains("did you mean 'p_baro'", Assert.Single(failure.Problems).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_test_date_leaves_due_dates_unchecked_with_a_warning()
    {
        var report = CalibrationCheck.Evaluate(Sample(), TestDates.Unknown, []);
        Assert.Equal(CalibrationState.NotChecked, report.Channels.Single(c => c.Channel == "p_baro").State);
        Assert.Contains("cannot be checked", Assert.Single(report.Warnings), StringComparison.Ordinal);
    }

    [Fact]
    public void Dates_of_iso_logs_are_those_of_the_first_and_last_sample()
    {
        var log = new LogFormat("t", TimeFormat.Iso8601, ',', '.');
        // 2027-03-10T23:00:00Z and 2027-03-11T01:00:00Z as seconds since 1970-01-01 UTC.
        var first = new DateTimeOffset(2027, 3, 10, 23, 0, 0, TimeSpan.Zero).ToUnixTimeSeconds();
        var dates = TestDates.FromLogs(log, first, first + 7200);
        Assert.Equal(new DateOnly(2027, 3, 10), dates.First);
        Assert.Equal(new DateOnly(2027, 3, 11), dates.Last);
        // A day running past midnight uses the sensor after its due date.
        Assert.Throws<BcPrepFailure>(() => CalibrationCheck.Evaluate(Sample(), dates, []));
    }

    [Fact]
    public void Seconds_only_logs_take_the_rig_files_test_date_or_none()
    {
        var log = new LogFormat("t", TimeFormat.Seconds, ',', '.');
        Assert.Equal(TestDateSource.Unknown, TestDates.FromLogs(log, 0, 3600).Source);
        var dated = TestDates.FromLogs(log with { TestDate = new DateOnly(2026, 11, 24) }, 0, 3600);
        Assert.Equal(TestDateSource.RigFile, dated.Source);
        Assert.Equal(new DateOnly(2026, 11, 24), dated.Last);
        Assert.Equal(new DateOnly(2026, 11, 26), TestDates.FromLogs(log with { TestDate = new DateOnly(2026, 11, 24) }, 0, 2.5 * 86400).Last);
    }
}
