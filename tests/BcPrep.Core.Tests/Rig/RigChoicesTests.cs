using BcPrep.Calibration;
using BcPrep.Profiles;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Tests.Rig;

/// <summary>Rig-file choices are parsed once into types, and each type gives its rig-file word back (README's rig-file table).</summary>
public class RigChoicesTests
{
    [Fact]
    public void Every_word_maps_to_one_value_and_back()
    {
        AssertRoundTrip(RigChoices.ThermocoupleTypes);
        AssertRoundTrip(RigChoices.Distributions);
        AssertRoundTrip(RigChoices.VelocityModels);
        Assert.Equal("power_law", VelocityProfileModel.PowerLaw.RigName());
        Assert.Equal("arcsine", DistributionKind.ArcSine.RigName());
        Assert.Equal("N", ThermocoupleType.N.RigName());
    }

    [Fact]
    public void The_loader_stores_typed_choices()
    {
        var text = File.ReadAllText(RigLoaderTests.SampleRigPath)
            .Replace("velocity_model = \"auto\"", "velocity_model = \"spalding\"", StringComparison.Ordinal);
        var rig = RigLoader.Load(text, "marten-rig.toml");
        Assert.Equal(VelocityProfileModel.Spalding, rig.Profiles.VelocityModel);
        Assert.Equal(ThermocoupleType.K, Assert.IsType<ThermocoupleSensor>(rig.Channel("t_in")!.Sensor).Type);
    }

    [Fact]
    public void A_word_outside_the_list_is_a_caller_mistake_not_a_silent_default()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => RigChoices.VelocityModels.ValueOf("Auto"));
    }

    private static void AssertRoundTrip<T>(RigSpelling<T> spelling)
        where T : struct, Enum
    {
        Assert.Equal(spelling.Words.Count, spelling.Words.Select(spelling.ValueOf).Distinct().Count());
        Assert.All(spelling.Words, w => Assert.Equal(w, spelling.WordOf(spelling.ValueOf(w))));
    }
}
