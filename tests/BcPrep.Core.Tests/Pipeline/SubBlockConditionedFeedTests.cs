using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// The fast path of the conditioned block means (chain on sub-block means) against the straightforward one (chain on
/// every sample, then block means), on a short 1 kHz day with a step, AR(1) noise, 50 Hz hum with a third harmonic and
/// scattered missing cells. The tolerance is the one README documents for the detection series.
/// </summary>
public class SubBlockConditionedFeedTests
{
    private const double RateHz = 1000.0;
    private const double DayS = 240.0;
    private const double StartS = 1.0e9; // an absolute log clock, as the reader gives it
    private const double NoiseSigma = 0.05;
    private const double HumAmplitude = 0.65;

    // The precision README documents for the detection series ("Signal conditioning"): away from the day's edges
    // within a quarter of the samples' noise σ of the full-rate chain; within the filters' settling time of an edge,
    // up to the hum and noise amplitude, because at the full rate the edge states are fitted to single samples that
    // carry hum and noise, and at the sub-block rate to hum-free means. 20 s covers the 0.5 Hz low-pass's settling.
    private const int EdgeBlocks = 20;

    private static RigDescription Rig(string conditioning) =>
        RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath) + "\n[conditioning]\n" + conditioning + "\n", "rig.toml");

    private static (string[] Channels, double[] Times, double[][] Values) Day(int seed)
    {
        var rig = Rig("mains = \"50 Hz\"");
        var channels = rig.Channels.Select(c => c.Id).ToArray();
        var n = (int)(DayS * RateHz);
        var random = new Random(seed);
        var times = Enumerable.Range(0, n).Select(i => StartS + (i / RateHz)).ToArray();
        var values = new double[channels.Length][];
        for (var c = 0; c < channels.Length; c++)
        {
            var level = 100.0 * (c + 1);
            var step = 5.0 * (c + 1);
            var phase = random.NextDouble() * 2 * Math.PI;
            var ar = 0.0;
            values[c] = new double[n];
            for (var i = 0; i < n; i++)
            {
                var t = i / RateHz;
                ar = (0.9 * ar) + (NoiseSigma * Math.Sqrt(1 - 0.81) * Gaussian(random));
                var w = 2 * Math.PI * 50.0 * t;
                var response = t < 120.0 ? 0.0 : step * (1 - Math.Exp(-(t - 120.0) / 10.0));
                values[c][i] = random.NextDouble() < 1e-4 ? double.NaN : level + response + ar + (0.5 * Math.Sin(w + phase)) + (0.15 * Math.Sin((3 * w) + phase));
            }
        }
        return (channels, times, values);
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());

    private static void Feed(IBlockSink sink, string[] channels, double[] times, double[][] values)
    {
        const int rows = 8192;
        for (var from = 0; from < times.Length; from += rows)
        {
            var count = Math.Min(rows, times.Length - from);
            sink.AcceptBlock(channels, times[from..(from + count)], [.. values.Select(v => v[from..(from + count)])], count);
        }
    }

    [Theory]
    [InlineData("mains = \"50 Hz\"\nlowpass_cutoff = \"0.5 Hz\"", 25)]
    [InlineData("mains = \"50 Hz\"", 25)]
    public void Block_means_equal_the_full_rate_chain_within_the_documented_precision(string conditioning, int subBlocks)
    {
        var rig = Rig(conditioning);
        var (channels, times, values) = Day(7);

        var straight = new BlockMeanSink(StartS, 1.0);
        var fullRate = new ConditionedBlockSink(rig, straight);
        Feed(fullRate, channels, times, values);
        fullRate.Complete();

        var fast = new BlockMeanSink(StartS, 1.0);
        var feed = new SubBlockConditionedFeed(rig, fast);
        Feed(feed, channels, times, values);
        feed.Complete();

        Assert.Equal(subBlocks, feed.SubBlocksPerBlock);
        Assert.Equal(straight.Length, fast.Length);
        var worst = 0.0;
        var worstEdge = 0.0;
        var at = "";
        foreach (var id in channels)
        {
            var a = straight.Means(id, straight.Length);
            var b = fast.Means(id, fast.Length);
            for (var k = 0; k < a.Length; k++)
            {
                var d = Math.Abs(a[k] - b[k]);
                if (k < EdgeBlocks || k >= a.Length - EdgeBlocks)
                {
                    worstEdge = Math.Max(worstEdge, d);
                }
                else if (d > worst)
                {
                    worst = d;
                    at = $"{id} block {k}";
                }
            }
        }
        Assert.True(worst <= 0.25 * NoiseSigma, $"interior block means differ by {worst} at {at}");
        Assert.True(worstEdge <= HumAmplitude, $"edge block means differ by {worstEdge}");
    }

    // process with a notch and a low-pass at 1 kHz conditions sub-block means. A logger that lost 0.5 s of rows
    // (bridged by the default max_bridge of 2 s, sub-blocks inserted) while one channel's cells were empty for the
    // 2 s before: that channel's gap (2.5 s) stays open while the others bridge the jump. Before, the chain stopped
    // with an internal error here. The channels are conditioned independently, so the other channels' block means
    // are those of the same day without the empty cells, to the rounding of a block's sum (the rows reach the block
    // means in pieces cut elsewhere once the channels' counts differ: 1e-12 relative, common practice), and the open
    // channel has no mean in the blocks its gap covers (README: a block with no sample stays empty).
    [Fact]
    public void A_channel_left_open_beside_a_jump_the_others_bridge_changes_no_other_channel()
    {
        var rig = Rig("mains = \"50 Hz\"\nlowpass_cutoff = \"0.5 Hz\"");
        var (channels, allTimes, allValues) = Day(11);
        var kept = Enumerable.Range(0, allTimes.Length).Where(i => allTimes[i] - StartS is < 100.0 or >= 100.5).ToArray();
        var times = kept.Select(i => allTimes[i]).ToArray();
        var clean = allValues.Select(v => kept.Select(i => v[i]).ToArray()).ToArray();
        var open = clean.Select(v => (double[])v.Clone()).ToArray();
        const int Open = 2;
        for (var i = 0; i < times.Length; i++)
        {
            if (times[i] - StartS is >= 98.0 and < 100.0)
            {
                open[Open][i] = double.NaN;
            }
        }

        BlockMeanSink Means(double[][] values)
        {
            var sink = new BlockMeanSink(StartS, 1.0);
            var feed = new SubBlockConditionedFeed(rig, sink);
            Feed(feed, channels, times, values);
            feed.Complete();
            Assert.Equal(25, feed.SubBlocksPerBlock);
            return sink;
        }

        var withOpenGap = Means(open);
        var reference = Means(clean);

        Assert.Equal(reference.Length, withOpenGap.Length);
        for (var c = 0; c < channels.Length; c++)
        {
            var a = reference.Means(channels[c], reference.Length);
            var b = withOpenGap.Means(channels[c], withOpenGap.Length);
            if (c != Open)
            {
                for (var k = 0; k < a.Length; k++)
                {
                    Assert.True(Math.Abs(a[k] - b[k]) <= 1e-12 * Math.Abs(a[k]), $"{channels[c]} block {k}: {a[k]:R} without the empty cells, {b[k]:R} with them");
                }
                Assert.True(double.IsFinite(b[100]), $"{channels[c]} block 100: {b[100]}");
                continue;
            }
            Assert.True(double.IsNaN(b[98]) && double.IsNaN(b[99]), $"{channels[c]} blocks 98, 99: {b[98]}, {b[99]}");
            Assert.True(double.IsFinite(b[97]) && double.IsFinite(b[100]), $"{channels[c]} blocks 97, 100: {b[97]}, {b[100]}");
        }
    }
}
