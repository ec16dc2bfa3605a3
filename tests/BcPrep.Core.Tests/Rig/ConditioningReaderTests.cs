using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

public class ConditioningReaderTests
{
    private const string PinAnchor = "id = \"p_in\"";

    internal static RigDescription SampleWith(string conditioning, string pInLimits)
    {
        var text = File.ReadAllText(RigLoaderTests.SampleRigPath);
        Assert.Contains(PinAnchor, text, StringComparison.Ordinal);
        text = text.Replace(PinAnchor, PinAnchor + "\n" + pInLimits, StringComparison.Ordinal) + "\n" + conditioning + "\n";
        return RigLoader.Load(text, "conditioned.toml");
    }

    [Fact]
    public void Absent_table_gives_the_documented_defaults()
    {
        var rig = RigLoader.Load(File.ReadAllText(RigLoaderTests.SampleRigPath), "marten-rig.toml");
        Assert.Equal(ConditioningSpec.Default, rig.Conditioning);
        Assert.Equal(2.0, rig.Conditioning.MaxBridgeS);
        Assert.Equal(10, rig.Conditioning.HampelHalfWindow);
        Assert.Equal(6.0, rig.Conditioning.HampelSigmas);
        Assert.Null(rig.Conditioning.LowPassCutoffHz);
        Assert.Null(rig.Conditioning.MainsHz);
        Assert.Equal(ChannelLimits.None, rig.Channel("p_in")!.Limits);
    }

    [Fact]
    public void Conditioning_table_and_raw_rails_are_read_in_SI()
    {
        var rig = SampleWith(
            "[conditioning]\nmax_bridge = \"1.5 s\"\nhampel_half_window = 5\nhampel_sigmas = 3.5\nlowpass_order = 2\nlowpass_cutoff = \"0.2 Hz\"\nmains = \"60 Hz\"\nnotch_q = 25\nnotch_harmonics = 2",
            "limits = { rail_low = \"0 V\", rail_high = \"10 V\", plausible_max = \"6 kPa\", resolution = \"1 Pa\" }");
        Assert.Equal(new ConditioningSpec(1.5, 5, 3.5, 2, 0.2, 60.0, 25.0, 2), rig.Conditioning);
        var pIn = rig.Channel("p_in")!;
        Assert.True(pIn.Limits.RailsRaw);
        Assert.Equal(10.0, pIn.Limits.RailHigh!.Value, 12);
        // Through the channel's calibration (gain 500 Pa/V): the 10 V output rail is 5000 Pa.
        var limits = ChannelConditioningPlan.Limits(pIn);
        Assert.Equal(5000.0, limits.RailHigh!.Value, 9);
        Assert.Equal(0.0, limits.RailLow!.Value, 12);
        Assert.Equal(6000.0, limits.PlausibleMax, 9);
        Assert.Equal(1.0, limits.RailTolerance, 12);   // defaults to the resolution
        Assert.Equal(1.0, ChannelConditioningPlan.Settings(rig, pIn).HampelScaleFloor, 12);
    }

    [Fact]
    public void Resolution_uncertainty_term_serves_as_the_resolution()
    {
        var rig = RigLoader.Load(File.ReadAllText(RigLoaderTests.SampleRigPath), "marten-rig.toml");
        Assert.Equal(1.0, ChannelConditioningPlan.Resolution(rig.Channel("p_baro")!), 12); // "0.01 hPa"
    }

    [Fact]
    public void Thermocouple_default_plausible_range_is_the_ITS90_range_less_two_percent_of_span()
    {
        // NIST Monograph 175: type K direct function valid −270…1372 °C (span 1642 K); margin 0.02 × 1642 = 32.84 K.
        var rig = RigLoader.Load(File.ReadAllText(RigLoaderTests.SampleRigPath), "marten-rig.toml");
        var limits = ChannelConditioningPlan.Limits(rig.Channel("t_w1")!);
        Assert.Equal(3.15 + 32.84, limits.PlausibleMin, 9);
        Assert.Equal(1645.15 - 32.84, limits.PlausibleMax, 9);
        Assert.Equal(double.PositiveInfinity, ChannelConditioningPlan.Limits(rig.Channel("p_in")!).PlausibleMax);
    }

    [Theory]
    [InlineData("[conditioning]\nmains = \"55 Hz\"", "", "is not one of: none, 50 Hz, 60 Hz")]
    [InlineData("[conditioning]\nlowpass_cutoff = \"5 s\"", "", "not a unit of frequency")]
    [InlineData("[conditioning]\nhampel_half_window = 2.5", "", "whole number")]
    [InlineData("[conditioning]\nhampel_window = 5", "", "unknown key 'hampel_window'")]
    [InlineData("", "limits = { rail_high = \"10 kg\" }", "nor of the raw signal")]
    [InlineData("", "limits = { rail_low = \"4 kPa\", rail_high = \"1 kPa\" }", "rail_high must be above rail_low")]
    [InlineData("", "limits = { rail_low = \"0 V\", rail_high = \"5 kPa\" }", "same kind of unit")]
    public void Invalid_conditioning_keys_are_reported(string conditioning, string limits, string fragment)
    {
        var failure = Assert.Throws<BcPrepFailure>(() => SampleWith(conditioning, limits));
        Assert.Equal(FailureKind.Configuration, failure.Kind);
        Assert.Contains(failure.Problems, p => p.Message.Contains(fragment, StringComparison.Ordinal) && p.Location.Line is not null);
    }

    [Fact]
    public void Thermocouple_rails_must_be_temperatures()
    {
        var text = File.ReadAllText(RigLoaderTests.SampleRigPath).Replace("id = \"t_w1\"", "id = \"t_w1\"\nlimits = { rail_high = \"50 mV\" }", StringComparison.Ordinal);
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "tc.toml"));
        Assert.Contains(failure.Problems, p => p.Message.Contains("rails are written as temperatures", StringComparison.Ordinal));
    }
}
