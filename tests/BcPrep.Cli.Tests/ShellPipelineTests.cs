using System.Text.Json;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>The built binary in real bash pipelines and a solver pre-run hook script.</summary>
public sealed class ShellPipelineTests
{
    private static readonly TimeSpan Timeout = TimeSpan.FromMinutes(3);

    [Fact]
    public void Calibrate_from_standard_input_into_head_exits_0_with_three_lines_and_no_complaint()
    {
        var script = $"bcprep calibrate {BuiltBinary.Quote(SampleDay.Rig)} - < {BuiltBinary.Quote(SampleDay.Morning)} 2>err.txt | head -3\n" +
                     "status=${PIPESTATUS[0]}\ncat err.txt >&2\nexit $status";
        using var temp = new TempFolder();

        var (code, output, error) = BuiltBinary.Bash($"cd {BuiltBinary.Quote(temp.Path)}\n" + script, Timeout);

        Assert.Equal(0, code);
        Assert.Equal("", error);
        var lines = output.TrimEnd('\n').Split('\n');
        Assert.Equal(3, lines.Length);
        Assert.StartsWith("time [s],p_baro [Pa],p_in [Pa],", lines[0], StringComparison.Ordinal);
        Assert.StartsWith("0,", lines[1], StringComparison.Ordinal);
        Assert.StartsWith("0.5,", lines[2], StringComparison.Ordinal);
    }

    [Fact]
    public void Calibrate_into_wc_counts_a_header_and_one_line_per_logged_row()
    {
        var script = $"set -o pipefail\nbcprep calibrate {BuiltBinary.Quote(SampleDay.Rig)} {BuiltBinary.Quote(SampleDay.Morning)} | wc -l";

        var (code, output, error) = BuiltBinary.Bash(script, Timeout);

        Assert.Equal(0, code);
        Assert.Equal("", error);
        Assert.Equal(File.ReadAllLines(SampleDay.Morning).Length, int.Parse(output.Trim(), System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Calibrate_json_lines_feed_a_line_oriented_consumer()
    {
        var script = $"set -o pipefail\nbcprep calibrate --json {BuiltBinary.Quote(SampleDay.Rig)} {BuiltBinary.Quote(SampleDay.Morning)} | tail -1";

        var (code, output, _) = BuiltBinary.Bash(script, Timeout);

        Assert.Equal(0, code);
        using var last = JsonDocument.Parse(output);
        Assert.Equal(4799.5, last.RootElement.GetProperty("time [s]").GetDouble());
    }

    [Fact]
    public void Pre_run_hook_calling_process_twice_sees_the_second_call_skip()
    {
        using var temp = new TempFolder();
        var hook = temp.File("pre-run-hook.sh");
        File.WriteAllText(hook,
            "#!/bin/bash\n" +
            "# A solver pre-run hook: bring the boundary conditions up to date, stop the run if that fails.\n" +
            "set -euo pipefail\n" +
            $"bcprep process {BuiltBinary.Quote(SampleDay.Rig)} {string.Join(' ', SampleDay.Logs.Select(BuiltBinary.Quote))} --out bc 2> first.txt\n" +
            $"bcprep process {BuiltBinary.Quote(SampleDay.Rig)} {string.Join(' ', SampleDay.Logs.Select(BuiltBinary.Quote))} --out bc 2> second.txt\n" +
            "echo \"first: $(cat first.txt)\"\necho \"second: $(cat second.txt)\"\n");

        var (code, output, error) = BuiltBinary.Bash($"cd {BuiltBinary.Quote(temp.Path)}\nsource {BuiltBinary.Quote(hook)}", Timeout);

        Assert.True(code == 0, error);
        Assert.Contains("first: \n", output, StringComparison.Ordinal);
        Assert.Contains("second: bc: up to date (inputs, rig file and tool version unchanged); nothing to do.", output, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(temp.Path, "bc", "manifest.json")));
    }

    [Fact]
    public void Usage_error_in_a_pipeline_exits_2_with_an_empty_data_stream()
    {
        var (code, output, error) = BuiltBinary.Bash("bcprep calibrate --bogus | wc -c; exit ${PIPESTATUS[0]}", Timeout);

        Assert.Equal(2, code);
        Assert.Equal("0", output.Trim());
        Assert.StartsWith("error: ", error, StringComparison.Ordinal);
    }
}
