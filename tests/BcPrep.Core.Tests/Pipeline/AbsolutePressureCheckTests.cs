using BcPrep.Pipeline;
using BcPrep.Uncertainty;

namespace BcPrep.Tests.Pipeline;

/// <summary>A point whose window means give an absolute pressure at or below zero is refused, naming the channel and the numbers.</summary>
public class AbsolutePressureCheckTests
{
    private static ChannelWindowStats Stats(string channel, double meanPa)
    {
        var mean = WindowMean.Evaluate([meanPa, meanPa, meanPa]);
        return new ChannelWindowStats(channel, "OP1", 3, 0, 0, 0, meanPa, 0.0, meanPa, meanPa, mean, []);
    }

    [Fact]
    public void Gauge_channel_below_minus_the_barometer_is_refused_with_its_numbers_written_for_a_person()
    {
        // Sample rig: p_in is a gauge transducer referenced to the barometer p_baro.
        var window = new Dictionary<string, ChannelWindowStats> { ["p_baro"] = Stats("p_baro", 101325.4), ["p_in"] = Stats("p_in", -101400.25) };

        var failure = Assert.Throws<BcPrepFailure>(() => AbsolutePressureCheck.Require(SampleDayResult.Rig(), "OP1", window, new Dictionary<string, ChannelWindowStats>()));

        Assert.Equal(FailureKind.InputData, failure.Kind);
        var problem = Assert.Single(failure.Problems);
        Assert.Equal("channel 'p_in'", problem.Location.Key);
        // MeasurementText (common practice): six significant digits, five-digit integers grouped by U+202F (SI Brochure 5.4.4).
        Assert.Contains("point 'OP1': negative absolute pressure: the window mean of 'p_in' (gauge, -101\u202F400 Pa) plus its reference 'p_baro' (101\u202F325 Pa) is -74.85 Pa",
            problem.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Positive_absolute_pressures_pass()
    {
        var window = new Dictionary<string, ChannelWindowStats> { ["p_baro"] = Stats("p_baro", 101325.0), ["p_in"] = Stats("p_in", 350.0) };

        AbsolutePressureCheck.Require(SampleDayResult.Rig(), "OP1", window, new Dictionary<string, ChannelWindowStats>());
    }
}
