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

    // Common practice: once the day's last windows are gathered, nothing kept may outlive the read.
    [Fact]
    public void Release_lets_go_of_every_kept_row()
    {
        var rows = new RecentRows();
        AddBlock(rows, 0, 10);
        AddBlock(rows, 10, 10);
        rows.Complete();
        Assert.True(rows.Covers(new TimeWindow("w", 2, 15)));

        rows.Release();

        Assert.False(rows.Covers(new TimeWindow("w", 2, 15)));
        Assert.False(rows.Covers(new TimeWindow("w", 19, 19)));
    }

    // Reference: the window collector, which gathers every row with start ≤ t ≤ end from the log block by block.
    [Fact]
    public void Gathers_a_covered_window_as_the_collector_would_and_refuses_one_whose_start_was_dropped()
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
        foreach (var window in new[] { new TimeWindow("w", 12, 21), new TimeWindow("w", 12.5, 12.7), new TimeWindow("w", 19.5, 29) })
        {
            var gathered = new Dictionary<string, (double[] T, double[] V)>();
            rows.Gather(window, (channel, times, values) => gathered[channel] = (times, values));
            var expected = new Dictionary<string, (double[] T, double[] V)>();
            var collector = new WindowCollector([window], (_, channel, times, values) => expected[channel] = (times, values));
            for (var start = 10.0; start < 30.0; start += 10.0)
            {
                var times = Enumerable.Range(0, 10).Select(i => start + i).ToArray();
                collector.Accept("a", times, times);
                collector.Accept("b", times, times.Select(t => -t).ToArray());
            }
            collector.Complete("a");
            collector.Complete("b");

            Assert.Equal(expected["a"].T, gathered["a"].T);
            Assert.Equal(expected["a"].V, gathered["a"].V);
            Assert.Equal(expected["b"].V, gathered["b"].V);
        }
        rows.Complete();
        Assert.True(rows.Covers(new TimeWindow("w", 20, 29)));
    }

    // Common practice (a memory budget, no standard): beyond its budget of values the oldest blocks go first, and a
    // window that starts in them is no longer covered, so it is read again instead of gathered with rows missing.
    [Fact]
    public void Beyond_its_budget_the_oldest_blocks_are_dropped_and_windows_in_them_refused()
    {
        var rows = new RecentRows(maxKeptValues: 75); // 10 rows × (time + 2 channels) = 30 values a block: two blocks fit
        AddBlock(rows, 0, 10);
        AddBlock(rows, 10, 10);
        Assert.True(rows.Covers(new TimeWindow("w", 0, 15)));

        AddBlock(rows, 20, 10);

        Assert.False(rows.Covers(new TimeWindow("w", 0, 15)));
        Assert.False(rows.Covers(new TimeWindow("w", 9, 15)));
        Assert.True(rows.Covers(new TimeWindow("w", 9.5, 25)));
    }
}
