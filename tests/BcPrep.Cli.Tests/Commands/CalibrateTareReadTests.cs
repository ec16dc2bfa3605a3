using System.Globalization;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// `calibrate` reads a day with tares first only up to the end of its last tare interval (README, "calibrate
/// streams"): the tares must still be the means over their whole intervals, a refusal in that first stretch leaves
/// standard output empty, and one past it follows the rows already written, the same rows on every run. The sample
/// morning is 9600 rows at 2 Hz, read in blocks of 8192 rows (4096 s); its tares are at 2–9 min.
/// </summary>
public sealed class CalibrateTareReadTests
{
    private const string SampleTare = "tare = { from = \"2 min\", to = \"9 min\" }";

    private static string RigText => File.ReadAllText(SampleDay.Rig);

    private static string[] Lines(string csv) => csv.Split('\n', StringSplitOptions.RemoveEmptyEntries);

    private static string WithCell(string[] lines, int line, string column, string value)
    {
        var copy = (string[])lines.Clone();
        var header = copy[0].Split(',');
        var cells = copy[line - 1].Split(',');
        cells[Array.IndexOf(header, column)] = value;
        copy[line - 1] = string.Join(',', cells);
        return string.Join('\n', copy) + "\n";
    }

    [Fact]
    public void A_tare_interval_that_runs_into_the_second_block_is_averaged_whole()
    {
        // Tare at 3600–4200 s: the first block ends at 4095.5 s, so the first read must go on into the second. The
        // last 50 s of the interval are raised by 0.2 V (100 Pa at 500 Pa/V), a step that Hampel keeps (100 rows),
        // so the tare is about 100 · 100/1201 = 8.3 Pa above a mean that stopped at the first block's end.
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        var header = lines[0].Split(',');
        var pInColumn = Array.IndexOf(header, "PT_IN_V");
        for (var i = 1; i < lines.Length; i++)
        {
            var t = (i - 1) * 0.5;
            if (t >= 4150.0 && t <= 4200.0)
            {
                var cells = lines[i].Split(',');
                cells[pInColumn] = (double.Parse(cells[pInColumn], CultureInfo.InvariantCulture) + 0.2).ToString("R", CultureInfo.InvariantCulture);
                lines[i] = string.Join(',', cells);
            }
        }
        var day = temp.File("day.csv");
        File.WriteAllText(day, string.Join('\n', lines) + "\n");
        var tared = temp.File("tared.toml");
        File.WriteAllText(tared, RigText.Replace(SampleTare, "tare = { from = \"60 min\", to = \"70 min\" }", StringComparison.Ordinal));
        var untared = temp.File("untared.toml");
        File.WriteAllText(untared, RigText.Replace(SampleTare, "", StringComparison.Ordinal));

        var withTare = CliRunner.Run("calibrate", tared, day);
        var withoutTare = CliRunner.Run("calibrate", untared, day);

        Assert.Equal(0, withTare.ExitCode);
        Assert.Equal(0, withoutTare.ExitCode);
        var tareRows = Lines(withTare.Out);
        var rawRows = Lines(withoutTare.Out);
        var pIn = Array.IndexOf(tareRows[0].Split(','), "p_in [Pa]");
        double Cell(string row, int column) => double.Parse(row.Split(',')[column], CultureInfo.InvariantCulture);
        // The plain mean of the interval's untared values (no spikes or gaps there; Hampel's replacements of noise
        // outliers move the mean by far less than 0.05 Pa).
        var inInterval = rawRows.Skip(1).Where(r => Cell(r, 0) >= 3600.0 && Cell(r, 0) <= 4200.0).Select(r => Cell(r, pIn)).ToList();
        Assert.Equal(1201, inInterval.Count);
        var expectedTare = inInterval.Average();
        var tare = Cell(rawRows[1], pIn) - Cell(tareRows[1], pIn);
        Assert.InRange(tare, expectedTare - 0.05, expectedTare + 0.05);
        Assert.InRange(Cell(rawRows[9000], pIn) - Cell(tareRows[9000], pIn), tare - 1e-9, tare + 1e-9);
    }

    [Fact]
    public void A_bad_cell_past_the_tare_stretch_follows_the_rows_of_the_blocks_before_it_on_every_run()
    {
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        var clean = CliRunner.Run("calibrate", SampleDay.Rig, SampleDay.Morning);
        var day = temp.File("day.csv");
        // Line 9000 is in the second block (lines 8194–9601), past the first read, which ends with the first block.
        File.WriteAllText(day, WithCell(lines, 9000, "TC_W1_MV", "0.1x"));

        for (var run = 0; run < 3; run++)
        {
            var bad = CliRunner.Run("calibrate", SampleDay.Rig, day);

            Assert.Equal(3, bad.ExitCode);
            Assert.Contains("day.csv:9000:", bad.Error, StringComparison.Ordinal);
            Assert.Contains("'0.1x' is not a number", bad.Error, StringComparison.Ordinal);
            // The header and the first block's 8192 rows, as the clean day writes them, and nothing after.
            Assert.Equal(string.Join('\n', Lines(clean.Out).Take(1 + 8192)) + "\n", bad.Out);
        }
    }

    [Fact]
    public void A_bad_cell_in_the_tare_stretch_leaves_standard_output_empty()
    {
        // Line 5000 (2499.5 s) is past the tares' end but in the block that holds it, which the first read reads
        // whole, every column; TC_W1_MV is no tared channel.
        using var temp = new TempFolder();
        var day = temp.File("day.csv");
        File.WriteAllText(day, WithCell(File.ReadAllLines(SampleDay.Morning), 5000, "TC_W1_MV", "0.1x"));

        var bad = CliRunner.Run("calibrate", "--conditioned", SampleDay.Rig, day);

        Assert.Equal(3, bad.ExitCode);
        Assert.Contains("day.csv:5000:", bad.Error, StringComparison.Ordinal);
        Assert.Equal("", bad.Out);
    }

    [Fact]
    public void A_tare_refused_before_a_bad_cell_further_in_the_first_read_is_the_refusal_reported()
    {
        // p_in's tare (2–9 min) has no samples: its window is complete within the first block. p_out's tare moves to
        // 60–70 min, so the first read goes on into the second block, where line 9000 holds a bad cell. The tare
        // statistics run beside the read; the refusal of the window completed first must still be the one reported,
        // on every run, as when each window was evaluated on the reading thread before the read went on.
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        for (var line = 2; line <= lines.Length; line++)
        {
            var t = (line - 2) * 0.5;
            if (t >= 100.0 && t <= 560.0)
            {
                lines = WithCell(lines, line, "PT_IN_V", "").Split('\n')[..lines.Length];
            }
        }
        var day = temp.File("day.csv");
        File.WriteAllText(day, WithCell(lines, 9000, "TC_W1_MV", "0.1x"));
        var rig = temp.File("rig.toml");
        var text = RigText;
        var second = text.LastIndexOf(SampleTare, StringComparison.Ordinal);
        Assert.True(second > text.IndexOf(SampleTare, StringComparison.Ordinal));
        File.WriteAllText(rig, text[..second] + "tare = { from = \"60 min\", to = \"70 min\" }" + text[(second + SampleTare.Length)..]);

        for (var run = 0; run < 3; run++)
        {
            var bad = CliRunner.Run("calibrate", "--conditioned", rig, day);

            Assert.Equal(3, bad.ExitCode);
            Assert.Contains("the tare interval of 'p_in' holds no samples", bad.Error, StringComparison.Ordinal);
            Assert.DoesNotContain("0.1x", bad.Error, StringComparison.Ordinal);
            Assert.Equal("", bad.Out);
        }
    }

    // The first read stops at the first block whose last time reaches the last tare's end. A clock that then steps
    // back into the tare interval would put tare samples after that block, where the first read does not look; but
    // every such day is refused where the clock steps back (times must increase within a file, and a file may not
    // start before the previous one ends), so no day that is accepted loses tare samples. What such a refusal leaves
    // is the rows before it, with the tare of the whole interval (the clean day's rows, bit for bit), and exit code 3.
    [Fact]
    public void A_clock_stepping_back_into_the_tare_interval_after_the_first_read_is_refused_with_the_tare_of_the_whole_interval()
    {
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        var clean = Lines(CliRunner.Run("calibrate", SampleDay.Rig, SampleDay.Morning).Out);
        // Line 9000 (second block) stamped 300 s after the start: inside the 2–9 min tares.
        var day = temp.File("day.csv");
        File.WriteAllText(day, WithCell(lines, 9000, "timestamp", "2026-11-24T09:05:00.000"));

        var stepped = CliRunner.Run("calibrate", SampleDay.Rig, day);

        Assert.Equal(3, stepped.ExitCode);
        Assert.Contains("day.csv:9000:", stepped.Error, StringComparison.Ordinal);
        Assert.Contains("goes back from", stepped.Error, StringComparison.Ordinal);
        Assert.Equal(string.Join('\n', clean.Take(1 + 8192)) + "\n", stepped.Out);
    }

    [Fact]
    public void A_second_file_starting_back_inside_the_tare_interval_is_refused_with_the_tare_of_the_whole_interval()
    {
        // The first file holds 0–749.5 s (one block, past the tares' end at 540 s: the first read stops there); the
        // second starts again at 300 s, inside the tare interval.
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        var clean = Lines(CliRunner.Run("calibrate", SampleDay.Rig, SampleDay.Morning).Out);
        var first = temp.File("first.csv");
        File.WriteAllLines(first, lines.Take(1 + 1500));
        var second = temp.File("second.csv");
        File.WriteAllLines(second, lines.Take(1).Concat(lines.Skip(1 + 600).Take(2400)));

        var stepped = CliRunner.Run("calibrate", SampleDay.Rig, first, second);

        Assert.Equal(3, stepped.ExitCode);
        Assert.Contains("second.csv:2:", stepped.Error, StringComparison.Ordinal);
        Assert.Contains("the files overlap in time", stepped.Error, StringComparison.Ordinal);
        Assert.Equal(string.Join('\n', clean.Take(1 + 1500)) + "\n", stepped.Out);
    }
}
