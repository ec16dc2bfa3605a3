using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

/// <summary>
/// Channels filtered four at a time in the lanes of one vector (<see cref="StreamingConditioner.AcceptPending(IReadOnlyList{StreamingConditioner})"/>)
/// give each channel's values bit for bit as filtering it alone does: the lanes repeat the scalar recursion's
/// operations in the same order. Exact equality is the check (no tolerance): the output of `calibrate --conditioned`
/// must not depend on how its channels were grouped.
/// </summary>
public class StreamedLanesTests
{
    /// <summary>
    /// Six channels of a 1 kHz record with hum, noise and spikes, each different; a shared short time jump (bridged)
    /// and a shared long dropout (a new segment); channel 2 has empty cells of its own (its lane leaves the others
    /// and rejoins), channel 4 a dropout of its own.
    /// </summary>
    private static (double[] T, double[][] X) Record(int samples)
    {
        var random = new Random(11);
        var t = new List<double>();
        for (var i = 0; i < samples; i++)
        {
            if (i is >= 30_000 and < 30_004)
            {
                continue;
            }
            if (i is >= 80_000 and < 83_000)
            {
                continue; // 3 s without rows: longer than the bridge, the filters start a new segment
            }
            t.Add(i / 1000.0);
        }
        var x = new double[6][];
        for (var c = 0; c < x.Length; c++)
        {
            x[c] = new double[t.Count];
            var level = 100.0 * (c + 1);
            for (var i = 0; i < t.Count; i++)
            {
                x[c][i] = level + (3.0 * Math.Sin(2 * Math.PI * (0.2 + (0.05 * c)) * t[i])) + (2.0 * Math.Sin(2 * Math.PI * 50.0 * t[i])) + random.NextDouble();
            }
            foreach (var i in new[] { 1000 + c, 17_777, 55_000 - c })
            {
                if (i < t.Count)
                {
                    x[c][i] += 200.0;
                }
            }
        }
        var cells = Math.Min(20_000, t.Count / 2);
        x[2][cells] = double.NaN;     // bridged in channel 2 only
        x[2][cells + 1] = double.NaN;
        for (var i = 60_000; i < 60_500 && i < t.Count; i++)
        {
            x[4][i] = double.NaN;    // 0.5 s: open in channel 4 only, its segments differ from then on
        }
        return (t.ToArray(), x);
    }

    private static List<double>[] Alone(double[] t, double[][] x, ConditioningSettings settings, int core, int push)
    {
        var result = new List<double>[x.Length];
        for (var c = 0; c < x.Length; c++)
        {
            var s = new StreamingConditioner(settings, core, 4);
            for (var start = 0; start < t.Length; start += push)
            {
                var n = Math.Min(push, t.Length - start);
                s.Push(t.AsSpan(start, n), x[c].AsSpan(start, n));
            }
            s.Complete();
            result[c] = s.OutputValues;
        }
        return result;
    }

    private static (List<double>[] Values, long[] InLanes) InLanes(double[] t, double[][] x, ConditioningSettings settings, int core, int push)
    {
        var all = x.Select(_ => new StreamingConditioner(settings, core, 4) { DeferFilters = true }).ToArray();
        var groups = new[] { all[..4], all[4..] };
        for (var start = 0; start < t.Length; start += push)
        {
            var n = Math.Min(push, t.Length - start);
            for (var c = 0; c < x.Length; c++)
            {
                all[c].Push(t.AsSpan(start, n), x[c].AsSpan(start, n));
            }
            foreach (var g in groups)
            {
                StreamingConditioner.AcceptPending(g);
            }
        }
        foreach (var c in all)
        {
            c.CompleteChunks();
        }
        foreach (var g in groups)
        {
            StreamingConditioner.AcceptPending(g);
        }
        foreach (var c in all)
        {
            c.CompleteFilters();
        }
        return (all.Select(c => c.OutputValues).ToArray(), all.Select(c => c.SamplesFilteredInLanes).ToArray());
    }

    [Theory]
    [InlineData(140_000, 5000, 777, 50.0, 20.0)]    // notch and a fast low-pass, small chunks
    [InlineData(140_000, 65_536, 8192, 50.0, 0.5)]  // the settings of the benchmark day: stretches of 4 settling lengths
    [InlineData(140_000, 5000, 8192, null, 0.5)]    // low-pass only
    [InlineData(2_000, 5000, 300, 50.0, 0.5)]       // a day shorter than the filters' edges: every segment filtered whole
    public void Four_channels_in_lanes_equal_each_channel_alone_bit_for_bit(int samples, int core, int push, double? mainsHz, double? cutoffHz)
    {
        var (t, x) = Record(samples);
        var settings = new ConditioningSettings(MaxBridgeS: 0.01, LowPassCutoffHz: cutoffHz, MainsHz: mainsHz);
        var alone = Alone(t, x, settings, core, push);
        var (lanes, inLanes) = InLanes(t, x, settings, core, push);
        for (var c = 0; c < x.Length; c++)
        {
            Assert.Equal(alone[c].Count, lanes[c].Count);
            for (var i = 0; i < alone[c].Count; i++)
            {
                if (BitConverter.DoubleToInt64Bits(alone[c][i]) != BitConverter.DoubleToInt64Bits(lanes[c][i]))
                {
                    Assert.Fail($"channel {c}, sample {i}: {alone[c][i]:R} alone, {lanes[c][i]:R} in lanes");
                }
            }
        }
        // Else the comparison above would hold without lanes: most samples of the group of four went through them
        // (not all: channel 2's empty cells and channel 4's own dropout take its chunks apart), none of the pair.
        Assert.All(inLanes[..4], n => Assert.True(n > samples / 3, $"{n} samples in lanes"));
        Assert.All(inLanes[4..], n => Assert.Equal(0, n));
    }
}
