using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class StreamingConditionerTests
{
    /// <summary>1 kHz record with mains hum, noise, spikes, empty cells, a short time jump and a long dropout.</summary>
    private static (double[] T, double[] X) Record()
    {
        var random = new Random(7);
        var t = new List<double>();
        var x = new List<double>();
        for (var i = 0; i < 120_000; i++)
        {
            if (i is >= 40_000 and < 40_004)
            {
                continue; // 5 ms of missing rows: a time jump, bridged
            }
            var ti = i / 1000.0;
            t.Add(ti);
            x.Add(1000.0 + (30.0 * Math.Sin(2 * Math.PI * 0.3 * ti)) + (5.0 * Math.Sin(2 * Math.PI * 50.0 * ti)) + random.NextDouble());
        }
        var values = x.ToArray();
        foreach (var i in new[] { 3000, 4999, 5000, 25_003, 90_000 })
        {
            values[i] += 400.0; // spikes, two of them on a chunk seam of the test below
        }
        values[15_000] = double.NaN;          // empty cells, bridged
        values[15_001] = double.NaN;
        for (var i = 70_000; i < 70_300; i++)
        {
            values[i] = double.NaN;           // 0.3 s dropout: left open, splits the filtered segments
        }
        return (t.ToArray(), values);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(4)] // the core `calibrate --conditioned` uses: fewer seams, the same output
    public void Chunked_output_equals_whole_record_output(int coreOverlaps)
    {
        var (t, x) = Record();
        var settings = new ConditioningSettings(MaxBridgeS: 0.01, LowPassCutoffHz: 20.0, MainsHz: 50.0);
        var whole = ChannelConditioner.Condition(t, x, settings);

        var streaming = new StreamingConditioner(settings, coreLength: 5000, coreOverlaps);
        for (var start = 0; start < t.Length; start += 777)
        {
            var length = Math.Min(777, t.Length - start);
            streaming.Push(t.AsSpan(start, length), x.AsSpan(start, length));
        }
        streaming.Complete();

        Assert.True(streaming.Overlap > 1000, $"overlap {streaming.Overlap}");
        Assert.Equal(whole.TimesS, streaming.OutputTimesS);
        var worst = 0.0;
        for (var i = 0; i < whole.Values.Length; i++)
        {
            var a = whole.Values[i];
            var b = streaming.OutputValues[i];
            Assert.Equal(double.IsNaN(a), double.IsNaN(b));
            if (!double.IsNaN(a))
            {
                worst = Math.Max(worst, Math.Abs(a - b));
            }
        }
        // The signal sits near 1000: 1e-11 of it is 1e-8. Gustafsson's end states come from a small least-squares solve
        // whose rounding depends on the chunk length (about 3e-12 relative here); a seam artefact would be a filter
        // transient, orders of magnitude larger.
        Assert.True(worst < 1e-8, $"largest seam difference {worst}");
        Assert.Equal(whole.Report.SpikesReplaced, streaming.SpikesReplaced);
        foreach (var planted in new[] { 3000, 4999, 5000, 25_003, 90_000 })
        {
            Assert.Contains(t[planted], whole.Report.SpikeTimesS);
        }
        Assert.Equal(whole.Interpolated.Count(b => b), streaming.BridgedSamples);
        Assert.Equal(6, streaming.BridgedSamples); // 2 empty cells + 4 inserted rows
        Assert.Equal([50.0, 100.0, 150.0], streaming.NotchFrequenciesHz);
    }

    /// <summary>
    /// 300 s at 1 kHz around 300 (a temperature in K) with hum, noise and spikes, cut by empty cells into a long first
    /// segment, a segment of 20 s (shorter than the low-pass's edge length, so filtered whole) and a long last one,
    /// with a bridged time jump in the last.
    /// </summary>
    private static (double[] T, double[] X) SlowRecord()
    {
        var random = new Random(11);
        var t = new List<double>();
        var x = new List<double>();
        for (var i = 0; i < 300_000; i++)
        {
            if (i is >= 250_000 and < 250_003)
            {
                continue;
            }
            var ti = i / 1000.0;
            t.Add(ti);
            x.Add(300.0 + (2.0 * Math.Sin(2 * Math.PI * 0.01 * ti)) + (0.5 * Math.Sin(2 * Math.PI * 50.0 * ti)) + (0.05 * random.NextDouble()));
        }
        var values = x.ToArray();
        foreach (var i in new[] { 10, 65_535, 65_536, 131_000, 200_000 })
        {
            values[i] += 40.0;
        }
        for (var i = 150_000; i < 150_400; i++)
        {
            values[i] = double.NaN; // 0.4 s dropout: longer than the bridge, ends the first segment
        }
        for (var i = 170_400; i < 170_800; i++)
        {
            values[i] = double.NaN; // ends the 20 s segment
        }
        return (t.ToArray(), values);
    }

    [Theory]
    [InlineData(16, 1, 777)]
    [InlineData(5000, 1, 4096)]
    [InlineData(65536, 4, 100_000)]
    [InlineData(20_000, 2, 1)]
    public void A_slow_low_pass_streamed_with_carried_states_equals_the_whole_record_to_1e_11_of_the_level(int coreLength, int coreOverlaps, int pushLength)
    {
        // The benchmark day's filters: 50 Hz notch with harmonics and a 0.5 Hz low-pass at 1 kHz (settling to 1e-14
        // over about 27 000 samples), with seams at gaps and chunks of several sizes.
        var (t, x) = SlowRecord();
        var settings = new ConditioningSettings(MaxBridgeS: 0.01, LowPassCutoffHz: 0.5, MainsHz: 50.0);
        var whole = ChannelConditioner.Condition(t, x, settings);

        var streaming = new StreamingConditioner(settings, coreLength, coreOverlaps);
        for (var start = 0; start < t.Length; start += pushLength)
        {
            var length = Math.Min(pushLength, t.Length - start);
            streaming.Push(t.AsSpan(start, length), x.AsSpan(start, length));
        }
        streaming.Complete();

        Assert.True(streaming.Overlap > 20_000, $"overlap {streaming.Overlap}");
        Assert.Equal(whole.TimesS, streaming.OutputTimesS);
        // Samples within the edge length of a segment's ends depend on Gustafsson's end states, whose small solve
        // rounds differently on a whole segment and on its first or last 2 × 27 000 samples; elsewhere only seams could differ.
        var edge = 60_000;
        var fromEdge = new int[whole.Values.Length];
        var last = -edge;
        for (var i = 0; i < fromEdge.Length; i++)
        {
            last = double.IsNaN(whole.Values[i]) ? i : last;
            fromEdge[i] = i - last;
        }
        last = fromEdge.Length + edge;
        for (var i = fromEdge.Length - 1; i >= 0; i--)
        {
            last = double.IsNaN(whole.Values[i]) ? i : last;
            fromEdge[i] = Math.Min(Math.Min(fromEdge[i], last - i), Math.Min(i + 1, fromEdge.Length - i));
        }
        double worstInside = 0.0, worstEdge = 0.0;
        for (var i = 0; i < whole.Values.Length; i++)
        {
            var a = whole.Values[i];
            var b = streaming.OutputValues[i];
            Assert.Equal(double.IsNaN(a), double.IsNaN(b));
            if (double.IsNaN(a))
            {
                continue;
            }
            if (fromEdge[i] > edge)
            {
                worstInside = Math.Max(worstInside, Math.Abs(a - b));
            }
            else
            {
                worstEdge = Math.Max(worstEdge, Math.Abs(a - b));
            }
        }
        // At this slow pole the whole-record passes themselves round at a few 1e-11 of the level, and the 2 × 2 end
        // solve near a segment's ends at about 1e-10: the chunked form this replaced (overlaps of twice the settling,
        // each chunk solved anew) differed from the whole record by up to 8e-11 inside and 1.6e-10 near the ends on
        // this record. A seam artefact would be a filter transient, orders of magnitude larger.
        Assert.True(worstInside < 300.0 * 3e-11, $"largest difference inside segments {worstInside}");
        Assert.True(worstEdge < 300.0 * 3e-10, $"largest difference near segment ends {worstEdge}");
        Assert.Equal(whole.Report.SpikesReplaced, streaming.SpikesReplaced);
        Assert.Equal(whole.Interpolated.Count(b => b), streaming.BridgedSamples);
    }

    [Fact]
    public void A_constant_level_is_streamed_unchanged_to_the_ends_of_every_segment()
    {
        // Analytic check (unit DC gain of every section): `calibrate --conditioned` wrote 0.36 Pa for a 98 644 Pa
        // barometer at the first sample and at both ends of every segment when the ends took Gustafsson's states.
        var t = Enumerable.Range(0, 200_000).Select(i => i / 1000.0).ToArray();
        var x = Enumerable.Repeat(98644.0, t.Length).ToArray();
        for (var i = 120_000; i < 120_500; i++)
        {
            x[i] = double.NaN; // a dropout longer than the bridge: two segments
        }
        var streaming = new StreamingConditioner(new ConditioningSettings(MaxBridgeS: 0.01, LowPassCutoffHz: 0.5, MainsHz: 50.0), coreLength: 5000);
        for (var start = 0; start < t.Length; start += 4096)
        {
            var length = Math.Min(4096, t.Length - start);
            streaming.Push(t.AsSpan(start, length), x.AsSpan(start, length));
        }
        streaming.Complete();

        Assert.Equal(t.Length, streaming.OutputValues.Count);
        for (var i = 0; i < t.Length; i++)
        {
            if (i is >= 120_000 and < 120_500)
            {
                Assert.True(double.IsNaN(streaming.OutputValues[i]));
            }
            else
            {
                Assert.Equal(98644.0, streaming.OutputValues[i], 1e-5); // 1e-10 of the level: the DC gains round
            }
        }
    }

    [Fact]
    public void Mains_notch_is_skipped_when_the_sample_rate_is_too_low()
    {
        var t = Enumerable.Range(0, 400).Select(i => i * 0.5).ToArray();   // 2 Hz: Nyquist 1 Hz
        var x = t.Select(v => 20.0 + Math.Sin(v / 10.0)).ToArray();
        var streaming = new StreamingConditioner(new ConditioningSettings(MainsHz: 50.0, LowPassCutoffHz: 0.2), 64);
        streaming.Push(t, x);
        streaming.Complete();
        Assert.Empty(streaming.NotchFrequenciesHz);
        Assert.Equal(400, streaming.OutputValues.Count);
    }
}
