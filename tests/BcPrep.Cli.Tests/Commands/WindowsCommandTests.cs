using System.Globalization;
using System.Text.Json;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// The windows command and the per-point override in process, on the bundled sample day (tools/SampleDay: set-point
/// changes at 10, 60 and 110 min, fan off before 10 min, day ends at 165 min).
/// </summary>
public class WindowsCommandTests
{
    private static string[] Args(string command, string rig, params string[] rest) => [command, rig, .. DetectionScratch.SampleLogs, .. rest];

    private static List<Dictionary<string, string>> ParseCsv(string text)
    {
        var lines = text.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var header = SplitCsv(lines[0]);
        return lines.Skip(1).Select(l => header.Zip(SplitCsv(l)).ToDictionary(p => p.First, p => p.Second)).ToList();
    }

    private static List<string> SplitCsv(string line)
    {
        var cells = new List<string>();
        var cell = new System.Text.StringBuilder();
        var quoted = false;
        for (var i = 0; i < line.Length; i++)
        {
            var c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"')
                {
                    cell.Append('"');
                    i++;
                }
                else if (c == '"')
                {
                    quoted = false;
                }
                else
                {
                    cell.Append(c);
                }
            }
            else if (c == '"')
            {
                quoted = true;
            }
            else if (c == ',')
            {
                cells.Add(cell.ToString());
                cell.Clear();
            }
            else
            {
                cell.Append(c);
            }
        }
        cells.Add(cell.ToString());
        return cells;
    }

    private static double Number(Dictionary<string, string> row, string column) => double.Parse(row[column], CultureInfo.InvariantCulture);

    [Fact]
    public void Windows_on_the_sample_day_prints_three_accepted_points_with_units_and_evidence()
    {
        using var scratch = new DetectionScratch();
        var (exit, output, error) = CliRun.Run(Args("windows", scratch.RigWithPoints()));

        Assert.Equal(0, exit);
        Assert.Equal("", error);
        var header = output.Split('\n')[0];
        Assert.StartsWith("point,status,origin,start [s],end [s],duration [s],", header, StringComparison.Ordinal);
        Assert.Contains("t_out slope [K/s],t_out slope u [K/s],t_out drift limit [K/s]", header, StringComparison.Ordinal);
        Assert.Contains("mdot mean [kg/s]", header, StringComparison.Ordinal);
        var rows = ParseCsv(output);
        Assert.Equal(["OP1", "OP2", "OP3"], rows.Select(r => r["point"]));
        double[] changeS = [600, 3600, 6600];
        double[] nextS = [3600, 6600, 9900];
        for (var k = 0; k < 3; k++)
        {
            var row = rows[k];
            Assert.Equal("accepted", row["status"]);
            Assert.Equal("detected", row["origin"]);
            Assert.Contains("settling", row["accepted by"], StringComparison.Ordinal);
            // From the settled moment (at least two wall time constants of 480 s after the change; the steps are
            // several kelvin against a 0.4 K tolerance) to the next change, less the block that holds it.
            Assert.True(Number(row, "duration [s]") >= 300.0);
            Assert.InRange(Number(row, "start [s]"), changeS[k] + 960, nextS[k]);
            Assert.InRange(Number(row, "end [s]"), nextS[k] - 5, nextS[k]);
            // Settled, not merely slow: every key's predicted remaining change (|slope|·τ) within its tolerance.
            foreach (var (key, unit) in new[] { ("mdot", "kg/s"), ("t_out", "K"), ("t_w3", "K") })
            {
                Assert.True(Number(row, $"{key} remaining change [{unit}]") <= Number(row, $"{key} tolerance [{unit}]"), $"{key} in {row["point"]}");
                Assert.True(Number(row, $"{key} tau [s]") > 0);
            }
        }
        // Set points of the generator: 0.020, 0.030, 0.040 kg/s (flow meter 1 % of reading, so 0.5 % is generous).
        Assert.Equal(0.020, Number(rows[0], "mdot mean [kg/s]"), 0.0001);
        Assert.Equal(0.030, Number(rows[1], "mdot mean [kg/s]"), 0.00015);
        Assert.Equal(0.040, Number(rows[2], "mdot mean [kg/s]"), 0.0002);
    }

    [Fact]
    public void Windows_all_adds_the_rejected_stretches_with_their_reasons_in_time_order()
    {
        using var scratch = new DetectionScratch();
        var (exit, output, _) = CliRun.Run(Args("windows", scratch.RigWithPoints(), "--all"));

        Assert.Equal(0, exit);
        var rows = ParseCsv(output);
        Assert.Equal(3, rows.Count(r => r["status"] == "accepted"));
        var rejected = rows.Where(r => r["status"] == "rejected").ToList();
        Assert.NotEmpty(rejected);
        Assert.All(rejected, r => Assert.NotEqual("", r["reason"]));
        // The fan-off start and the first transient form the first rejected stretch, from the start of the day.
        Assert.Equal("rejected", rows[0]["status"]);
        Assert.True(Number(rows[0], "stretch start [s]") < 10);
        var starts = rows.Select(r => Number(r, "stretch start [s]")).ToList();
        Assert.Equal(starts.Order().ToList(), starts);
    }

    [Fact]
    public void Windows_on_a_day_that_only_drifts_exits_4_and_names_channel_criterion_and_values()
    {
        using var scratch = new DetectionScratch();
        var (exit, output, error) = CliRun.Run("windows", scratch.RigWithPoints(), scratch.DriftingLog());

        Assert.Equal(4, exit); // README "Exit codes": no steady operating point
        Assert.Equal("", output);
        Assert.Contains("no steady operating point found", error, StringComparison.Ordinal);
        // The outlet emf rises 0.02 mV/min, about 0.5 K/min all day: a ramp, never settled. The rejection names
        // the channel, its predicted remaining change and the tolerance (max_change = 0.3 K).
        var line = error.Split('\n').First(l => l.Contains("t_out: predicted remaining change", StringComparison.Ordinal));
        Assert.Contains("> tolerance 0.3", line, StringComparison.Ordinal);
        Assert.Contains(" s", line, StringComparison.Ordinal);
        Assert.DoesNotContain("mdot:", line, StringComparison.Ordinal);
    }

    [Fact]
    public void Process_replaces_only_the_detected_point_that_a_pinned_window_overlaps()
    {
        using var scratch = new DetectionScratch();
        var rig = scratch.RigWithPoints(("warm", "100 min", "108 min"));
        var outDir = Path.Combine(scratch.Root, "out");

        var (exit, _, error) = CliRun.Run(Args("process", rig, "--out", outDir));

        Assert.True(exit == 0, error);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        var points = manifest.RootElement.GetProperty("points").EnumerateArray().ToList();
        Assert.Equal(["OP1", "warm", "OP2"], points.Select(p => p.GetProperty("id").GetString()));
        Assert.Equal(["detected", "rig file", "detected"], points.Select(p => p.GetProperty("window_origin").GetString()));
        Assert.Equal(6000.0, points[1].GetProperty("window").GetProperty("start_s").GetDouble(), 6);
        Assert.Equal(6480.0, points[1].GetProperty("window").GetProperty("end_s").GetDouble(), 6);
        // Evidence: the pinned point names the detected window it replaced; a detected point carries its criteria.
        var replaced = Assert.Single(points[1].GetProperty("detection").GetProperty("windows").EnumerateArray());
        Assert.InRange(replaced.GetProperty("end_s").GetDouble(), 6300, 6600);
        var op1 = Assert.Single(points[0].GetProperty("detection").GetProperty("windows").EnumerateArray());
        Assert.Contains("drift-scatter", op1.GetProperty("accepted_by").GetString(), StringComparison.Ordinal);
        var tOut = op1.GetProperty("channels").EnumerateArray().Single(c => c.GetProperty("id").GetString() == "t_out");
        Assert.True(tOut.GetProperty("slope_standard_uncertainty_per_s").GetDouble() > 0);
        Assert.Equal(0.3 / 300, tOut.GetProperty("drift_limit_per_s").GetDouble(), 12);
        var day = manifest.RootElement.GetProperty("detection");
        Assert.Equal(3, day.GetProperty("accepted_windows").GetInt32());
        Assert.NotEmpty(day.GetProperty("rejected").EnumerateArray());
    }

    [Fact]
    public void Process_with_the_pinned_copy_of_the_sample_rig_keeps_its_three_pinned_points()
    {
        // tests/marten-rig-pinned.toml: the sample rig with the three windows it pinned before it relied on detection.
        using var scratch = new DetectionScratch();
        var outDir = Path.Combine(scratch.Root, "out");

        var (exit, _, error) = CliRun.Run(Args("process", Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), "--out", outDir));

        Assert.True(exit == 0, error);
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "manifest.json")));
        var points = manifest.RootElement.GetProperty("points").EnumerateArray().ToList();
        Assert.Equal(["OP1", "OP2", "OP3"], points.Select(p => p.GetProperty("id").GetString()));
        Assert.All(points, p => Assert.Equal("rig file", p.GetProperty("window_origin").GetString()));
        Assert.Equal(49.5 * 60.0, points[0].GetProperty("window").GetProperty("start_s").GetDouble(), 6);
        Assert.All(points, p => Assert.Single(p.GetProperty("detection").GetProperty("windows").EnumerateArray()));
    }
}
