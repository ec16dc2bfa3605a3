using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public class WindowCollectorTests
{
    // Reference: the definition of a window's samples, every sample with start ≤ t ≤ end, taken from the whole record
    // at once; the collector sees the record in blocks of varying size and must hand over the same samples.
    [Theory]
    [InlineData(1)]
    [InlineData(7)]
    [InlineData(100)]
    [InlineData(5000)]
    public void Hands_over_exactly_the_samples_inside_each_window_whatever_the_block_size(int blockRows)
    {
        var times = Enumerable.Range(0, 3000).Select(i => 10.0 + (0.5 * i)).ToArray();
        var values = times.Select(t => Math.Sin(t)).ToArray();
        TimeWindow[] windows =
        [
            new("a", 20.0, 60.0),    // edges fall on samples
            new("b", 40.25, 90.75),  // overlaps a, edges between samples
            new("c", 500.0, 500.0),  // a single sample
            new("d", 1000.0, 2000.0), // runs past the record's end
            new("e", 0.0, 5.0),      // before the record
        ];
        var got = new Dictionary<string, (double[] T, double[] V)>();
        var collector = new WindowCollector(windows, (w, _, t, v) => got[w.Id] = (t, v));

        for (var start = 0; start < times.Length; start += blockRows)
        {
            var count = Math.Min(blockRows, times.Length - start);
            collector.Accept("x", times.AsSpan(start, count), values.AsSpan(start, count));
        }
        collector.Complete("x");

        foreach (var window in windows)
        {
            var inside = Enumerable.Range(0, times.Length).Where(i => times[i] >= window.StartS && times[i] <= window.EndS).ToArray();
            Assert.Equal(inside.Select(i => times[i]), got[window.Id].T);
            Assert.Equal(inside.Select(i => values[i]), got[window.Id].V);
        }
    }

    [Fact]
    public void A_window_is_handed_over_as_soon_as_a_later_sample_arrives()
    {
        var handed = new List<string>();
        var collector = new WindowCollector([new TimeWindow("early", 0.0, 1.0), new TimeWindow("late", 5.0, 9.0)], (w, _, _, _) => handed.Add(w.Id));

        collector.Accept("x", [0.0, 0.5, 1.0], [1.0, 2.0, 3.0]);
        Assert.Empty(handed);
        collector.Accept("x", [1.5, 2.0], [4.0, 5.0]);
        Assert.Equal(["early"], handed);
    }

    [Fact]
    public void A_window_for_one_channel_is_neither_filled_nor_handed_over_for_the_others()
    {
        double[] times = [1.0, 2.0, 3.0, 4.0];
        var handed = new List<(string Window, string Channel, int Count)>();
        var collector = new WindowCollector([new TimeWindow("tare:p", 1.5, 3.5), new TimeWindow("op", 1.0, 2.0)],
            (w, c, t, _) => handed.Add((w.Id, c, t.Length)), collects: (w, c) => w.Id != "tare:p" || c == "p");

        foreach (var channel in new[] { "p", "t" })
        {
            collector.Accept(channel, times, times);
            collector.Complete(channel);
        }

        Assert.Equal([("op", "p", 2), ("tare:p", "p", 2), ("op", "t", 2)], handed);
    }
}
