using BcPrep.Conditioning;
using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// The block sink keeps a logger's times once and its channels' conditioners read them in place (positions on one
/// axis, own times only where gap bridging inserted samples). Whatever the sharing, every channel's conditioned rows
/// must be those of the channel conditioned alone with its own copy of the times (<see cref="StreamingConditioner.Push"/>),
/// bit for bit, times included: the reference here is that straightforward use, no tolerance (common practice for
/// a change that only moves data).
/// </summary>
public class ConditionedBlockSinkTests
{
    private const int Core = 5000;

    private static RigDescription Rig(string conditioning) =>
        RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath) + "\n[conditioning]\n" + conditioning + "\n", "rig.toml");

    /// <summary>Rows as the sink passes them on: times and every channel's values.</summary>
    private sealed class Rows : IBlockSink
    {
        public List<double> Times { get; } = [];

        public Dictionary<string, List<double>> Values { get; } = [];

        public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
        {
            Times.AddRange(timeS.AsSpan(0, count));
            for (var c = 0; c < channels.Count; c++)
            {
                if (!Values.TryGetValue(channels[c], out var list))
                {
                    Values[channels[c]] = list = [];
                }
                list.AddRange(valuesSi[c].AsSpan(0, count));
            }
        }
    }

    /// <summary>
    /// A 1 kHz record of every channel of the sample rig, each its own level, hum and spikes; a short time jump that
    /// gap bridging fills with inserted samples (in every channel: the rows' time axis gains them), a long dropout (a
    /// new filter segment) and a few empty cells in one channel (bridged in place, no new times).
    /// </summary>
    private static (string[] Channels, double[] T, double[][] X) Record(RigDescription rig, int samples)
    {
        var channels = rig.Channels.Select(c => c.Id).ToArray();
        var random = new Random(5);
        var t = new List<double>();
        for (var i = 0; i < samples; i++)
        {
            if (i is >= 12_000 and < 12_004 or >= 31_000 and < 33_500)
            {
                continue;
            }
            t.Add(1.0e9 + (i / 1000.0));
        }
        var x = new double[channels.Length][];
        for (var c = 0; c < channels.Length; c++)
        {
            x[c] = new double[t.Count];
            for (var i = 0; i < t.Count; i++)
            {
                x[c][i] = (10.0 * (c + 1)) + Math.Sin(2 * Math.PI * 50.0 * (t[i] - 1.0e9)) + (0.1 * random.NextDouble()) + (i % 4999 == c ? 50.0 : 0.0);
            }
        }
        x[1][20_000] = double.NaN;
        x[1][20_001] = double.NaN;
        return (channels, t.ToArray(), x);
    }

    private static Rows Shared(RigDescription rig, string[] channels, double[] t, double[][] x, int rows, bool parallel)
    {
        var output = new Rows();
        var sink = new ConditionedBlockSink(rig, output, Core, parallel);
        for (var from = 0; from < t.Length; from += rows)
        {
            var n = Math.Min(rows, t.Length - from);
            sink.AcceptBlock(channels, t[from..(from + n)], [.. x.Select(v => v[from..(from + n)])], n);
        }
        sink.Complete();
        return output;
    }

    private static (List<double> T, List<double> X) Alone(RigDescription rig, string channel, double[] t, double[] x, int rows)
    {
        var settings = ChannelConditioningPlan.Settings(rig, rig.Channel(channel)!);
        var s = new StreamingConditioner(settings, Core, ConditionedBlockSink.CoreOverlaps);
        for (var from = 0; from < t.Length; from += rows)
        {
            var n = Math.Min(rows, t.Length - from);
            s.Push(t.AsSpan(from, n), x.AsSpan(from, n));
        }
        s.Complete();
        return (s.OutputTimesS, s.OutputValues);
    }

    private static void AssertBits(IReadOnlyList<double> expected, IReadOnlyList<double> actual, string what)
    {
        Assert.Equal(expected.Count, actual.Count);
        for (var i = 0; i < expected.Count; i++)
        {
            if (BitConverter.DoubleToInt64Bits(expected[i]) != BitConverter.DoubleToInt64Bits(actual[i]))
            {
                Assert.Fail($"{what}, row {i}: {expected[i]:R} alone, {actual[i]:R} through the sink");
            }
        }
    }

    [Theory]
    [InlineData("mains = \"50 Hz\"\nlowpass_cutoff = \"20 Hz\"", 777, true)]    // calibrate --conditioned: channels in parallel, filters in lanes
    [InlineData("mains = \"50 Hz\"\nlowpass_cutoff = \"20 Hz\"", 8192, false)]  // process: channels one after the other
    [InlineData("max_bridge = \"0.02 s\"", 3000, true)]                         // no filters: the chain passes samples through
    public void Channels_reading_one_time_axis_give_the_rows_of_each_channel_alone(string conditioning, int rows, bool parallel)
    {
        var rig = Rig(conditioning);
        var (channels, t, x) = Record(rig, 60_000);

        var shared = Shared(rig, channels, t, x, rows, parallel);

        // The inserted samples are in the rows (else the own-times path went untested): 3 filled + 4 jumped at 1 kHz.
        Assert.True(shared.Times.Count > t.Length, $"{shared.Times.Count} rows from {t.Length} samples");
        for (var c = 0; c < channels.Length; c++)
        {
            var (times, values) = Alone(rig, channels[c], t, x[c], rows);
            AssertBits(times, shared.Times, $"times of '{channels[c]}'");
            AssertBits(values, shared.Values[channels[c]], $"'{channels[c]}'");
        }
    }

    // A channel whose gap stays open (its cells empty beside the time jump, so its gap is longer than the bridge)
    // where the others bridge the jump with inserted samples has fewer times than they have. The rows are the union of
    // the channels' times; each channel's cells are its values conditioned alone, bit for bit, at its own times and
    // NaN (written empty) at the inserted times it lacks, as README documents for a gap left open (calibrate
    // --conditioned: "Cells that stay missing are written empty"). Before, the sink threw an internal error here.
    [Theory]
    [InlineData("max_bridge = \"0.02 s\"", 4096, true)]                                          // no filters, channels in parallel
    [InlineData("max_bridge = \"0.02 s\"\nmains = \"50 Hz\"\nlowpass_cutoff = \"20 Hz\"", 777, true)] // filters in lanes
    [InlineData("max_bridge = \"0.02 s\"\nmains = \"50 Hz\"\nlowpass_cutoff = \"20 Hz\"", 8192, false)] // process: one by one
    public void A_channel_that_leaves_open_a_gap_the_others_bridge_is_empty_in_their_inserted_rows(string conditioning, int rows, bool parallel)
    {
        var rig = Rig(conditioning);
        var (channels, t, x) = Record(rig, 30_000);
        var jump = Array.FindIndex(t, s => s > 1.0e9 + 12.0);
        for (var i = jump - 30; i < jump; i++)
        {
            x[2][i] = double.NaN; // 0.03 s before the 4 ms jump: with it longer than the 0.02 s bridge
        }

        var shared = Shared(rig, channels, t, x, rows, parallel);

        var alone = channels.Select(c => Alone(rig, c, t, x[Array.IndexOf(channels, c)], rows)).ToArray();
        // The union of the channels' times, in order: the others' inserted samples are rows of their own.
        var union = alone.SelectMany(a => a.T).Distinct().Order().ToList();
        AssertBits(union, shared.Times, "times");
        Assert.Equal(alone[0].T.Count, shared.Times.Count);
        Assert.Equal(alone[2].T.Count + 4, shared.Times.Count); // the 5 ms jump's 4 inserted samples at 1 kHz
        for (var c = 0; c < channels.Length; c++)
        {
            var at = alone[c].T.Select((time, i) => (time, i)).ToDictionary(p => p.time, p => p.i);
            var expected = shared.Times.Select(time => at.TryGetValue(time, out var i) ? alone[c].X[i] : double.NaN).ToList();
            AssertBits(expected, shared.Values[channels[c]], $"'{channels[c]}'");
        }
        var inserted = shared.Times.Where(time => !alone[2].T.Contains(time)).ToList();
        Assert.Equal(4, inserted.Count);
        Assert.All(inserted, time => Assert.InRange(time, 1.0e9 + 11.9995, 1.0e9 + 12.0035));
    }

    // A channel whose empty cells outlast the bridge (no time jump: the logger kept its rows) ends a filter segment
    // there and starts another after it, while the other channels of its vector-lane group filter on through the same
    // times. Its rows, and theirs, must still be each channel's rows conditioned alone, bit for bit, with the gap's
    // cells left empty (the first channel of the group, and one further in, carry the gap).
    [Theory]
    [InlineData(0, 777)]
    [InlineData(2, 777)]
    [InlineData(2, 4096)]
    public void A_channel_with_a_gap_of_its_own_in_a_lane_group_gives_its_rows_alone(int gapChannel, int rows)
    {
        var rig = Rig("max_bridge = \"0.02 s\"\nmains = \"50 Hz\"\nlowpass_cutoff = \"20 Hz\"");
        var (channels, t, x) = Record(rig, 60_000);
        for (var i = 25_000; i < 25_050; i++)
        {
            x[gapChannel][i] = double.NaN; // 0.05 s of empty cells against a 0.02 s bridge
        }

        var shared = Shared(rig, channels, t, x, rows, parallel: true);

        for (var c = 0; c < channels.Length; c++)
        {
            var (times, values) = Alone(rig, channels[c], t, x[c], rows);
            AssertBits(times, shared.Times, $"times of '{channels[c]}'");
            AssertBits(values, shared.Values[channels[c]], $"'{channels[c]}'");
        }
        Assert.True(double.IsNaN(shared.Values[channels[gapChannel]][Array.IndexOf(shared.Times.ToArray(), t[25_020])]), "the gap stays open");
    }
}
