using System.Globalization;
using System.Text.Json;
using BcPrep.Cli;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>The sample day carries heater-switching spikes on p_in (3000 s, 3001 s, …) and two empty t_out cells at 6000 s.</summary>
public class ConditionedCalibrateTests
{
    private static string Sample(string name) => Path.Combine(RepoRoot.Path, "sample-logs", name);

    // The windows pinned (tests/marten-rig-pinned.toml): the spike the generator plants at 3000 s lies in OP1's pinned window.
    private static string[] DayArgs => [Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"), Sample("marten-2026-11-24-am.csv"), Sample("marten-2026-11-24-pm.csv")];

    private static (int Code, string Out, string Error) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = BcPrepApp.Run(args, new CliContext(output, error, () => Stream.Null, false, RepoRoot.Path));
        return (code, output.ToString(), error.ToString());
    }

    private static Dictionary<double, string[]> Rows(string csv) =>
        csv.Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(1)
            .Select(l => l.Split(','))
            .ToDictionary(c => double.Parse(c[0], CultureInfo.InvariantCulture));

    [Fact]
    public void Conditioned_series_replaces_the_spikes_and_bridges_the_dropout()
    {
        var raw = Run(["calibrate", .. DayArgs]);
        var conditioned = Run(["calibrate", .. DayArgs, "--conditioned", "--verbose"]);
        Assert.Equal(0, raw.Code);
        Assert.Equal(0, conditioned.Code);
        var header = raw.Out[..raw.Out.IndexOf('\n', StringComparison.Ordinal)].Split(',');
        var pIn = Array.IndexOf(header, "p_in [Pa]");
        var tOut = Array.IndexOf(header, "t_out [K]");
        var rawRows = Rows(raw.Out);
        var rows = Rows(conditioned.Out);
        Assert.Equal(rawRows.Count, rows.Count);

        double Value(Dictionary<double, string[]> r, double t, int column) => double.Parse(r[t][column], CultureInfo.InvariantCulture);
        // The spike is 0.3 V = 150 Pa off its neighbours in the raw series, and gone in the conditioned one.
        Assert.InRange(Math.Abs(Value(rawRows, 3000.0, pIn) - Value(rawRows, 2999.0, pIn)), 120.0, 180.0);
        Assert.InRange(Math.Abs(Value(rows, 3000.0, pIn) - Value(rows, 2999.0, pIn)), 0.0, 10.0);
        // The empty cells are empty in the raw series and bridged on the line between their neighbours.
        Assert.Equal("", rawRows[6000.0][tOut]);
        var expected = Value(rows, 5999.5, tOut) + ((Value(rows, 6001.0, tOut) - Value(rows, 5999.5, tOut)) / 3.0);
        Assert.Equal(expected, Value(rows, 6000.0, tOut), 9);
        Assert.Contains("conditioned 't_out': 2 samples bridged", conditioned.Error, StringComparison.Ordinal);
        Assert.Contains("no mains notch", conditioned.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Process_reports_the_spikes_and_the_bridged_cells_in_manifest_and_summary()
    {
        var dir = Path.Combine(Path.GetTempPath(), "bcprep-conditioning-" + Guid.NewGuid().ToString("N"));
        try
        {
            var result = Run(["process", .. DayArgs, "--out", dir]);
            Assert.Equal(0, result.Code);
            using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "manifest.json")));
            var points = manifest.RootElement.GetProperty("points");
            JsonElement Channel(int point, string id) => points[point].GetProperty("channels").EnumerateArray().Single(c => c.GetProperty("id").GetString() == id).GetProperty("conditioning");

            var spikes = Channel(0, "p_in").GetProperty("first_spike_times_s").EnumerateArray().Select(e => e.GetDouble()).ToList();
            Assert.Contains(3000.0, spikes);
            Assert.Contains(3001.0, spikes);
            Assert.Contains(3210.5, spikes);
            var gap = Channel(1, "t_out").GetProperty("bridged_gaps").EnumerateArray().Single();
            Assert.Equal(5999.5, gap.GetProperty("start_s").GetDouble());
            Assert.Equal(2, gap.GetProperty("missing_samples").GetInt32());
            Assert.Equal("none", manifest.RootElement.GetProperty("conventions").GetProperty("conditioning").GetProperty("mains_hz").ValueKind == JsonValueKind.Null ? "none" : "set");

            var summary = File.ReadAllLines(Path.Combine(dir, "summary.csv")).Where(l => !l.StartsWith('#')).ToList();
            Assert.EndsWith(",conditioning", summary[0], StringComparison.Ordinal);
            Assert.Matches(@"^OP2,.*,bridged 2; spikes \d+; faults 0$", summary[2]);
        }
        finally
        {
            if (Directory.Exists(dir))
            {
                Directory.Delete(dir, true);
            }
        }
    }
}
