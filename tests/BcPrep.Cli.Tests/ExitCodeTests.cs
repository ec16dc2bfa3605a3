using System.CommandLine;
using System.Globalization;
using BcPrep.Cli;
using BcPrep.Conditioning;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>Every documented exit code (README "Exit codes", ExitCodes.cs) reached by a real cause.</summary>
public sealed class ExitCodeTests
{
    [Fact]
    public void Valid_rig_file_check_exits_0_with_nothing_on_stdout()
    {
        var run = CliRunner.Run("check", SampleDay.Rig);

        Assert.Equal(ExitCodes.Success, run.ExitCode);
        Assert.Equal(0, ExitCodes.Success);
        Assert.Equal("", run.Out);
        Assert.Contains("ok (13 channels, 3 pinned operating points)", run.Error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("process", "--no-such-option")]
    [InlineData("process", "RIG-ONLY")]
    [InlineData("no-such-command")]
    [InlineData("check", "--seed", "x")]
    [InlineData]
    public void Usage_error_exits_2_and_writes_nothing_to_stdout(params string[] args)
    {
        var run = CliRunner.Run(args);

        Assert.Equal(2, run.ExitCode);
        Assert.Equal(ExitCodes.UsageOrRigFile, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.StartsWith("error: ", run.Error, StringComparison.Ordinal);
        Assert.Contains("--help'.", run.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("Usage:", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Process_without_out_option_is_a_usage_error_with_empty_stdout()
    {
        var run = CliRunner.Run("process", SampleDay.Rig, SampleDay.Morning);

        Assert.Equal(2, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("--out", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Invalid_rig_file_exits_2_naming_line_and_key()
    {
        using var temp = new TempFolder();
        var rig = temp.File("rig.toml");
        File.WriteAllText(rig, File.ReadAllText(SampleDay.BundledRig).Replace("inner_diameter = \"52.5 mm\"", "inner_diameter = \"52.5 mn\"", StringComparison.Ordinal));

        var check = CliRunner.Run("check", rig);
        var process = CliRunner.Run("process", rig, SampleDay.Morning, "--out", temp.File("out"));

        Assert.Equal(2, check.ExitCode);
        Assert.Equal(2, process.ExitCode);
        Assert.Equal("", check.Out + process.Out);
        Assert.Contains("rig.toml:11:1: duct.inner_diameter", check.Error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(temp.File("out")));
    }

    [Fact]
    public void Missing_rig_file_exits_2()
    {
        using var temp = new TempFolder();

        var run = CliRunner.Run("check", temp.File("nothing.toml"));

        Assert.Equal(2, run.ExitCode);
        Assert.Contains("cannot read the rig file", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Log_with_a_cell_that_is_no_number_exits_3_naming_file_line_and_column()
    {
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        var cells = lines[99].Split(',');
        cells[4] = "x7";
        lines[99] = string.Join(',', cells);
        var log = temp.File("bad.csv");
        File.WriteAllLines(log, lines);

        var run = CliRunner.Run("process", SampleDay.Rig, log, SampleDay.Afternoon, "--out", temp.File("out"));

        Assert.Equal(3, run.ExitCode);
        Assert.Equal(ExitCodes.BadInputData, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("bad.csv:100:5: FM_MA: 'x7' is not a number", run.Error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(temp.File("out")));
    }

    [Fact]
    public void Missing_log_file_exits_3()
    {
        using var temp = new TempFolder();

        var run = CliRunner.Run("calibrate", SampleDay.Rig, temp.File("absent.csv"));

        Assert.Equal(3, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("absent.csv", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Day_whose_key_channel_drifts_all_day_has_no_steady_point_and_exits_4()
    {
        // The flow meter current ramps from 4 to 20 mA over the morning: 0.05 kg/s in 4800 s, i.e. 3.1e-3 kg/s per
        // 5 min window against the rig's max_change of 0.0004 kg/s, so no window can be steady.
        using var temp = new TempFolder();
        var rig = temp.File("rig.toml");
        File.WriteAllText(rig, SampleDay.RigWithoutPinnedPoints());
        var lines = File.ReadAllLines(SampleDay.Morning);
        var rows = lines.Length - 1;
        for (var i = 1; i < lines.Length; i++)
        {
            var cells = lines[i].Split(',');
            cells[4] = (4.0 + (16.0 * (i - 1) / rows)).ToString("F4", CultureInfo.InvariantCulture);
            lines[i] = string.Join(',', cells);
        }
        var log = temp.File("ramp.csv");
        File.WriteAllLines(log, lines);

        var run = CliRunner.Run("process", rig, log, "--out", temp.File("out"));

        Assert.Equal(4, run.ExitCode);
        Assert.Equal(ExitCodes.NoSteadyPoint, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("no steady operating point found", run.Error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(temp.File("out")));
    }

    [Fact]
    public void Window_losing_more_than_a_quarter_to_a_gap_fails_alone_the_others_are_written_and_exit_is_6()
    {
        // The outlet thermocouple is blank for 200 s (3000-3200 s) inside OP1's pinned 600 s window (2970-3570 s):
        // a third of it, beyond the documented limit of a quarter. OP2 and OP3 are untouched.
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        for (var row = 6000; row < 6400; row++) // 2 Hz: row k (after the header) is at k/2 s
        {
            var cells = lines[row + 1].Split(',');
            cells[7] = "";
            lines[row + 1] = string.Join(',', cells);
        }
        var log = temp.File("gap.csv");
        File.WriteAllLines(log, lines);
        var output = temp.File("out");

        var run = CliRunner.Run("process", SampleDay.Rig, log, SampleDay.Afternoon, "--out", output);

        Assert.Equal(6, run.ExitCode);
        Assert.Equal(ExitCodes.SomePointsFailed, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("OP1: point failed and was not written", run.Error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(output, "points", "OP1")));
        Assert.True(Directory.Exists(Path.Combine(output, "points", "OP2")));
        Assert.True(Directory.Exists(Path.Combine(output, "points", "OP3")));
        using var manifest = System.Text.Json.JsonDocument.Parse(File.ReadAllBytes(Path.Combine(output, "manifest.json")));
        var failed = Assert.Single(manifest.RootElement.GetProperty("failed_points").EnumerateArray());
        Assert.Equal("OP1", failed.GetProperty("id").GetString());
        Assert.Contains("t_out", failed.GetProperty("reason").GetString(), StringComparison.Ordinal);

        // Up to date, not recomputed: a script still learns that a point failed.
        Assert.Equal(ExitCodes.SomePointsFailed, CliRunner.Run("process", SampleDay.Rig, log, SampleDay.Afternoon, "--out", output).ExitCode);
    }

    [Fact]
    public void Short_gap_too_long_to_bridge_inside_a_window_is_reported_not_fatal()
    {
        // 5 s of blank outlet-thermocouple cells inside OP1: left open, the samples around it kept, exit 0.
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        for (var row = 6000; row < 6010; row++)
        {
            var cells = lines[row + 1].Split(',');
            cells[7] = "";
            lines[row + 1] = string.Join(',', cells);
        }
        var log = temp.File("gap.csv");
        File.WriteAllLines(log, lines);
        var output = temp.File("out");

        var run = CliRunner.Run("process", SampleDay.Rig, log, SampleDay.Afternoon, "--out", output);

        Assert.Equal(ExitCodes.Success, run.ExitCode);
        var summary = File.ReadAllLines(Path.Combine(output, "summary.csv")).First(l => l.StartsWith("OP1", StringComparison.Ordinal));
        Assert.Contains("gaps 1 (5.5 s)", summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Output_folder_under_a_regular_file_exits_5()
    {
        using var temp = new TempFolder();
        File.WriteAllText(temp.File("blocker"), "a regular file where a folder is needed");

        var run = CliRunner.Run(SampleDay.ProcessArgs(Path.Combine(temp.File("blocker"), "out")));

        Assert.Equal(5, run.ExitCode);
        Assert.Equal(ExitCodes.OutputFailure, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("cannot write the outputs", run.Error, StringComparison.Ordinal);
        Assert.Equal("a regular file where a folder is needed", File.ReadAllText(temp.File("blocker")));
    }

    [Fact]
    public void Unexpected_exception_in_a_command_exits_70_without_a_stack_trace()
    {
        var run = CliRunner.Run(["explode"], (_, _) => [Throwing("explode", new InvalidOperationException("sequence contains no elements"))]);

        Assert.Equal(70, run.ExitCode);
        Assert.Equal(ExitCodes.InternalError, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Contains("error: internal error (InvalidOperationException): sequence contains no elements", run.Error, StringComparison.Ordinal);
        Assert.Contains("please report it", run.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Precondition_violation_in_core_is_an_internal_error_not_bad_data()
    {
        // Mismatched time and value arrays can only come from a bug: exit 70, not 3 ("bad data").
        var run = CliRunner.Run(["bridge"], (_, _) => [Running("bridge", () => GapBridging.Bridge([0, 1], [1, 2, 3], 1))]);

        Assert.Equal(ExitCodes.InternalError, run.ExitCode);
        Assert.Contains("error: internal error (ArgumentException)", run.Error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Data_problem_in_core_keeps_the_bad_data_code()
    {
        // The same function refusing time stamps that do not increase: a data problem, exit 3.
        var run = CliRunner.Run(["bridge"], (_, _) => [Running("bridge", () => GapBridging.Bridge([0, 1, 1], [1, 2, 3], 1))]);

        Assert.Equal(ExitCodes.BadInputData, run.ExitCode);
        Assert.Contains("not after the previous one", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Closed_downstream_pipe_is_not_an_error()
    {
        var run = CliRunner.Run(["write"], (_, _) => [Throwing("write", new IOException("Broken pipe", 32))]);

        Assert.Equal(0, run.ExitCode);
        Assert.Equal("", run.Error);
    }

    [Fact]
    public void Other_output_stream_failure_is_not_mistaken_for_a_closed_pipe()
    {
        var run = CliRunner.Run(["write"], (_, _) => [Throwing("write", new IOException("No space left on device", 28))]);

        Assert.Equal(70, run.ExitCode);
    }

    [Theory]
    [InlineData(FailureKind.Configuration, 2)]
    [InlineData(FailureKind.InputData, 3)]
    [InlineData(FailureKind.NoSteadyPoint, 4)]
    [InlineData(FailureKind.Output, 5)]
    [InlineData((FailureKind)99, 70)]
    public void Each_failure_kind_maps_to_its_documented_code(FailureKind kind, int expected)
    {
        Assert.Equal(expected, ExitCodes.For(kind));
        var run = CliRunner.Run(["fail"], (_, _) => [Throwing("fail", new BcPrepFailure(kind, new SourceLocation("f.csv", 7, 2, "col"), "bad thing"))]);
        Assert.Equal(expected, run.ExitCode);
        Assert.Equal("error: f.csv:7:2: col: bad thing\n", run.Error);
    }

    private static Command Running(string name, Action work)
    {
        var command = new Command(name, "A command that calls into Core, for tests.");
        command.SetAction(_ =>
        {
            work();
            return 0;
        });
        return command;
    }

    private static Command Throwing(string name, Exception exception)
    {
        var command = new Command(name, "A command that fails, for tests.");
        command.SetAction((Func<ParseResult, int>)(_ => throw exception));
        return command;
    }
}
