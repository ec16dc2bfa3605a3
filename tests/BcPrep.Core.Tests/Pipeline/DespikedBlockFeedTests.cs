using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// Spikes are removed from the raw samples before the block means that detection and the day plots use, with no
/// notch or low-pass set (and with one). A day with single-sample spikes of 1000 σ must give the block means of the
/// same day without them, within the noise of a block mean. Without the de-spiking a spiked 10 Hz block moves by
/// 100 σ.
/// </summary>
public class DespikedBlockFeedTests
{
    private const double StartS = 1.0e9; // an absolute log clock, as the reader gives it
    private const double NoiseSigma = 0.05;
    private const double SpikeSigmas = 1000.0;
    private const int ReadRows = 8192; // the reader's block of rows
    private const double Phi = 0.8; // lag-1 correlation of the noise, per sample

    /// <summary>
    /// Standard deviation of the mean of n consecutive samples of AR(1) noise with marginal σ and lag-1 correlation φ:
    /// σ²/n · [(1 + φ)/(1 − φ) − 2φ(1 − φⁿ)/(n(1 − φ)²)] (the variance of the mean of a stationary AR(1) series, as in
    /// Box and Jenkins; from memory).
    /// </summary>
    private static double BlockMeanSigma(double sigma, int n, double phi) =>
        sigma * Math.Sqrt((((1 + phi) / (1 - phi)) - (2 * phi * (1 - Math.Pow(phi, n)) / (n * (1 - phi) * (1 - phi)))) / n);

    private static RigDescription Rig(string conditioning = "") =>
        RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath) + "\n[conditioning]\n" + conditioning + "\n", "rig.toml");

    /// <summary>
    /// Marginal σ of a channel's noise: <see cref="NoiseSigma"/>, or five times its resolution where that is coarser
    /// (the barometer's 1 Pa), as on a real logger; Hampel's robust σ has the resolution as its floor.
    /// </summary>
    private static double Sigma(ChannelSpec channel) => Math.Max(NoiseSigma, 5 * ChannelConditioningPlan.Resolution(channel));

    /// <summary>
    /// Every rig channel: a level, a first-order step at the middle of the day, AR(1) noise (φ = <see cref="Phi"/>, marginal σ
    /// <see cref="NoiseSigma"/>) and, at a fast rate, 50 Hz hum; a missing cell now and then.
    /// </summary>
    private static (string[] Channels, double[] Times, double[][] Values) Day(RigDescription rig, double rateHz, double dayS, int seed)
    {
        var channels = rig.Channels.Select(c => c.Id).ToArray();
        var sigmas = rig.Channels.Select(Sigma).ToArray();
        var n = (int)(dayS * rateHz);
        var random = new Random(seed);
        var times = Enumerable.Range(0, n).Select(i => StartS + (i / rateHz)).ToArray();
        var values = new double[channels.Length][];
        for (var c = 0; c < channels.Length; c++)
        {
            var level = 100.0 * (c + 1);
            var step = 1.0 * (c + 1); // 20–240 σ: the ramp moves a sample by at most 1.2 σ at 10 Hz
            var ar = 0.0;
            values[c] = new double[n];
            for (var i = 0; i < n; i++)
            {
                var t = i / rateHz;
                ar = (Phi * ar) + (sigmas[c] * Math.Sqrt(1 - (Phi * Phi)) * Gaussian(random));
                var hum = rateHz >= 200 ? 0.1 * Math.Sin(2 * Math.PI * 50.0 * t) : 0.0;
                var response = t < dayS / 2 ? 0.0 : step * (1 - Math.Exp(-(t - (dayS / 2)) / 20.0));
                values[c][i] = random.NextDouble() < 1e-3 ? double.NaN : level + response + ar + hum;
            }
        }
        return (channels, times, values);
    }

    /// <summary>
    /// Single-sample spikes of ±1000 σ at several places: in the first block, in the last sample of a read block
    /// (so the block straddles two read blocks), in the first sample of the next, in the step's approach (10 s
    /// after it) and at random.
    /// </summary>
    private static double[][] Spiked(RigDescription rig, double[][] clean, double rateHz, double dayS, int seed)
    {
        var random = new Random(seed);
        var spiked = clean.Select(v => (double[])v.Clone()).ToArray();
        var n = clean[0].Length;
        int[] fixedPlaces = [3, ReadRows - 1, ReadRows, (int)(((dayS / 2) + 10.5) * rateHz), n - 2];
        for (var c = 0; c < spiked.Length; c++)
        {
            var values = spiked[c];
            var sigma = Sigma(rig.Channels[c]);
            var places = fixedPlaces.Where(i => i < n).Concat(Enumerable.Range(0, 20).Select(_ => random.Next(n)));
            foreach (var i in places)
            {
                values[i] = (double.IsNaN(values[i]) ? clean[c][i - 1] : values[i]) + ((random.Next(2) == 0 ? -1 : 1) * SpikeSigmas * sigma);
            }
        }
        return spiked;
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());

    private static BlockMeanSink Blocks(RigDescription rig, string[] channels, double[] times, double[][] values)
    {
        var blocks = new BlockMeanSink(StartS, 1.0);
        var feed = DetectionFeed.For(rig, blocks);
        for (var from = 0; from < times.Length; from += ReadRows)
        {
            var count = Math.Min(ReadRows, times.Length - from);
            feed.BlockSink.AcceptBlock(channels, times[from..(from + count)], [.. values.Select(v => v[from..(from + count)])], count);
        }
        feed.Complete();
        return blocks;
    }

    /// <summary>Plain block means of the clean day (the definition: every finite sample of the block, averaged).</summary>
    private static BlockMeanSink Plain(string[] channels, double[] times, double[][] values)
    {
        var blocks = new BlockMeanSink(StartS, 1.0);
        blocks.AcceptBlock(channels, times, values, times.Length);
        return blocks;
    }

    [Theory]
    [InlineData(10.0, 1200.0, "")]
    [InlineData(1000.0, 120.0, "")]
    [InlineData(1000.0, 120.0, "mains = \"50 Hz\"\nlowpass_cutoff = \"0.5 Hz\"")]
    public void Thousand_sigma_spikes_leave_the_block_means_of_the_clean_day(double rateHz, double dayS, string conditioning)
    {
        var rig = Rig(conditioning);
        var (channels, times, clean) = Day(rig, rateHz, dayS, seed: 3);
        var spiked = Spiked(rig, clean, rateHz, dayS, seed: 4);

        var fromClean = Blocks(rig, channels, times, clean);
        var fromSpiked = Blocks(rig, channels, times, spiked);

        // "Within noise": one standard deviation of a block mean's own noise (0.74 σ at 10 Hz, 0.095 σ at 1 kHz). Hampel
        // puts the window's median in a spike's place, which differs from the clean sample by its local noise, so
        // two spikes in one 10 Hz block (as at the read-block edge) move it by up to about half that. A spike left
        // in a 10 Hz block moves it by 100 σ, in a 1 kHz block by 1 σ (10 of the tolerance).
        Assert.Equal(fromClean.Length, fromSpiked.Length);
        foreach (var (channel, c) in channels.Select((id, c) => (id, c)))
        {
            var tolerance = BlockMeanSigma(Sigma(rig.Channels[c]), (int)rateHz, Phi);
            // With a notch and low-pass the chain runs on 40 ms sub-block means, and a zero-phase filter's output at
            // the day's ends pivots on the end sub-block (odd extension about the end sample). A spike replaced by its
            // window's median there differs from the clean sample by the local noise and moves the first and last
            // blocks by up to a sub-block mean's noise (4.7 times a block mean's at φ = 0.8); a spike left in moves
            // them further (it moves its sub-block by 25 σ). Every other block keeps the block-mean bound.
            var edgeTolerance = conditioning.Length > 0 ? BlockMeanSigma(Sigma(rig.Channels[c]), 40, Phi) : tolerance;
            var a = fromClean.Means(channel, fromClean.Length);
            var b = fromSpiked.Means(channel, fromSpiked.Length);
            for (var k = 0; k < a.Length; k++)
            {
                var bound = k == 0 || k == a.Length - 1 ? edgeTolerance : tolerance;
                Assert.True(Math.Abs(a[k] - b[k]) <= bound, $"{channel} block {k}: clean {a[k]}, spiked {b[k]}");
            }
        }
    }

    [Theory]
    [InlineData(10.0, 1200.0)]
    [InlineData(1000.0, 120.0)]
    public void A_clean_day_keeps_its_plain_block_means(double rateHz, double dayS)
    {
        var rig = Rig();
        var (channels, times, clean) = Day(rig, rateHz, dayS, seed: 8);

        var despiked = Blocks(rig, channels, times, clean);
        var plain = Plain(channels, times, clean);

        // Hampel at 6 robust σ replaces almost no sample of clean noise (README: about 0.01 % at φ = 0.8), and a block
        // with none replaced is averaged as it is: at least 99 % of the means agree with the definition to rounding,
        // and the few where Hampel replaced a sample within the same quarter σ as above.
        Assert.Equal(plain.Length, despiked.Length);
        var identical = 0;
        var total = 0;
        foreach (var (channel, c) in channels.Select((id, c) => (id, c)))
        {
            var a = plain.Means(channel, plain.Length);
            var b = despiked.Means(channel, despiked.Length);
            for (var k = 0; k < a.Length; k++)
            {
                Assert.True(Math.Abs(a[k] - b[k]) <= 0.25 * Sigma(rig.Channels[c]) || (double.IsNaN(a[k]) && double.IsNaN(b[k])), $"{channel} block {k}: plain {a[k]}, de-spiked {b[k]}");
                identical += Math.Abs(a[k] - b[k]) <= 1e-9 * Math.Abs(a[k]) || double.IsNaN(a[k]) ? 1 : 0;
                total++;
            }
        }
        Assert.True(identical >= 0.99 * total, $"{identical} of {total} blocks identical");
    }

    // Four channels' blocks summed side by side (DespikedBlockFeed.SummariseFour) must give each channel the sum, count,
    // minimum and maximum of one channel at a time to the bit: the same additions in the same order (the block mean is
    // the sum over the count, the definition). Gaps (NaN) are skipped, infinities are samples, as one at a time.
    [Theory]
    [InlineData(1000, 0.0)]
    [InlineData(999, 0.01)]
    [InlineData(7, 0.5)]
    [InlineData(0, 0.0)]
    public void Four_blocks_summed_side_by_side_equal_one_at_a_time_to_the_bit(int length, double gapFraction)
    {
        var random = new Random(length);
        var runs = Enumerable.Range(0, 4).Select(c => Enumerable.Range(0, length).Select(i => random.NextDouble() < gapFraction ? double.NaN
            : i == 3 && c == 2 ? double.PositiveInfinity : (100.0 * c) + random.NextDouble() - 0.5).ToArray()).ToArray();

        var (a, b, c, d) = DespikedBlockFeed.SummariseFour(runs[0], runs[1], runs[2], runs[3]);

        Assert.Equal(DespikedBlockFeed.Summarise(runs[0]), a);
        Assert.Equal(DespikedBlockFeed.Summarise(runs[1]), b);
        Assert.Equal(DespikedBlockFeed.Summarise(runs[2]), c);
        Assert.Equal(DespikedBlockFeed.Summarise(runs[3]), d);
    }

    [Fact]
    public void A_block_mean_is_final_once_the_sink_says_so()
    {
        // The rule the live detection relies on (BlockMeanSink.FinalBlocks): a block below FinalBlocks no longer
        // changes. Blocks held back for the next read block, or waiting for the next block's first samples to go
        // through Hampel, are not final yet. Read blocks of 777 rows put block edges everywhere.
        var rig = Rig();
        var (channels, times, clean) = Day(rig, 10.0, 600.0, seed: 5);
        var spiked = Spiked(rig, clean, 10.0, 600.0, seed: 6);
        var final = Blocks(rig, channels, times, spiked);
        var blocks = new BlockMeanSink(StartS, 1.0);
        var feed = DetectionFeed.For(rig, blocks);
        var seen = 0;
        for (var from = 0; from < times.Length; from += 777)
        {
            var count = Math.Min(777, times.Length - from);
            feed.BlockSink.AcceptBlock(channels, times[from..(from + count)], [.. spiked.Select(v => v[from..(from + count)])], count);
            for (; seen < blocks.FinalBlocks; seen++)
            {
                foreach (var channel in channels)
                {
                    Assert.Equal(final.MeanAt(channel, seen), blocks.MeanAt(channel, seen));
                }
            }
        }
        Assert.True(seen >= 590, $"{seen} blocks final before the end");
    }
}
