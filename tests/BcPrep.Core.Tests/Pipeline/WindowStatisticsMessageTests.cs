using BcPrep.Conditioning;
using BcPrep.Pipeline;
using BcPrep.Values;

namespace BcPrep.Tests.Pipeline;

public class WindowStatisticsMessageTests
{
    [Fact]
    public void A_long_gap_is_reported_in_seconds_since_the_first_sample_of_the_day()
    {
        // A day starting at 1 795 510 800 s (2026-11-24 09:00 UTC); a 60 s hole from 1000 s into the day, more than a
        // quarter of the 199.5 s window, so the point fails.
        const double dayStart = 1_795_510_800.0;
        var times = Enumerable.Range(0, 400).Select(i => dayStart + 900 + (i * 0.5)).Where(t => t < dayStart + 1000 || t >= dayStart + 1060).ToArray();
        var values = times.Select(_ => 1.0 + (0.01 * Random.Shared.NextDouble())).ToArray();
        var window = new TimeWindow("OP1", dayStart + 900, dayStart + 1099.5);

        var failure = Assert.Throws<WindowLostFailure>(() =>
            WindowStatistics.Evaluate("t_in", window, times, values, new ConditioningSettings(MaxBridgeS: 2.0), new SensorFaultLimits(), new DayStart(new LoggerSeconds(dayStart))));

        var message = Assert.Single(failure.Problems).Message;
        Assert.Contains("the longest 60.5 s from 999.5 s", message, StringComparison.Ordinal);
        Assert.DoesNotContain("17955", message, StringComparison.Ordinal);
    }
}
