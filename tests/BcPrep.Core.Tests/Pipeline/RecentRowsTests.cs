using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public class RecentRowsTests
{
    private static readonly string[] Channels = ["a", "b"];

    /// <summary>Rows at 1 s steps from <paramref name="firstS"/>; channel a reads the time, b its negative.</summary>
    private static void AddBlock(RecentRows rows, double firstS, int count)
    {
        var times = Enumerable.Range(0, count).Select(i => firstS + i).ToArray();
        rows.Add(Channels, times, [times, times.Select(t => -t).ToArray()], count);
    }

    // Reference: the definition of a window's samples, every row with start ≤ t ≤ end, as the window collector
    // gathers them from the log.
    [Fact]
    public void Replays_a_covered_window_and_refuses_one_whose_start_was_dropped()
    {
        var rows = new RecentRows();
        AddBlock(rows, 0, 10);
        AddBlock(rows, 10, 10);
        AddBlock(rows, 20, 10);
        rows.DropBefore(12.0); // drops the block 0–9 s only: its last row is before 12 s

        Assert.False(rows.Covers(new TimeWindow("w", 9.0, 15))); // the row at 9 s was dropped
        Assert.True(rows.Covers(new TimeWindow("w", 9.5, 15)));
        Assert.True(rows.Covers(new TimeWindow("w", 10, 25)));
        Assert.False(rows.Covers(new TimeWindow("w", 20, 29)));  // the row after the end has not come yet
        var gathered = new Dictionary<string, double[]>();
        rows.Replay(new WindowCollector([new TimeWindow("w", 12, 21)], (_, channel, _, values) => gathered[channel] = values));

        Assert.Equal(Enumerable.Range(12, 10).Select(i => (double)i), gathered["a"]);
        Assert.Equal(Enumerable.Range(12, 10).Select(i => -(double)i), gathered["b"]);
        rows.Complete();
        Assert.True(rows.Covers(new TimeWindow("w", 20, 29)));
    }
}
