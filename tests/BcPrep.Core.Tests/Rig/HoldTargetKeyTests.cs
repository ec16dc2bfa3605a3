using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

/// <summary><c>hold_target</c> of a <c>[steady]</c> key channel: read in SI, refused with its line and key when wrong.</summary>
public class HoldTargetKeyTests
{
    private static string SampleWith(string tOutKey)
    {
        var text = File.ReadAllText(RigLoaderTests.SampleRigPath);
        const string original = "{ channel = \"t_out\", max_change = \"0.3 K\", max_scatter = \"0.3 K\", step = \"2 K\" }";
        Assert.Contains(original, text, StringComparison.Ordinal);
        return text.Replace(original, "{ channel = \"t_out\", max_change = \"0.3 K\", max_scatter = \"0.3 K\", step = \"2 K\", " + tOutKey + " }", StringComparison.Ordinal);
    }

    private static int LineOf(string text, string fragment) =>
        Array.FindIndex(text.Split('\n'), l => l.Contains(fragment, StringComparison.Ordinal)) + 1;

    [Fact]
    public void A_hold_target_is_read_in_SI_and_absent_targets_stay_null()
    {
        var rig = RigLoader.Load(SampleWith("hold_target = \"50 mK\""), "rig.toml");
        Assert.Equal(0.05, rig.Steady.Keys.Single(k => k.Channel == "t_out").HoldTargetSi!.Value, 15);
        Assert.Null(rig.Steady.Keys.Single(k => k.Channel == "mdot").HoldTargetSi);
    }

    [Theory]
    [InlineData("hold_target = \"0.1 kg/s\"", "not a unit")]
    [InlineData("hold_target = \"0 K\"", "zero")]
    [InlineData("hold_target = \"-0.1 K\"", "")]
    [InlineData("hold_target = 0.1", "has no unit")]
    public void A_wrong_hold_target_is_refused_with_its_line_and_key(string entry, string fragment)
    {
        var text = SampleWith(entry);
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "rig.toml"));
        var problem = Assert.Single(failure.Problems);
        Assert.Equal(LineOf(text, "hold_target"), problem.Location.Line);
        Assert.Contains("hold_target", problem.Location.Key ?? "", StringComparison.Ordinal);
        Assert.Contains(fragment, problem.Message, StringComparison.Ordinal);
    }
}
