using System.CommandLine;
using BcPrep.Cli;
using BcPrep.Cli.Commands;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// Every command that re-runs the reduction takes the options that change its result, the same as process: the
/// same names, value types, arity and help text. Before, budget told the user to pass --allow-expired and then
/// refused it as an unknown option.
/// </summary>
public sealed class ReductionOptionsTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "bcprep-reduction-" + Guid.NewGuid().ToString("N"));

    public ReductionOptionsTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static readonly string[] Logs = Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).ToArray();

    private static readonly string Matrix = Path.Combine(RepoRoot.Path, "sample-logs", "plans", "marten-matrix.csv");

    /// <summary>Every result-changing option on every command that re-runs the reduction.</summary>
    public static TheoryData<string, string> ResultChangingOptions => new()
    {
        { "process", "--allow-expired" }, { "process", "--matrix" }, { "process", "--monte-carlo" }, { "process", "--seed" },
        { "budget", "--allow-expired" }, { "budget", "--matrix" },
        { "covariance", "--allow-expired" }, { "covariance", "--matrix" },
        { "ensemble", "--allow-expired" }, { "ensemble", "--matrix" },
    };

    [Theory]
    [MemberData(nameof(ResultChangingOptions))]
    public void Command_takes_the_result_changing_option_as_process_does(string command, string option)
    {
        var mine = Option(command, option);
        var process = Option("process", option);

        Assert.Equal(process.ValueType, mine.ValueType);
        Assert.Equal((process.Arity.MinimumNumberOfValues, process.Arity.MaximumNumberOfValues), (mine.Arity.MinimumNumberOfValues, mine.Arity.MaximumNumberOfValues));
        Assert.Equal(process.Description, mine.Description);
        Assert.Equal(process.HelpName, mine.HelpName);
    }

    [Fact]
    public void The_list_above_is_every_option_of_the_shared_definition()
    {
        var listed = ResultChangingOptions.Select(row => (string)row[0] + " " + (string)row[1]).ToHashSet(StringComparer.Ordinal);
        var shared = new[] { ("process", ReductionOptions.WithMonteCarlo()) }
            .Concat(new[] { "budget", "covariance", "ensemble" }.Select(c => (c, ReductionOptions.WithoutMonteCarlo())))
            .SelectMany(pair => pair.Item2.All.Select(o => pair.Item1 + " " + o.Name));

        Assert.Equal(listed.Order(StringComparer.Ordinal), shared.Order(StringComparer.Ordinal));
    }

    [Theory]
    [InlineData("budget", "--quantity", "inlet.temperature")]
    [InlineData("covariance")]
    public void Reporting_command_refuses_an_expired_sensor_and_takes_the_allowance_process_takes(string command, params string[] extra)
    {
        var rig = ExpiredRig();

        var refused = CliRunner.Run([command, rig, .. Logs, "--point", "OP1", .. extra]);
        var allowed = CliRunner.Run([command, rig, .. Logs, "--point", "OP1", .. extra, "--allow-expired", "p_baro"]);

        Assert.Equal(ExitCodes.UsageOrRigFile, refused.ExitCode);
        Assert.Contains("--allow-expired", refused.Error, StringComparison.Ordinal);
        Assert.True(allowed.ExitCode == 0, allowed.Error);
        // The table's header row, after any '#' comment lines.
        Assert.StartsWith("point,", allowed.Out.Split('\n').First(l => !l.StartsWith('#')), StringComparison.Ordinal);
    }

    [Fact]
    public void Ensemble_with_the_test_matrix_knows_the_points_by_their_planned_names()
    {
        var outDir = Path.Combine(_dir, "ens");

        var run = CliRunner.Run(["ensemble", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), .. Logs, "--matrix", Matrix, "--point", "F30-H900", "--samples", "2", "--out", outDir]);

        Assert.True(run.ExitCode == 0, run.Error);
        Assert.True(File.Exists(Path.Combine(outDir, "members", "0002", "scalars.csv")));
    }

    [Fact]
    public void Budget_with_the_test_matrix_names_its_rows_after_the_plan()
    {
        var run = CliRunner.Run(["budget", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), .. Logs, "--matrix", Matrix, "--quantity", "mass_flow"]);

        Assert.True(run.ExitCode == 0, run.Error);
        var points = run.Out.Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(1).Select(l => l.Split(',')[0]).Distinct().ToList();
        Assert.Equal(["F20-H600", "F30-H900", "F40-H1200"], points);
    }

    private static Option Option(string command, string name)
    {
        var context = new CliContext(TextWriter.Null, TextWriter.Null, () => Stream.Null, false, Directory.GetCurrentDirectory());
        var found = CommandCatalog.Build(new CommonOptions(), context).Single(c => c.Name == command);
        var option = found.Options.SingleOrDefault(o => o.Name == name);
        Assert.True(option is not null, $"'{command}' has no option {name}");
        return option;
    }

    /// <summary>The sample rig with the barometer's due date moved before the test day (2026-11-24).</summary>
    private string ExpiredRig()
    {
        var path = Path.Combine(_dir, "rig.toml");
        var text = File.ReadAllText(Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"));
        Assert.Contains("calibration_due = \"2027-03-10\"", text, StringComparison.Ordinal);
        File.WriteAllText(path, text.Replace("calibration_due = \"2027-03-10\"", "calibration_due = \"2026-11-01\"", StringComparison.Ordinal));
        return path;
    }
}
