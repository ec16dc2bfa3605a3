using System.Globalization;
using System.Text.Json;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// A stretch where the logger lost rows (a time jump short enough to bridge) while one channel's cells were already
/// empty just before it, so that this channel's gap is longer than <c>max_bridge</c> and stays open while every
/// other channel bridges the jump with inserted samples. README ("Signal conditioning", "calibrate"): gaps up to
/// max_bridge are bridged, a longer gap is left open, and cells that stay missing are written empty. So the
/// conditioned series keep every channel's data: the inserted rows carry the channels that bridged the jump, and the
/// channel whose gap stays open is empty there. Before, <c>calibrate --conditioned</c> and a filtered <c>process</c>
/// stopped with an internal error (exit 70) on such a day.
/// </summary>
public sealed class OpenGapBesideBridgedJumpTests
{
    private static string Sample(string name) => Path.Combine(RepoRoot.Path, "sample-logs", name);

    private static string PinnedRig => Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml");

    /// <summary>
    /// The sample morning (2 Hz) from its start, up to <paramref name="rows"/> rows, without the rows at
    /// <paramref name="jumpS"/> and 0.5 s later (a 1.5 s step: bridged by the default max_bridge of 2 s, two
    /// samples inserted) and with TC_OUT_MV empty in the four rows before them (t_out's gap runs from
    /// jumpS − 2.5 s to jumpS + 1 s: 3.5 s, left open).
    /// </summary>
    private static string Day(TempFolder folder, double jumpS, int rows)
    {
        var lines = File.ReadAllLines(Sample("marten-2026-11-24-am.csv"));
        var header = lines[0].Split(',');
        var tcOut = Array.IndexOf(header, "TC_OUT_MV");
        var kept = new List<string> { lines[0] };
        for (var i = 1; i <= Math.Min(lines.Length - 1, rows); i++)
        {
            var t = (i - 1) * 0.5;
            if (t == jumpS || t == jumpS + 0.5)
            {
                continue;
            }
            var cells = lines[i].Split(',');
            if (t >= jumpS - 2.0 && t < jumpS)
            {
                cells[tcOut] = "";
            }
            kept.Add(string.Join(',', cells));
        }
        var path = folder.File("gap-day.csv");
        File.WriteAllLines(path, kept);
        return path;
    }

    private static string RigWith(TempFolder folder, string conditioning)
    {
        var path = folder.File("rig.toml");
        File.WriteAllText(path, File.ReadAllText(PinnedRig) + "\n[conditioning]\n" + conditioning + "\n");
        return path;
    }

    private static (string[] Header, Dictionary<double, string[]> Rows) Table(string csv)
    {
        var lines = csv.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        var rows = lines.Skip(1).Select(l => l.Split(',')).ToDictionary(c => double.Parse(c[0], CultureInfo.InvariantCulture));
        return (lines[0].Split(','), rows);
    }

    private static double Number(string cell) => double.Parse(cell, CultureInfo.InvariantCulture);

    [Theory]
    [InlineData("")]                           // bridging and Hampel only
    [InlineData("lowpass_cutoff = \"0.1 Hz\"")] // with a low-pass: the channels filtered in the lanes of a vector
    public void Calibrate_conditioned_writes_the_inserted_rows_with_the_open_channel_empty(string conditioning)
    {
        using var folder = new TempFolder();
        var day = Day(folder, 700.0, 2400);
        var rig = RigWith(folder, conditioning);

        var raw = CliRun.Run("calibrate", rig, day);
        var conditioned = CliRun.Run("calibrate", rig, day, "--conditioned", "--verbose");

        Assert.Equal(0, raw.Exit);
        Assert.Equal(0, conditioned.Exit);
        Assert.DoesNotContain("error", conditioned.Error, StringComparison.OrdinalIgnoreCase);
        var (header, rows) = Table(conditioned.Out);
        var (_, rawRows) = Table(raw.Out);
        var tOut = Array.IndexOf(header, "t_out [K]");
        var pIn = Array.IndexOf(header, "p_in [Pa]");
        // Every logged row, plus the two rows the bridged channels inserted into the jump.
        Assert.Equal(rawRows.Count + 2, rows.Count);
        Assert.False(rawRows.ContainsKey(700.0));
        foreach (var t in new[] { 700.0, 700.5 })
        {
            Assert.Equal("", rows[t][tOut]);
            for (var c = 1; c < header.Length; c++)
            {
                if (c != tOut)
                {
                    Assert.True(double.IsFinite(Number(rows[t][c])), $"{header[c]} at {t} s: '{rows[t][c]}'");
                }
            }
        }
        // t_out's own empty cells stay empty, and its samples on both sides of its gap are there.
        foreach (var t in new[] { 698.0, 698.5, 699.0, 699.5 })
        {
            Assert.Equal("", rows[t][tOut]);
        }
        Assert.True(double.IsFinite(Number(rows[697.5][tOut])));
        Assert.True(double.IsFinite(Number(rows[701.0][tOut])));
        Assert.Contains("conditioned 't_out': 0 samples bridged", conditioned.Error, StringComparison.Ordinal);
        Assert.Contains("conditioned 'p_in': 2 samples bridged", conditioned.Error, StringComparison.Ordinal);
        if (conditioning.Length == 0)
        {
            // Without filters the bridged samples lie on the straight line between the jump's two sides, as README
            // states (1/3 and 2/3 of the way from 699.5 s to 701 s; common practice, linear interpolation).
            var before = Number(rows[699.5][pIn]);
            var after = Number(rows[701.0][pIn]);
            Assert.Equal(before + ((after - before) / 3.0), Number(rows[700.0][pIn]), 9);
            Assert.Equal(before + (2.0 * (after - before) / 3.0), Number(rows[700.5][pIn]), 9);
        }
    }

    [Fact]
    public void Calibrate_conditioned_json_writes_null_for_the_open_channel_in_the_inserted_rows()
    {
        using var folder = new TempFolder();
        var day = Day(folder, 700.0, 2400);

        var result = CliRun.Run("calibrate", "--json", "--conditioned", PinnedRig, day);

        Assert.Equal(0, result.Exit);
        var row = result.Out.Split('\n', StringSplitOptions.RemoveEmptyEntries)
            .Select(l => JsonDocument.Parse(l).RootElement)
            .Single(r => r.GetProperty("time [s]").GetDouble() == 700.5);
        Assert.Equal(JsonValueKind.Null, row.GetProperty("t_out [K]").ValueKind);
        Assert.Equal(JsonValueKind.Number, row.GetProperty("t_in [K]").ValueKind);
        Assert.Equal(JsonValueKind.Number, row.GetProperty("p_in [Pa]").ValueKind);
    }

    // process with a low-pass conditions the detection series through the same chain. The point statistics come
    // from the unfiltered samples (README, "Mean and Type A"), so with the windows pinned the results equal those
    // of the run without filters, and the manifest reports each channel's gap as README documents it.
    [Fact]
    public void Process_with_a_lowpass_reduces_the_day_and_reports_the_open_and_the_bridged_gap()
    {
        using var folder = new TempFolder();
        var day = Day(folder, 3300.0, int.MaxValue); // inside OP1's pinned window, 2970–3570 s
        var plainRig = PinnedRig;
        var filteredRig = RigWith(folder, "lowpass_cutoff = \"0.1 Hz\"");
        var plainOut = folder.File("out-plain");
        var filteredOut = folder.File("out-filtered");
        var afternoon = Sample("marten-2026-11-24-pm.csv");

        var plain = CliRun.Run("process", plainRig, day, afternoon, "--out", plainOut);
        var filtered = CliRun.Run("process", filteredRig, day, afternoon, "--out", filteredOut);

        Assert.Equal(0, plain.Exit);
        Assert.True(filtered.Exit == 0, filtered.Error);
        Assert.Equal(
            File.ReadAllLines(Path.Combine(plainOut, "summary.csv")).Where(l => !l.StartsWith('#')),
            File.ReadAllLines(Path.Combine(filteredOut, "summary.csv")).Where(l => !l.StartsWith('#')));
        foreach (var file in Directory.GetFiles(Path.Combine(plainOut, "points"), "*", SearchOption.AllDirectories))
        {
            var other = Path.Combine(filteredOut, Path.GetRelativePath(plainOut, file));
            Assert.True(File.ReadAllBytes(file).SequenceEqual(File.ReadAllBytes(other)), $"{other} differs from the run without filters");
        }
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(filteredOut, "manifest.json")));
        var op1 = manifest.RootElement.GetProperty("points")[0];
        Assert.Equal("OP1", op1.GetProperty("id").GetString());
        JsonElement Conditioning(string id) => op1.GetProperty("channels").EnumerateArray().Single(c => c.GetProperty("id").GetString() == id).GetProperty("conditioning");
        var open = Conditioning("t_out").GetProperty("unbridged_gaps").EnumerateArray().Single();
        Assert.Equal(3297.5, open.GetProperty("start_s").GetDouble());
        Assert.Equal(3301.0, open.GetProperty("end_s").GetDouble());
        Assert.Equal(6, open.GetProperty("missing_samples").GetInt32()); // 4 empty cells and 2 lost rows
        Assert.Empty(Conditioning("t_out").GetProperty("bridged_gaps").EnumerateArray());
        var bridged = Conditioning("p_in").GetProperty("bridged_gaps").EnumerateArray().Single();
        Assert.Equal(3299.5, bridged.GetProperty("start_s").GetDouble());
        Assert.Equal(2, bridged.GetProperty("missing_samples").GetInt32());
    }
}
