using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Tests.Values;

/// <summary>
/// The two time frames (logger clock, seconds since the day's first sample) meet only in <see cref="DayStart"/>
/// (no external source: the conversions are a difference and a sum, checked to the last bit).
/// </summary>
public class DayStartTests
{
    // 2026-11-24 08:00:00.25 UTC in Unix seconds: a logger clock value of the size ISO 8601 logs give.
    private static readonly DayStart Start = new(new LoggerSeconds(1_795_507_200.25));

    [Fact]
    public void Since_and_on_clock_are_the_plain_difference_and_sum()
    {
        var clock = new LoggerSeconds(1_795_510_800.5);

        Assert.Equal(1_795_510_800.5 - 1_795_507_200.25, Start.Since(clock).Value);
        Assert.Equal(1_795_507_200.25 + 3600.25, Start.OnClock(new DaySeconds(3600.25)).Value);
        Assert.Equal(new DaySeconds(0.0), Start.Since(Start.FirstSample));
    }

    [Fact]
    public void A_time_taken_to_the_day_frame_and_back_is_unchanged_where_the_sum_is_exact()
    {
        // Times on a 1 ms grid an hour apart: the difference and sum of these doubles are exact.
        for (var ms = 0; ms < 3_600_000; ms += 7_919)
        {
            var clock = Start.FirstSample + (ms / 1000.0);
            Assert.Equal(clock, Start.OnClock(Start.Since(clock)));
        }
    }

    [Fact]
    public void Rig_time_bounds_resolve_relative_from_the_first_sample_and_absolute_as_written()
    {
        Assert.Equal(new LoggerSeconds(1_795_507_200.25 + 120.0), Start.Resolve(new TimeBound(120.0, IsAbsolute: false)));
        Assert.Equal(new LoggerSeconds(1_795_508_000.0), Start.Resolve(new TimeBound(1_795_508_000.0, IsAbsolute: true)));
    }

    [Fact]
    public void Differences_within_a_frame_are_durations_and_times_order_within_their_frame()
    {
        var a = new LoggerSeconds(100.0);
        var b = a + 2.5;

        Assert.Equal(2.5, b - a);
        Assert.True(a < b && b > a && a <= b && b >= a && a >= new LoggerSeconds(100.0));
        Assert.Equal(-1, a.CompareTo(b));
        Assert.Equal(2.5, new DaySeconds(3.0) - new DaySeconds(0.5));
        Assert.True(new DaySeconds(0.5) < new DaySeconds(3.0));
    }
}
