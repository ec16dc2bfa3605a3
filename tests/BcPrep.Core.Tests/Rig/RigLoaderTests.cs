using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

public class RigLoaderTests
{
    internal static string SampleRigPath => Path.Combine(RepoRoot.Path, "sample-logs", "marten-rig.toml");

    /// <summary>The sample rig with the three windows it pinned before it relied on detection (tests that compare those windows).</summary>
    internal static string PinnedSampleRigPath => Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml");

    [Fact]
    public void Sample_rig_loads_with_SI_values()
    {
        var rig = RigLoader.Load(File.ReadAllText(SampleRigPath), "marten-rig.toml");
        Assert.Equal("Marten heated-duct stand", rig.Name);
        Assert.Equal(0.0525, rig.Duct.InnerDiameterM, 15);
        Assert.Equal(0.05, rig.Duct.HeaterLossFraction, 15);
        Assert.Equal(0.15, rig.Duct.PlanePositionsM["inlet"], 15);
        Assert.Equal(13, rig.Channels.Count);
        var baro = Assert.IsType<LinearSensor>(rig.Channel("p_baro")!.Sensor);
        Assert.Equal(100.0, baro.UnitToSi.Scale, 12); // hPa -> Pa
        var tc = Assert.IsType<ThermocoupleSensor>(rig.Channel("t_in")!.Sensor);
        Assert.Equal(1e-3, tc.RawToSi.Scale, 15); // mV -> V
        Assert.Equal("t_cj", tc.ColdJunctionChannel);
        Assert.Empty(rig.Points); // the sample rig relies on detection; its pins are a commented example
        Assert.Equal(3, rig.Steady.Keys.Count);
        Assert.Equal(0.0004, rig.Steady.Keys[0].MaxChangeSi, 15);
    }

    [Fact]
    public void The_pinned_copy_of_the_sample_rig_pins_its_three_windows()
    {
        // tests/marten-rig-pinned.toml: the windows the sample rig pinned before it relied on detection.
        var rig = RigLoader.Load(File.ReadAllText(PinnedSampleRigPath), "marten-rig-pinned.toml");
        Assert.Equal(["OP1", "OP2", "OP3"], rig.Points.Select(p => p.Id));
        Assert.Equal([49.5 * 60.0, 97 * 60.0, 150 * 60.0], rig.Points.Select(p => p.Start.Seconds));
        Assert.Equal([59.5 * 60.0, 107 * 60.0, 160 * 60.0], rig.Points.Select(p => p.End.Seconds));
    }

    [Fact]
    public void The_commented_example_in_the_sample_rig_pins_the_same_windows_once_uncommented()
    {
        // The sample rig's second example: uncommenting its [[point]] lines gives the pinned copy's points.
        var text = File.ReadAllText(SampleRigPath);
        var uncommented = System.Text.RegularExpressions.Regex.Replace(text, @"^# (\[\[point\]\]|id = |start = |end = )", "$1",
            System.Text.RegularExpressions.RegexOptions.Multiline);
        var rig = RigLoader.Load(uncommented, "marten-rig.toml");
        Assert.Equal(["OP1", "OP2", "OP3"], rig.Points.Select(p => p.Id));
        Assert.Equal([49.5 * 60.0, 97 * 60.0, 150 * 60.0], rig.Points.Select(p => p.Start.Seconds));
    }

    [Fact]
    public void Three_planted_mistakes_are_all_reported_with_their_lines()
    {
        var lines = File.ReadAllLines(SampleRigPath);
        var diameterLine = Array.FindIndex(lines, l => l.StartsWith("inner_diameter = ", StringComparison.Ordinal)) + 1;
        var heatedLine = Array.FindIndex(lines, l => l.StartsWith("heated_length", StringComparison.Ordinal)) + 1;
        var flowLine = Array.FindIndex(lines, l => l == "measures = \"mass_flow\"") + 1;
        lines[diameterLine - 1] = "inner_diameter = \"52.5 mn\"";
        lines[heatedLine - 1] = lines[heatedLine - 1].Replace("heated_length", "heated_lenght", StringComparison.Ordinal);
        lines[flowLine - 1] = "measures = \"mass_flw\"";

        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(string.Join('\n', lines), "bad.toml"));

        Assert.Equal(FailureKind.Configuration, failure.Kind);
        Assert.Equal(3, failure.Problems.Count);
        Assert.Equal([diameterLine, heatedLine, flowLine], failure.Problems.Select(p => p.Location.Line!.Value));
        Assert.Contains("not a unit of length", failure.Problems[0].Message, StringComparison.Ordinal);
        Assert.Contains("did you mean 'heated_length'", failure.Problems[1].Message, StringComparison.Ordinal);
        Assert.Contains("did you mean 'mass_flow'", failure.Problems[2].Message, StringComparison.Ordinal);
        Assert.All(failure.Problems, p => Assert.Equal("bad.toml", p.Location.File));
    }

    [Fact]
    public void Toml_syntax_error_names_its_line()
    {
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load("[rig]\nname = \"x\"\n[duct\n", "broken.toml"));
        Assert.Contains(failure.Problems, p => p.Location.Line == 3 && p.Message.StartsWith("TOML syntax", StringComparison.Ordinal));
    }

    [Fact]
    public void Duplicate_key_is_reported_with_both_lines()
    {
        var text = File.ReadAllText(SampleRigPath).Replace("fluid = \"dry_air\"", "fluid = \"dry_air\"\nname = \"again\"", StringComparison.Ordinal);
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "dup.toml"));
        var problem = Assert.Single(failure.Problems);
        Assert.Contains("defined twice (first at line 6)", problem.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("inner_diameter = \"52.5 mm\"", "inner_diameter = \"-52.5 mm\"", "out of range")]
    [InlineData("outlet = \"1.45 m\"", "outlet = \"0.10 m\"", "downstream of the inlet")]
    [InlineData("wall_roughness = \"1.5 um\"", "wall_roughness = \"30 mm\"", "impossible geometry")]
    [InlineData("points = 41", "points = 100000000", "out of range")]
    [InlineData("cold_junction = \"t_cj\"\ntolerance_class = \"1\"\nkey = true", "cold_junction = \"t_cjj\"\ntolerance_class = \"1\"\nkey = true", "did you mean 't_cj'")]
    [InlineData("reference = \"p_baro\"\nsensor = \"linear\"                        # 0-10 V", "reference = \"p_bar\"\nsensor = \"linear\"                        # 0-10 V", "no channel with id 'p_bar'")]
    [InlineData("gain = 60.0", "gain = \"sixty\"", "expected a number")]
    [InlineData("window = \"5 min\"", "window = \"5 mins\"", "not a unit of duration")]
    public void Invalid_values_are_reported(string original, string replacement, string fragment)
    {
        var text = File.ReadAllText(SampleRigPath);
        Assert.Contains(original, text, StringComparison.Ordinal);
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text.Replace(original, replacement, StringComparison.Ordinal), "edited.toml"));
        Assert.Contains(failure.Problems, p => p.Message.Contains(fragment, StringComparison.Ordinal) && p.Location.Line > 0);
    }
}
