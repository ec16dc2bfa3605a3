using System.Text.Json;
using System.Text.Json.Serialization;
using BcPrep.Conditioning;
using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public class InPlaceWindowStatisticsTests
{
    private static readonly JsonSerializerOptions Exact = new() { NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals };

    /// <summary>Every field, numbers written so that they read back to the same bits.</summary>
    private static string Text(ChannelWindowStats stats) => JsonSerializer.Serialize(stats, Exact);

    /// <summary>1 kHz samples of a noisy level with spikes; <paramref name="holes"/> cells made NaN.</summary>
    private static (double[] T, double[] X) Series(int n, int seed, params int[] holes)
    {
        var random = new Random(seed);
        var t = Enumerable.Range(0, n).Select(i => 100.0 + (i * 1e-3)).ToArray();
        var x = Enumerable.Range(0, n).Select(i => 300.0 + (0.02 * Math.Sin(i * 0.003)) + (0.01 * (random.NextDouble() - 0.5))).ToArray();
        foreach (var i in new[] { 3, n / 3, (n / 3) + 1, n - 2 })
        {
            x[i] += 0.5;
        }
        foreach (var i in holes)
        {
            x[i] = double.NaN;
        }
        return (t, x);
    }

    public static TheoryData<string, int[]> Shapes() => new()
    {
        { "no gaps", [] },
        { "cells without a value, bridged", [500, 501, 502, 9000, 19_001] },
        { "a bridged cell beside a spike", [(20_000 / 3) - 1, 12_345] },
        { "a cell without a value at the edge (dropped: copying path)", [0, 700] },
        { "a gap longer than the bridge (left open: copying path)", [.. Enumerable.Range(4000, 3000)] },
    };

    // Reference: WindowStatistics.Evaluate, which bridges and de-spikes into the thread's scratch arrays; working in
    // the loaded values must give the same statistics, and putting the recorded cells back the loaded values.
    [Theory]
    [MemberData(nameof(Shapes))]
    public void In_place_gives_the_same_statistics_and_the_edits_give_the_loaded_values_back(string shape, int[] holes)
    {
        var (t, x) = Series(20_000, holes.Length + shape.Length, holes);
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0);
        var window = new TimeWindow("w", t[0], t[^1]);
        var expected = WindowStatistics.Evaluate("c", window, t, (double[])x.Clone(), settings, new SensorFaultLimits());
        var loaded = (double[])x.Clone();
        var edits = new SampleEdits();

        var actual = WindowStatistics.EvaluateInPlace("c", window, t, loaded, edits, settings, new SensorFaultLimits());

        Assert.Equal(Text(expected), Text(actual));
        Assert.True(actual.SpikesReplaced >= 3, shape);
        edits.Undo(loaded);
        Assert.Equal(x.Select(BitConverter.DoubleToInt64Bits), loaded.Select(BitConverter.DoubleToInt64Bits));
    }

    // Common practice: the copying path leaves the loaded values as they are and records nothing.
    [Fact]
    public void A_window_that_must_be_copied_is_not_written_over()
    {
        var (t, x) = Series(20_000, 7, [.. Enumerable.Range(4000, 3000)]);
        var loaded = (double[])x.Clone();
        var edits = new SampleEdits();

        WindowStatistics.EvaluateInPlace("c", new TimeWindow("w", t[0], t[^1]), t, loaded, edits, new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0), new SensorFaultLimits());

        Assert.Equal(0, edits.Count);
        Assert.Equal(x.Select(BitConverter.DoubleToInt64Bits), loaded.Select(BitConverter.DoubleToInt64Bits));
    }

    // Common practice: a reduction that fails after it bridged and de-spiked in the loaded values (as when the fault
    // policy refuses the channel, or n_eff < 2) is done again for its message; the second reduction must see the
    // samples as they were loaded, so that it gives what the copying path gives.
    [Fact]
    public void A_failure_after_de_spiking_is_reduced_again_from_the_loaded_samples()
    {
        var (times, loaded) = Series(20_000, 11, 700, 701, 5000);
        var rows = new RecentRows();
        rows.Add(["c"], times, [loaded], loaded.Length);
        rows.Complete();
        var channel = rows.Gather(new TimeWindow("w", times[0], times[^1])).Channels.Single();
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0);
        var window = new TimeWindow("OP1", times[0], times[^1]);
        var expected = WindowStatistics.Evaluate("c", window, times, (double[])loaded.Clone(), settings, new SensorFaultLimits());
        var written = 0;

        Assert.Throws<InvalidOperationException>(() => channel.Reduce<int>((t, v, edits) =>
        {
            WindowStatistics.EvaluateInPlace("c", window, t, v, edits!, settings, new SensorFaultLimits());
            written = edits!.Count;
            throw new InvalidOperationException("refused after de-spiking");
        }));
        double[]? seen = null;
        var again = channel.Reduce((t, v, edits) =>
        {
            Assert.Null(edits);
            seen = v.ToArray();
            return WindowStatistics.Evaluate("c", window, t, v, settings, new SensorFaultLimits());
        });

        Assert.True(written >= 3 + 4, "three bridged cells and four spikes written over");
        Assert.Equal(loaded.Select(BitConverter.DoubleToInt64Bits), seen!.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(Text(expected), Text(again));
    }

    /// <summary>1 kHz samples as <see cref="Series"/>, with 20 rows taken out (a 20 ms gap that bridging fills with inserted samples) every 3 000.</summary>
    private static (double[] T, double[] X) SeriesWithMissingRows(int n, int seed)
    {
        var (t, x) = Series(n, seed);
        var kept = Enumerable.Range(0, n).Where(i => i % 3000 < 2980 || i >= n - 100).ToArray();
        return ([.. kept.Select(i => t[i])], [.. kept.Select(i => x[i])]);
    }

    // Reference: WindowStatistics.Evaluate (the copying path into the thread's scratch). A gathered channel whose
    // missing rows are bridged with inserted samples cannot be de-spiked where it was loaded; its de-spiked copy goes
    // into the loaded values' slot instead of a further window-long array, with the same statistics bit for bit.
    [Fact]
    public void A_gathered_window_with_missing_rows_de_spikes_into_the_loaded_slot_with_the_same_statistics()
    {
        var (times, values) = SeriesWithMissingRows(30_000, 5);
        var rows = new RecentRows();
        rows.Add(["c"], times, [values], values.Length);
        rows.Complete();
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0);
        var window = new TimeWindow("w", times[0], times[^1]);
        var expected = WindowStatistics.Evaluate("c", window, times, (double[])values.Clone(), settings, new SensorFaultLimits());
        var gathered = rows.Gather(window).Channels.Single();

        var (actual, cleanSlot, loadedSlot) = FreshThread.Run(() =>
        {
            var stats = gathered.Reduce((t, v, edits) =>
                WindowStatistics.EvaluateInPlace("c", window, t, v, edits!, settings, new SensorFaultLimits(), copySlot: ScratchSlots.LoadedValues));
            return (stats, ThreadScratch.LengthOf(ScratchSlots.CleanSamples), ThreadScratch.LengthOf(ScratchSlots.LoadedValues));
        });

        Assert.True(expected.BridgedSamples >= 9 * 20, "the missing rows are bridged with inserted samples");
        Assert.True(actual.SpikesReplaced >= 3);
        Assert.Equal(Text(expected), Text(actual));
        Assert.Equal(0, cleanSlot);
        Assert.True(loadedSlot >= actual.SampleCount, "the de-spiked copy is in the loaded values' slot");
    }

    // Reference: WindowStatistics.Evaluate. With a Hampel window other than k = 10 and nothing to bridge, the samples
    // de-spiked are the loaded ones themselves: their copy must not go into their own slot (the rule would then read
    // samples it has already replaced).
    [Fact]
    public void A_gathered_window_de_spiked_from_its_loaded_samples_does_not_copy_into_their_slot()
    {
        var (times, values) = Series(20_000, 13);
        var rows = new RecentRows();
        rows.Add(["c"], times, [values], values.Length);
        rows.Complete();
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 4, HampelSigmas: 3.0);
        var window = new TimeWindow("w", times[0], times[^1]);
        var expected = WindowStatistics.Evaluate("c", window, times, (double[])values.Clone(), settings, new SensorFaultLimits());
        var gathered = rows.Gather(window).Channels.Single();

        var actual = FreshThread.Run(() => gathered.Reduce((t, v, edits) =>
            WindowStatistics.EvaluateInPlace("c", window, t, v, edits!, settings, new SensorFaultLimits(), copySlot: ScratchSlots.LoadedValues)));

        Assert.True(expected.SpikesReplaced >= 3);
        Assert.Equal(Text(expected), Text(actual));
    }

    // Common practice: a gathered reduction that fails after its de-spiked copy went over the loaded samples is done
    // again for its message from the samples as loaded (loaded again from the kept rows), as the copying path gives.
    [Fact]
    public void A_failure_after_de_spiking_into_the_loaded_slot_is_reduced_again_from_the_samples_as_loaded()
    {
        var (times, values) = SeriesWithMissingRows(30_000, 9);
        var rows = new RecentRows();
        rows.Add(["c"], times, [values], values.Length);
        rows.Complete();
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0);
        var window = new TimeWindow("OP1", times[0], times[^1]);
        var expected = WindowStatistics.Evaluate("c", window, times, (double[])values.Clone(), settings, new SensorFaultLimits());
        var gathered = rows.Gather(window).Channels.Single();

        Assert.Throws<InvalidOperationException>(() => gathered.Reduce<int>((t, v, edits) =>
        {
            WindowStatistics.EvaluateInPlace("c", window, t, v, edits!, settings, new SensorFaultLimits(), copySlot: ScratchSlots.LoadedValues);
            v.Span.Fill(-1.0); // and whatever else a failing reduction may leave in its scratch
            throw new InvalidOperationException("refused after de-spiking");
        }));
        rows.Release();
        double[]? seen = null;
        var again = gathered.Reduce((t, v, edits) =>
        {
            Assert.Null(edits);
            seen = v.ToArray();
            return WindowStatistics.Evaluate("c", window, t, v, settings, new SensorFaultLimits());
        });

        Assert.Equal(values.Select(BitConverter.DoubleToInt64Bits), seen!.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(Text(expected), Text(again));
    }

    // Common practice: a cell written twice (bridged, then replaced as a spike) ends with its loaded value.
    [Fact]
    public void Undo_puts_back_the_loaded_value_of_a_cell_written_twice()
    {
        var samples = new[] { 1.0, double.NaN, 3.0 };
        var edits = new SampleEdits();
        edits.Record(1, samples[1]);
        samples[1] = 2.0;
        edits.Record([1, 2], [2.0, 3.0]);
        samples[1] = 9.0;
        samples[2] = 8.0;

        edits.Undo(samples);

        Assert.Equal(1.0, samples[0]);
        Assert.True(double.IsNaN(samples[1]));
        Assert.Equal(3.0, samples[2]);
        Assert.Equal(0, edits.Count);
    }
}
