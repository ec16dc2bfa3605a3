using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

/// <summary>Rig-file keys of lab practice: %FS/%rdg uncertainty terms, calibration intervals, the test date.</summary>
public class LabRigKeysTests
{
    private const string SpanTerm = "  { kind = \"span\", value = \"0.25 %\", span = \"5 kPa\", source = \"transducer data sheet\" },";

    private static string SampleText => File.ReadAllText(RigLoaderTests.SampleRigPath);

    /// <summary>The sample rig with p_in's span term replaced; returns the text and the 1-based line of the term.</summary>
    private static (string Text, int Line) WithInletTerm(string term)
    {
        var lines = SampleText.Split('\n');
        var index = Array.IndexOf(lines, SpanTerm);
        Assert.True(index >= 0);
        lines[index] = "  " + term + ",";
        return (string.Join('\n', lines), index + 1);
    }

    [Theory]
    [InlineData("{ kind = \"span\", value = \"0.25 %FS\", span = \"5 kPa\" }")]
    [InlineData("{ value = \"0.25 %FS\", full_scale = \"5 kPa\" }")]
    [InlineData("{ value = \"0.25 %FS\", full_scale = \"20.0737 inH2O\" }")] // 5 kPa / 249.08891 Pa (NIST SP 811 conventional inch of water)
    public void Percent_of_full_scale_term_becomes_an_absolute_half_width(string term)
    {
        var (text, _) = WithInletTerm(term);
        var rig = RigLoader.Load(text, "rig.toml");
        var u = Assert.Single(rig.Channel("p_in")!.Uncertainty);
        Assert.Equal(UncertaintyTermKind.PercentOfSpan, u.Kind);
        Assert.Equal(12.5, u.ValueSi, 1e-3); // 0.25 % of 5000 Pa
    }

    [Fact]
    public void Percent_of_reading_shorthand_becomes_a_reading_term()
    {
        var (text, _) = WithInletTerm("{ value = \"1 %rdg\" }");
        var u = Assert.Single(RigLoader.Load(text, "rig.toml").Channel("p_in")!.Uncertainty);
        Assert.Equal(UncertaintyTermKind.PercentOfReading, u.Kind);
        Assert.Equal(0.01, u.ValueSi, 1e-15);
    }

    [Theory]
    [InlineData("{ value = \"0.25 %\", full_scale = \"5 kPa\" }", "does not say what it is a percentage of")]
    [InlineData("{ kind = \"reading\", value = \"0.25 %FS\" }", "use kind = \"span\"")]
    [InlineData("{ kind = \"span\", value = \"1 %rdg\", span = \"5 kPa\" }", "use kind = \"reading\"")]
    [InlineData("{ value = \"0.25 %FS\" }", "needs the range it refers to")]
    [InlineData("{ value = \"0.25 %FS\", span = \"5 kPa\", full_scale = \"5 kPa\" }", "not both")]
    [InlineData("{ value = \"0.25 %FS\", full_scale = \"5 kg/s\" }", "'kg/s' in '5 kg/s' is not a unit of pressure")]
    [InlineData("{ value = \"0.25 %FS\", full_scale = \"150 degF\" }", "is not a unit of pressure")]
    public void Misused_percent_or_wrong_dimension_is_an_error_at_the_terms_line(string term, string fragment)
    {
        var (text, line) = WithInletTerm(term);
        var failure = Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "rig.toml"));
        var problem = Assert.Single(failure.Problems);
        Assert.Equal(FailureKind.Configuration, failure.Kind);
        Assert.Equal("rig.toml", problem.Location.File);
        Assert.Equal(line, problem.Location.Line);
        Assert.NotNull(problem.Location.Key);
        Assert.Contains(fragment, problem.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Wrong_dimension_in_a_duct_key_names_file_line_and_key()
    {
        var text = SampleText.Replace("inner_diameter = \"52.5 mm\"", "inner_diameter = \"52.5 hPa\"", StringComparison.Ordinal);
        var line = Array.IndexOf(text.Split('\n'), "inner_diameter = \"52.5 hPa\"") + 1;
        var problem = Assert.Single(Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "rig.toml")).Problems);
        Assert.Equal(line, problem.Location.Line);
        Assert.Equal("duct.inner_diameter", problem.Location.Key);
        Assert.Contains("not a unit of length", problem.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Calibration_interval_gives_the_due_date_in_calendar_months()
    {
        var text = SampleText.Replace("calibration_due = \"2027-03-10\"", "calibration_interval = \"6 months\"", StringComparison.Ordinal);
        var record = RigLoader.Load(text, "rig.toml").Channel("p_baro")!.Record!;
        Assert.Equal(new DateOnly(2026, 9, 10), record.DueOn);
        Assert.Equal("6 months", record.Interval!.ToString());
        Assert.Equal(Array.IndexOf(text.Split('\n'), "calibration_interval = \"6 months\"") + 1, record.DueLocation!.Line);
    }

    [Theory]
    [InlineData("calibration_due = \"2027-03-10\"\ncalibration_interval = \"12 months\"", "not both")]
    [InlineData("calibration_interval = \"12 parsecs\"", "not a calibration interval")]
    public void Bad_calibration_interval_is_reported(string replacement, string fragment)
    {
        var text = SampleText.Replace("calibration_due = \"2027-03-10\"", replacement, StringComparison.Ordinal);
        var problem = Assert.Single(Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "rig.toml")).Problems);
        Assert.Contains("calibration_interval", problem.Location.Key, StringComparison.Ordinal);
        Assert.Contains(fragment, problem.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Interval_without_calibration_date_is_reported()
    {
        var text = SampleText.Replace("calibrated = \"2026-03-10\"\ncalibration_due = \"2027-03-10\"", "calibration_interval = \"12 months\"", StringComparison.Ordinal);
        var problem = Assert.Single(Assert.Throws<BcPrepFailure>(() => RigLoader.Load(text, "rig.toml")).Problems);
        Assert.Contains("needs the calibration date", problem.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Test_date_of_the_log_table_is_read()
    {
        var text = SampleText.Replace("decimal = \".\"", "decimal = \".\"\ntest_date = \"2026-11-24\"", StringComparison.Ordinal);
        Assert.Equal(new DateOnly(2026, 11, 24), RigLoader.Load(text, "rig.toml").Log.TestDate);
    }
}
