using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>`calibrate` with several loggers (README, "calibrate"): logger after logger, each row with its own cells.</summary>
public sealed class CalibrateLoggersTests
{
    private static string[] Lines(string csv) => csv.Split('\n', StringSplitOptions.RemoveEmptyEntries);

    [Fact]
    public void With_two_loggers_each_row_carries_its_own_channels_and_the_others_are_empty()
    {
        // README ("calibrate"): logger after logger, each row with only its own logger's cells. The morning split by
        // columns into two files (the cold junction goes with its thermocouples): the same numbers in the same cells
        // as the one-file run, every other cell empty.
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Morning);
        var header = lines[0].Split(',');
        string[] second = ["RTD_CJ_OHM", "TC_IN_MV", "TC_OUT_MV", "TC_W1_MV", "TC_W2_MV", "TC_W3_MV", "TC_W4_MV"];
        var toSecond = header.Select((name, i) => i > 0 && second.Contains(name)).ToArray();
        string Keep(string line, bool wantSecond) =>
            string.Join(',', line.Split(',').Where((_, i) => i == 0 || toSecond[i] == wantSecond));
        var a = temp.File("a.csv");
        var b = temp.File("b.csv");
        File.WriteAllLines(a, lines.Select(l => Keep(l, false)));
        File.WriteAllLines(b, lines.Select(l => Keep(l, true)));

        var one = CliRunner.Run("calibrate", SampleDay.Rig, SampleDay.Morning);
        var two = CliRunner.Run("calibrate", SampleDay.Rig, a, b);

        Assert.Equal(0, two.ExitCode);
        var oneRows = Lines(one.Out);
        var twoRows = Lines(two.Out);
        Assert.Equal(oneRows[0], twoRows[0]);
        Assert.Equal(1 + (2 * (oneRows.Length - 1)), twoRows.Length);
        var columns = twoRows[0].Split(',');
        var secondColumns = columns.Select(c => c.StartsWith("t_", StringComparison.Ordinal) && c != "time [s]").ToArray();
        // Which logger comes first is the plan's choice; each half holds one logger's rows in time order.
        var halves = new[] { twoRows.Skip(1).Take(oneRows.Length - 1).ToArray(), twoRows.Skip(oneRows.Length).ToArray() };
        foreach (var half in halves)
        {
            var isSecond = half[0].Split(',')[Array.IndexOf(columns, "t_in [K]")].Length > 0;
            for (var r = 0; r < half.Length; r++)
            {
                var expected = oneRows[r + 1].Split(',');
                var cells = half[r].Split(',');
                Assert.Equal(expected[0], cells[0]);
                for (var c = 1; c < columns.Length; c++)
                {
                    Assert.Equal(secondColumns[c] == isSecond ? expected[c] : "", cells[c]);
                }
            }
        }
    }
}
