using BcPrep.Rig;
using BcPrep.Tests.Pipeline;

namespace BcPrep.Tests.Rig;

/// <summary>The sensor, not the role, sets a channel's dimension (common practice: a unit belongs to what is read).</summary>
public class SensorDimensionTests
{
    private static RigDescription Load(string channel) => RigLoader.Load(SyntheticDay.Header + channel, "rig.toml");

    [Fact]
    public void Thermocouple_measuring_other_accepts_an_uncertainty_in_kelvin()
    {
        var rig = Load("""
            [[channel]]
            id = "t_spare"
            measures = "other"
            sensor = "thermocouple"
            type = "K"
            cold_junction_temperature = "0 degC"
            uncertainty = [ { kind = "absolute", value = "0.15 K", source = "test" } ]
            """);
        var channel = rig.Channel("t_spare")!;
        Assert.Equal(Dimension.Temperature, channel.Dimension);
        Assert.Equal(0.15, Assert.Single(channel.Uncertainty).ValueSi, 1e-12);
    }

    [Fact]
    public void Other_channel_takes_the_dimension_of_its_unit()
    {
        var rig = Load("""
            [[channel]]
            id = "p_spare"
            measures = "other"
            sensor = "linear"
            raw_unit = "V"
            unit = "kPa"
            gain = 1.0
            uncertainty = [ { kind = "absolute", value = "0.2 kPa", source = "test" } ]
            """);
        Assert.Equal(Dimension.Pressure, rig.Channel("p_spare")!.Dimension);
        Assert.Equal(200.0, Assert.Single(rig.Channel("p_spare")!.Uncertainty).ValueSi, 1e-9);
    }

    [Fact]
    public void Thermocouple_declared_as_a_pressure_is_refused_at_its_sensor_key()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => Load("""
            [[channel]]
            id = "p_wrong"
            measures = "static_pressure"
            plane = "inlet"
            sensor = "thermocouple"
            cold_junction_temperature = "0 degC"
            """));
        Assert.Contains(failure.Problems, p => p.Location.Key!.EndsWith("sensor", StringComparison.Ordinal) && p.Message.Contains("reads a temperature", StringComparison.Ordinal));
    }
}
