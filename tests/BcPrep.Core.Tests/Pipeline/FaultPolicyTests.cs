using BcPrep.Conditioning;
using BcPrep.Pipeline;
using BcPrep.Rig;
using BcPrep.Tests.Rig;
using BcPrep.Values;

namespace BcPrep.Tests.Pipeline;

public class FaultPolicyTests
{
    private const double DayStartS = 1000.0;
    private static readonly DayStart Start = new(new LoggerSeconds(DayStartS));
    private static readonly TimeWindow Window = new("OP1", DayStartS + 60.0, DayStartS + 360.0);

    private static RigDescription Rig() => ConditioningReaderTests.SampleWith("", "limits = { rail_high = \"10 V\", resolution = \"0.5 Pa\" }");

    /// <summary>2 Hz samples over the window: level + a deterministic ±2 Pa wobble (no spikes at k = 10, 4 σ).</summary>
    private static (double[] T, double[] X) Series(double level)
    {
        var n = 601;
        var t = new double[n];
        var x = new double[n];
        for (var i = 0; i < n; i++)
        {
            t[i] = Window.StartS + (0.5 * i);
            x[i] = level + (2.0 * Math.Sin(0.7 * i)) + (1.3 * Math.Sin(2.3 * i));
        }
        return (t, x);
    }

    [Fact]
    public void Saturation_at_a_declared_rail_fails_the_point_naming_channel_window_and_evidence()
    {
        var (t, x) = Series(1200.0);
        for (var i = 400; i < t.Length; i++)
        {
            x[i] = 5000.0; // clipped at the 10 V output rail = 5000 Pa through the calibration
        }
        var failure = Assert.Throws<BcPrepFailure>(() => FaultPolicy.Evaluate(Rig(), "p_in", Window, t, x, Start));
        Assert.Equal(FailureKind.InputData, failure.Kind);
        var message = failure.Problems[0].Message;
        Assert.Contains("channel 'p_in'", message, StringComparison.Ordinal);
        Assert.Contains("window 'OP1' (60.0–360.0 s)", message, StringComparison.Ordinal);
        Assert.Contains("from 260.0 s", message, StringComparison.Ordinal);
        Assert.Contains("Saturation: 201 samples", message, StringComparison.Ordinal);
    }

    [Fact]
    public void Open_thermocouple_pinned_near_the_range_end_fails_the_point()
    {
        var (t, x) = Series(0.0);
        for (var i = 0; i < x.Length; i++)
        {
            x[i] = 1620.0 + (0.01 * x[i]); // 1347 °C: above the default plausible 1339 °C for type K
        }
        var failure = Assert.Throws<BcPrepFailure>(() => FaultPolicy.Evaluate(Rig(), "t_w1", Window, t, x, Start));
        Assert.Contains("Implausible", failure.Problems[0].Message, StringComparison.Ordinal);
        Assert.Contains("'t_w1'", failure.Problems[0].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Stuck_channel_is_a_warning_with_its_evidence()
    {
        var (t, x) = Series(0.0);
        Array.Fill(x, 1234.0);
        var stats = FaultPolicy.Evaluate(Rig(), "p_in", Window, t, x, Start);
        var verdict = Assert.Single(stats.Conditioning!.Faults);
        Assert.Equal(SensorFaultKind.Stuck, verdict.Flag.Kind);
        Assert.Equal(FaultSeverity.Warning, verdict.Severity);
        Assert.Equal(1234.0, stats.Mean, 12);
    }

    [Fact]
    public void Flat_at_its_own_maximum_without_a_declared_rail_is_only_a_warning()
    {
        var (t, x) = Series(100.0);
        for (var i = 300; i < 400; i++)
        {
            x[i] = 200.0;
        }
        var stats = FaultPolicy.Evaluate(Rig(), "p_out", Window, t, x, Start);
        var verdict = Assert.Single(stats.Conditioning!.Faults);
        Assert.Equal(SensorFaultKind.Saturation, verdict.Flag.Kind);
        Assert.Equal(FaultSeverity.Warning, verdict.Severity);
    }

    [Fact]
    public void Spikes_and_a_short_dropout_are_reported_with_their_times()
    {
        var (t, x) = Series(1200.0);
        x[100] = 1900.0;                 // heater switching spike, t = 110 s after day start
        x[350] = 500.0;                  // t = 235 s
        x[200] = double.NaN;             // one empty cell, bridged, t = 160 s
        x[201] = double.NaN;
        var stats = FaultPolicy.Evaluate(Rig(), "p_in", Window, t, x, Start);
        var c = stats.Conditioning!;
        Assert.Equal([DayStartS + 110.0, DayStartS + 235.0], c.SpikeTimesS);
        var gap = Assert.Single(c.BridgedGaps);
        Assert.Equal(DayStartS + 159.5, gap.StartS, 12);
        Assert.Equal(DayStartS + 161.0, gap.EndS, 12);
        Assert.Equal(2, gap.MissingSamples);
        Assert.Equal(2, stats.BridgedSamples);
        Assert.Equal(2, stats.SpikesReplaced);
        Assert.Empty(c.Faults);
    }

    [Fact]
    public void Gap_longer_than_max_bridge_inside_a_window_is_left_open_reported_and_the_samples_around_it_kept()
    {
        var (t, x) = Series(1200.0);
        for (var i = 200; i < 210; i++)
        {
            x[i] = double.NaN; // 5.5 s between valid samples > 2 s
        }
        var stats = FaultPolicy.Evaluate(Rig(), "p_in", Window, t, x, Start);
        var gap = Assert.Single(stats.Conditioning!.UnbridgedGaps);
        Assert.Equal(DayStartS + 60.0 + 99.5, gap.StartS, 12);
        Assert.Equal(DayStartS + 60.0 + 105.0, gap.EndS, 12);
        Assert.Empty(stats.Conditioning.OpenEdgeGaps);
        Assert.Equal(601 - 10, stats.SampleCount); // the reduced sample count: both segments, nothing invented
        var kept = x.Where(double.IsFinite).ToArray();
        Assert.Equal(kept.Average(), stats.Mean, 9); // the mean of the samples on both sides
    }

    [Fact]
    public void Gaps_taking_more_than_a_quarter_of_the_window_fail_the_point_alone()
    {
        var (t, x) = Series(1200.0);
        for (var i = 100; i < 260; i++)
        {
            x[i] = double.NaN; // 80.5 s of a 300 s window: more than 25 % (the documented rule)
        }
        var failure = Assert.Throws<WindowLostFailure>(() => FaultPolicy.Evaluate(Rig(), "p_in", Window, t, x, Start));
        Assert.Equal(FailureKind.InputData, failure.Kind);
        Assert.Contains("more than 25 % of the window", failure.Problems[0].Message, StringComparison.Ordinal);
    }

    // Common practice: the statistics of a collected window work in the arrays the collector hands over; a point that
    // fails is evaluated again from the same arrays under its id (WindowStatsBook.DrainInto), so the bridged cell and
    // the replaced spikes must be put back first: the message is the one the untouched samples give, and the arrays
    // are as they were handed in.
    [Fact]
    public void A_collected_window_that_fails_after_de_spiking_is_evaluated_again_from_the_samples_as_handed_in()
    {
        var (t, x) = Series(1200.0);
        for (var i = 400; i < t.Length; i++)
        {
            x[i] = 5000.0; // saturated, as above
        }
        x[100] += 400.0; // spikes, replaced in place before the fault policy refuses the channel
        x[250] -= 400.0;
        x[180] = double.NaN; // one empty cell, bridged in place
        var handedIn = (double[])x.Clone();
        var expected = Assert.Throws<BcPrepFailure>(() => FaultPolicy.Evaluate(Rig(), "p_in", Window, t, (double[])x.Clone(), Start));
        var book = new WindowStatsBook();
        var detected = new TimeWindow("", Window.StartS, Window.EndS);

        DayProcessor.Collect(Rig(), Start, book, detected, "p_in", t, x);
        var failure = Assert.Throws<BcPrepFailure>(() => book.DrainInto([], named: new Dictionary<TimeWindow, TimeWindow> { [detected] = Window }));

        Assert.Equal(expected.Problems[0].Message, failure.Problems[0].Message);
        Assert.Contains("window 'OP1'", failure.Problems[0].Message, StringComparison.Ordinal);
        Assert.Equal(handedIn.Select(BitConverter.DoubleToInt64Bits), x.Select(BitConverter.DoubleToInt64Bits));
    }

    // Common practice: a collected window that succeeds gives the statistics of the copying path, bit for bit.
    [Fact]
    public void A_collected_window_gives_the_statistics_of_the_untouched_samples()
    {
        var (t, x) = Series(1200.0);
        x[100] += 400.0;
        x[180] = double.NaN;
        var expected = FaultPolicy.Evaluate(Rig(), "p_in", Window, t, (double[])x.Clone(), Start);
        var book = new WindowStatsBook();

        DayProcessor.Collect(Rig(), Start, book, Window, "p_in", t, x, new SourceLocation("rig.toml", Key: "OP1"));
        var stats = new Dictionary<string, Dictionary<string, ChannelWindowStats>>();
        book.DrainInto(stats);

        var actual = stats["OP1"]["p_in"];
        Assert.Equal(1, actual.SpikesReplaced);
        Assert.Equal(1, actual.BridgedSamples);
        Assert.Equal(BitConverter.DoubleToInt64Bits(expected.Mean), BitConverter.DoubleToInt64Bits(actual.Mean));
        Assert.Equal(expected.TypeA, actual.TypeA);
        Assert.Equal(expected.Conditioning!.SpikeTimesS, actual.Conditioning!.SpikeTimesS);
        Assert.Equal(expected.Conditioning.BridgedGaps, actual.Conditioning.BridgedGaps);
    }
}
