using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public class GatheredWindowCollectionTests
{
    // Common practice (the collector's large-object garbage, no standard): once the last channel of a long gathered
    // window is done, its times array is let go and a full collection frees it at once, rather than when the
    // collector's large-object budget runs out. Only the count of full collections is checked: it must grow.
    [Fact]
    public void The_last_channel_of_a_long_window_is_followed_by_a_full_collection()
    {
        var count = GatheredWindow.CollectFrom;
        var times = Enumerable.Range(0, count).Select(i => i * 1e-3).ToArray();
        var rows = new RecentRows();
        rows.Add(["a", "b"], times, [times, times], count);
        rows.Complete();
        var window = rows.Gather(new TimeWindow("w", times[0], times[^1]));
        Assert.Equal(count, window.Count);
        var a = window.Channels[0].Reduce((t, v) => v.Length);
        var before = GC.CollectionCount(2);

        var b = window.Channels[1].Reduce((t, v) => v.Length);

        Assert.Equal(count, a);
        Assert.Equal(count, b);
        Assert.True(GC.CollectionCount(2) > before, "no full collection after the window's last channel");
    }
}
