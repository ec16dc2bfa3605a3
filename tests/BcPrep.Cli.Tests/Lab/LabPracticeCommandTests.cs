using System.Text.Json;
using BcPrep.Cli;

namespace BcPrep.Tests.Cli.Lab;

/// <summary>Calibration due dates and the test matrix through the commands, run in-process on the sample day.</summary>
public sealed class LabPracticeCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "bcprep-lab-" + Guid.NewGuid().ToString("N"));

    public LabPracticeCommandTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string Sample(string name) => Path.Combine(RepoRoot.Path, "sample-logs", name);

    private static string[] Logs => Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).ToArray();

    private static (int Code, string Out, string Error) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = BcPrepApp.Run(args, new CliContext(output, error, () => Stream.Null, false, Directory.GetCurrentDirectory()));
        return (code, output.ToString(), error.ToString());
    }

    /// <summary>The sample rig with the barometer's due date moved before the test day (2026-11-24).</summary>
    private string ExpiredRig()
    {
        var path = Path.Combine(_dir, "rig.toml");
        File.WriteAllText(path, File.ReadAllText(Sample("marten-rig.toml")).Replace("calibration_due = \"2027-03-10\"", "calibration_due = \"2026-11-01\"", StringComparison.Ordinal));
        return path;
    }

    private static int DueLine(string rig) => Array.IndexOf(File.ReadAllLines(rig), "calibration_due = \"2026-11-01\"") + 1;

    [Fact]
    public void Process_fails_with_exit_2_when_a_sensor_is_past_its_due_date()
    {
        var rig = ExpiredRig();
        var (code, output, error) = Run(["process", rig, .. Logs, "--out", Path.Combine(_dir, "out")]);
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.Contains($"{rig}:{DueLine(rig)}:", error, StringComparison.Ordinal);
        foreach (var fragment in new[] { "'p_baro'", "BAR-0412", "2026-11-01", "2026-11-24" })
        {
            Assert.Contains(fragment, error, StringComparison.Ordinal);
        }
        Assert.False(Directory.Exists(Path.Combine(_dir, "out")));
    }

    [Fact]
    public void Allowed_expired_sensor_is_processed_with_a_warning_recorded_in_the_manifest()
    {
        var rig = ExpiredRig();
        var outDir = Path.Combine(_dir, "out");
        var (code, _, error) = Run(["process", rig, .. Logs, "--out", outDir, "--allow-expired", "p_baro"]);
        Assert.True(code == 0, error);
        Assert.Contains("warning: channel 'p_baro'", error, StringComparison.Ordinal);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        var calibration = manifest.RootElement.GetProperty("calibration");
        Assert.Equal("2026-11-24", calibration.GetProperty("test_dates").GetProperty("first").GetString());
        Assert.Equal("2026-11-24", calibration.GetProperty("test_dates").GetProperty("last").GetString());
        Assert.Equal(["p_baro"], calibration.GetProperty("allow_expired").EnumerateArray().Select(e => e.GetString()));
        var baro = calibration.GetProperty("channels").EnumerateArray().Single(c => c.GetProperty("id").GetString() == "p_baro");
        Assert.Equal("BAR-0412", baro.GetProperty("certificate").GetString());
        Assert.Equal("2026-11-01", baro.GetProperty("due").GetString());
        Assert.Equal("expired", baro.GetProperty("state").GetString());
        Assert.True(baro.GetProperty("expired_use_allowed").GetBoolean());
        var flow = calibration.GetProperty("channels").EnumerateArray().Single(c => c.GetProperty("id").GetString() == "mdot");
        Assert.Equal("valid", flow.GetProperty("state").GetString());
        Assert.Equal("FM-2291", flow.GetProperty("certificate").GetString());
        Assert.Single(calibration.GetProperty("warnings").EnumerateArray());
    }

    [Fact]
    public void Check_with_a_test_date_fails_after_the_due_date_and_passes_with_the_override()
    {
        Assert.Equal(0, Run("check", Sample("marten-rig.toml"), "--date", "2027-03-10").Code);
        var (code, _, error) = Run("check", Sample("marten-rig.toml"), "--date", "2027-03-11");
        Assert.Equal(2, code);
        Assert.Contains("BAR-0412", error, StringComparison.Ordinal);
        Assert.Equal(0, Run("check", Sample("marten-rig.toml"), "--date", "2027-03-11", "--allow-expired", "p_baro").Code);
        Assert.Equal(2, Run("check", Sample("marten-rig.toml"), "--date", "11/03/2027").Code);
    }

    [Fact]
    public void Process_with_the_matrix_names_folders_summary_and_manifest_after_the_plan()
    {
        var outDir = Path.Combine(_dir, "out");
        var (code, _, error) = Run(["process", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), .. Logs, "--out", outDir, "--matrix", Path.Combine(RepoRoot.Path, "sample-logs", "plans", "marten-matrix.csv")]);
        Assert.True(code == 0, error);
        Assert.Equal(["F20-H600", "F30-H900", "F40-H1200"], Directory.GetDirectories(Path.Combine(outDir, "points")).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        var summaryIds = File.ReadAllLines(Path.Combine(outDir, "summary.csv")).Where(l => !l.StartsWith('#')).Skip(1).Select(l => l.Split(',')[0]);
        Assert.Equal(["F20-H600", "F30-H900", "F40-H1200"], summaryIds);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        var matched = manifest.RootElement.GetProperty("test_matrix").GetProperty("matched").EnumerateArray().ToList();
        Assert.Equal(["OP1", "OP2", "OP3"], matched.Select(m => m.GetProperty("window_id").GetString()));
        Assert.Equal(["F20-H600", "F30-H900", "F40-H1200"], manifest.RootElement.GetProperty("points").EnumerateArray().Select(p => p.GetProperty("id").GetString()));
    }

    [Fact]
    public void Unmatched_points_and_unrun_rows_are_warned_about_and_recorded()
    {
        var matrix = Path.Combine(_dir, "plan.csv");
        File.WriteAllText(matrix, "point,mass_flow [kg/s],tolerance_mass_flow [kg/s],heater_power [W],tolerance_heater_power [W]\n" +
                                  "low,0.020,0.001,600,30\n" +
                                  "mid,0.030,0.001,900,45\n" +
                                  "max,0.050,0.001,1500,50\n");
        var outDir = Path.Combine(_dir, "out");
        var (code, _, error) = Run(["process", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), .. Logs, "--out", outDir, "--matrix", matrix]);
        Assert.True(code == 0, error);
        Assert.Contains("warning: point 'OP3' matches no row", error, StringComparison.Ordinal);
        Assert.Contains("warning: planned point 'max'", error, StringComparison.Ordinal);
        Assert.Equal(["OP3", "low", "mid"], Directory.GetDirectories(Path.Combine(outDir, "points")).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        var section = manifest.RootElement.GetProperty("test_matrix");
        Assert.Equal(["OP3"], section.GetProperty("unmatched_points").EnumerateArray().Select(e => e.GetString()));
        var missing = Assert.Single(section.GetProperty("rows_without_point").EnumerateArray());
        Assert.Equal("max", missing.GetProperty("row").GetString());
        Assert.Equal(4, missing.GetProperty("line").GetInt32());
    }

    [Fact]
    public void Bad_matrix_fails_before_processing_with_file_line_and_column()
    {
        var matrix = Path.Combine(_dir, "plan.csv");
        File.WriteAllText(matrix, "point,heater_power [inH2O],tolerance_heater_power [W]\nlow,600,30\n");
        var (code, _, error) = Run(["process", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), .. Logs, "--out", Path.Combine(_dir, "out"), "--matrix", matrix]);
        Assert.Equal(2, code);
        Assert.Contains($"{matrix}:1:7: heater_power [inH2O]: 'inH2O' in '1 inH2O' is not a unit of power", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Changing_the_matrix_or_the_override_makes_the_run_out_of_date()
    {
        var outDir = Path.Combine(_dir, "out");
        string[] plain = ["process", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), .. Logs, "--out", outDir];
        Assert.Equal(0, Run(plain).Code);
        Assert.Contains("up to date", Run(plain).Error, StringComparison.Ordinal);
        var withMatrix = Run([.. plain, "--matrix", Path.Combine(RepoRoot.Path, "sample-logs", "plans", "marten-matrix.csv")]);
        Assert.DoesNotContain("up to date", withMatrix.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("up to date", Run([.. plain, "--allow-expired", "all"]).Error, StringComparison.Ordinal);
    }
}
