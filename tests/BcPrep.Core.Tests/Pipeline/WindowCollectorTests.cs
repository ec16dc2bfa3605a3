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

/// <summary>
/// The channels of one logger share a window's times; a channel on another time axis (another logger's, or one
/// that parts from the shared times midway) must still get its own times, equal to the definition.
/// </summary>
public class WindowCollectorSharedTimesTests
{
    [Fact]
    public void Channels_of_one_logger_get_one_shared_times_array_and_their_own_values()
    {
        var times = Enumerable.Range(0, 5000).Select(i => 1_764_000_000.0 + (0.001 * i)).ToArray();
        var window = new TimeWindow("op", times[1000], times[3999]);
        var got = new Dictionary<string, (double[] T, double[] V)>();
        var collector = new WindowCollector([window], (_, c, t, v) => got[c] = (t, v));

        for (var start = 0; start < times.Length; start += 512)
        {
            var count = Math.Min(512, times.Length - start);
            foreach (var channel in new[] { "a", "b", "c" })
            {
                var values = times.Skip(start).Take(count).Select(t => channel[0] + t).ToArray();
                collector.Accept(channel, times.AsSpan(start, count), values);
            }
        }

        Assert.Equal(3000, got["a"].T.Length);
        Assert.Same(got["a"].T, got["b"].T);
        Assert.Same(got["a"].T, got["c"].T);
        Assert.Equal(times.Skip(1000).Take(3000), got["a"].T);
        foreach (var channel in new[] { "a", "b", "c" })
        {
            Assert.Equal(times.Skip(1000).Take(3000).Select(t => channel[0] + t), got[channel].V);
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(37)]
    [InlineData(1000)]
    public void Channels_on_other_time_axes_get_their_own_times(int blockRows)
    {
        // Two loggers: "a" every 0.5 s, "b" every 0.3 s (one logger after the other, as the scan delivers them); and
        // "c", which shares "a"'s times until 120 s and then has a row missing: it parts from the shared times midway.
        var timesA = Enumerable.Range(0, 800).Select(i => 10.0 + (0.5 * i)).ToArray();
        var timesB = Enumerable.Range(0, 1300).Select(i => 10.0 + (0.3 * i)).ToArray();
        var timesC = timesA.Where(t => t != 120.0).ToArray();
        TimeWindow[] windows = [new("w1", 20.0, 200.0), new("w2", 150.0, 300.0)];
        var got = new Dictionary<(string, string), (double[] T, double[] V)>();
        var collector = new WindowCollector(windows, (w, c, t, v) => got[(w.Id, c)] = (t, v));

        void Feed(string channel, double[] times)
        {
            var values = times.Select(t => Math.Cos(t) + channel[0]).ToArray();
            for (var start = 0; start < times.Length; start += blockRows)
            {
                var count = Math.Min(blockRows, times.Length - start);
                collector.Accept(channel, times.AsSpan(start, count), values.AsSpan(start, count));
            }
        }
        // "a" and "c" interleaved block by block, as one logger's channels arrive; then the other logger's "b".
        var valuesA = timesA.Select(t => Math.Cos(t) + 'a').ToArray();
        var valuesC = timesC.Select(t => Math.Cos(t) + 'c').ToArray();
        for (var start = 0; start < timesA.Length; start += blockRows)
        {
            collector.Accept("a", timesA.AsSpan(start, Math.Min(blockRows, timesA.Length - start)), valuesA.AsSpan(start, Math.Min(blockRows, timesA.Length - start)));
            if (start < timesC.Length)
            {
                var count = Math.Min(blockRows, timesC.Length - start);
                collector.Accept("c", timesC.AsSpan(start, count), valuesC.AsSpan(start, count));
            }
        }
        collector.Complete("a");
        collector.Complete("c");
        Feed("b", timesB);
        collector.Complete("b");

        foreach (var window in windows)
        {
            foreach (var (channel, times) in new[] { ("a", timesA), ("b", timesB), ("c", timesC) })
            {
                var inside = times.Where(t => t >= window.StartS && t <= window.EndS).ToArray();
                Assert.Equal(inside, got[(window.Id, channel)].T);
                Assert.Equal(inside.Select(t => Math.Cos(t) + channel[0]), got[(window.Id, channel)].V);
            }
        }
    }
}
