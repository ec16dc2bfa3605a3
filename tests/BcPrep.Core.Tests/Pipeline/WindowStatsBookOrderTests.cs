using System.Collections.Concurrent;
using BcPrep.Conditioning;
using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// A window's channels handed in together start costliest first (by what each took last time), but what is filed and
/// which failure is reported follow the order they were handed in, as if each had been added alone.
/// </summary>
public class WindowStatsBookOrderTests
{
    // The costly channel comes last, so that starting in hand-in order would start it last.
    private static readonly string[] Channels = ["p_in", "t_w1", "mdot", "heater_v", "t_w4"];

    [Fact]
    public void Channels_never_reduced_start_in_the_order_given()
    {
        Assert.Equal([0, 1, 2, 3, 4], WindowStatsBook.StartOrder(Channels, new Dictionary<string, long>()));
    }

    [Fact]
    public void Known_channels_start_longest_first_after_the_unknown_ones_with_ties_in_the_order_given()
    {
        var lastTicks = new Dictionary<string, long> { ["p_in"] = 10, ["t_w1"] = 500, ["mdot"] = 10, ["t_w4"] = 800 };

        // heater_v is unknown (first); then t_w4 800, t_w1 500, and the tie p_in/mdot in their given order.
        Assert.Equal([3, 4, 1, 0, 2], WindowStatsBook.StartOrder(Channels, lastTicks));
    }

    [Fact]
    public void Every_index_appears_once_whatever_the_costs()
    {
        var lastTicks = new Dictionary<string, long> { ["p_in"] = 3, ["t_w1"] = 3, ["mdot"] = 7, ["t_w4"] = 1, ["heater_v"] = 7 };

        var order = WindowStatsBook.StartOrder(Channels, lastTicks);

        Assert.Equal(Channels.Length, order.Length);
        Assert.Equal([0, 1, 2, 3, 4], order.Order());
    }

    [Fact]
    public void A_second_window_starts_its_costliest_channel_first_and_files_every_channel_once_in_hand_in_order()
    {
        var book = new WindowStatsBook();
        var first = new TimeWindow("OP1", 0.0, 10.0);
        var second = new TimeWindow("OP2", 20.0, 30.0);
        var evaluations = new ConcurrentDictionary<(string Window, string Channel), int>();
        var started = new ConcurrentQueue<string>();

        // The first window teaches the book that t_w4 is by far the costliest channel.
        book.AddAll(first, Work(first, evaluations, started, slow: "t_w4"));
        var stats = new Dictionary<string, Dictionary<string, ChannelWindowStats>>(StringComparer.Ordinal);
        book.DrainInto(stats);

        // The channels that start first hold their threads until every thread holds one: those are the first ones
        // taken from the queue. (On a machine with as many threads as channels, all start at once and this cannot tell.)
        using var gate = new ManualResetEventSlim(false);
        started.Clear();
        book.AddAll(second, Work(second, evaluations, started, slow: null, gate));
        var holding = Math.Min(StatisticsWorkers.Threads, Channels.Length);
        Assert.True(SpinWait.SpinUntil(() => started.Count >= holding, TimeSpan.FromSeconds(60)), "the statistics threads did not take the channels");
        var firstStarted = started.Take(holding).ToList();
        gate.Set();
        book.DrainInto(stats);

        Assert.Contains("t_w4", firstStarted);
        foreach (var window in new[] { first, second })
        {
            // Filed in the order handed in (a dictionary keeps insertion order), each channel evaluated exactly once.
            Assert.Equal(Channels, stats[window.Id].Keys);
            foreach (var channel in Channels)
            {
                Assert.Equal(1, evaluations[(window.Id, channel)]);
                Assert.Equal(Expected(window, channel).Mean, stats[window.Id][channel].Mean);
                Assert.Equal(window.Id, stats[window.Id][channel].Window);
            }
        }
    }

    [Fact]
    public void The_failure_reported_is_the_first_in_hand_in_order_although_it_started_last()
    {
        var book = new WindowStatsBook();
        var warmUp = new TimeWindow("OP1", 0.0, 10.0);
        book.AddAll(warmUp, Work(warmUp, new(), new(), slow: "t_w4"));
        book.DrainInto([]);

        // p_in (handed in first, cheap last time: starts late) and t_w4 (starts first) both fail.
        var window = new TimeWindow("OP2", 20.0, 30.0);
        var work = Channels.Select(c => (c, (Func<TimeWindow, ChannelWindowStats>)(w => c is "p_in" or "t_w4"
            ? throw new InvalidOperationException($"failed {c}")
            : Expected(w, c)))).ToList();
        book.AddAll(window, work);

        var failure = Assert.Throws<InvalidOperationException>(() => book.DrainInto([]));
        Assert.Equal("failed p_in", failure.Message);
    }

    private static List<(string, Func<TimeWindow, ChannelWindowStats>)> Work(TimeWindow window, ConcurrentDictionary<(string, string), int> evaluations,
        ConcurrentQueue<string> started, string? slow, ManualResetEventSlim? gate = null) =>
        [.. Channels.Select(channel => (channel, (Func<TimeWindow, ChannelWindowStats>)(w =>
        {
            started.Enqueue(channel);
            gate?.Wait();
            evaluations.AddOrUpdate((window.Id, channel), 1, (_, n) => n + 1);
            if (channel == slow)
            {
                Thread.Sleep(200); // far above any scheduling noise: the cost the book remembers
            }
            return Expected(w, channel);
        })))];

    /// <summary>A result that names its window and channel, so a mix-up shows (the values are made up; no source needed).</summary>
    private static ChannelWindowStats Expected(TimeWindow window, string channel)
    {
        var mean = window.StartS + Array.IndexOf(Channels, channel);
        var typeA = BcPrep.Uncertainty.WindowMean.Evaluate([mean, mean + 1, mean + 2, mean + 1, mean]);
        return new ChannelWindowStats(channel, window.Id, 5, 0, 0, 0, mean, 0.0, mean, mean, typeA, []);
    }
}
