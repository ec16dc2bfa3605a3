using BcPrep.Conditioning;
using BcPrep.Pipeline;
using BcPrep.Values;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// The window statistics work in per-thread scratch and skip copies and passes; they must give what the
/// straightforward evaluation (<see cref="PreviousWindowStatistics"/>, fresh arrays at every step) gives, to the bit:
/// every value, flag, evidence text, gap and spike time, or the same failure with the same message.
/// </summary>
public class BufferedWindowStatisticsTests
{
    private static readonly ConditioningSettings Settings = new(MaxBridgeS: 2.0);

    /// <summary>The rig file's default Hampel filter (k = 10, 6 σ: ConditioningSpec.Default), which takes the sliding sorted window.</summary>
    private static readonly ConditioningSettings RigDefaults = new(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0);
    private static readonly DayStart Day = new(new LoggerSeconds(GeneratedWindows.DayStartS));

    public static TheoryData<string> Names() => [.. GeneratedWindows.All().Select(w => w.Name)];

    public static TheoryData<string, int> NamesAndHalfWindows()
    {
        var data = new TheoryData<string, int>();
        foreach (var w in GeneratedWindows.All())
        {
            data.Add(w.Name, 3);
            data.Add(w.Name, 10);
        }
        return data;
    }

    private static GeneratedWindow Window(string name) => GeneratedWindows.All().Single(w => w.Name == name);

    private static string Previous(GeneratedWindow w, ConditioningSettings? settings = null) =>
        Outcome(() => PreviousWindowStatistics.Evaluate("x", Interval(w), w.TimesS, w.Values, settings ?? Settings, w.Limits, Day));

    private static string Buffered(GeneratedWindow w, ConditioningSettings? settings = null) =>
        Outcome(() => WindowStatistics.Evaluate("x", Interval(w), w.TimesS, w.Values, settings ?? Settings, w.Limits, Day));

    private static TimeWindow Interval(GeneratedWindow w) => new("OP1", w.TimesS[0], w.TimesS[^1]);

    /// <summary>The description of the result, or the failure's type and message.</summary>
    private static string Outcome(Func<ChannelWindowStats> evaluate)
    {
        try
        {
            return GeneratedWindows.Describe(evaluate());
        }
        catch (Exception e) when (e is BcPrepFailure or BcPrepDataException)
        {
            return e.GetType().Name + ": " + GeneratedWindows.Describe(e is BcPrepFailure f ? f.Problems : e.Message);
        }
    }

    [Theory]
    [MemberData(nameof(NamesAndHalfWindows))]
    public void Buffered_evaluation_equals_the_previous_one_to_the_bit(string name, int hampelHalfWindow)
    {
        var w = Window(name);
        var settings = hampelHalfWindow == 3 ? Settings : RigDefaults;
        var expected = Previous(w, settings);

        Assert.Equal(expected, Buffered(w, settings));
        Assert.DoesNotContain("Exception", expected, StringComparison.Ordinal); // the generated windows all evaluate
    }

    [Theory]
    [MemberData(nameof(Names))]
    public void Bridging_equals_the_previous_bridging_to_the_bit(string name)
    {
        var w = Window(name);
        var expected = PreviousGapBridging.Bridge(w.TimesS.AsSpan(), w.Values.AsSpan(), 2.0);
        var actual = GapBridging.Bridge(w.TimesS.AsSpan(), w.Values.AsSpan(), 2.0);

        Assert.Equal(GeneratedWindows.Describe(expected), GeneratedWindows.Describe(actual));
    }

    [Theory]
    [MemberData(nameof(Names))]
    public void Fault_screening_equals_the_previous_screening_to_the_bit(string name)
    {
        // Raw samples (NaN cells included, so the sample-by-sample path is exercised too) and the finite ones.
        var w = Window(name);
        var finite = w.Values.Where(double.IsFinite).ToArray();
        foreach (var x in new[] { w.Values, finite })
        {
            Assert.Equal(GeneratedWindows.Describe(PreviousSensorFaults.Check(x, w.Limits)), GeneratedWindows.Describe(SensorFaults.Check(x, w.Limits)));
        }
    }

    [Theory]
    [InlineData("jittered")] // many distinct steps: the median comes from the selection on a copy
    [InlineData("two steps, half each")] // an even count split at the middle: the mean of the two step values
    [InlineData("two steps, a third short")]
    [InlineData("one step")]
    public void The_nominal_interval_is_the_median_step_as_before(string clock)
    {
        // Median convention of MathNet's ArrayStatistics.MedianInplace (mean of the two middle values for an even count).
        var random = new Random(5);
        var steps = Enumerable.Range(0, 10_000).Select(i => clock switch
        {
            "jittered" => 0.001 * (1.0 + (0.01 * random.NextDouble())),
            "two steps, half each" => i % 2 == 0 ? 0.001 : 0.002,
            "two steps, a third short" => i % 3 == 0 ? 0.001 : 0.002,
            _ => 0.5, // exact in binary: every step the same
        }).ToArray();
        var t = new double[steps.Length + 1];
        t[0] = clock == "one step" ? 0.0 : GeneratedWindows.DayStartS;
        for (var i = 0; i < steps.Length; i++)
        {
            t[i + 1] = t[i] + steps[i];
        }
        var x = t.Select(_ => 1.0).ToArray();

        var expected = PreviousGapBridging.Bridge(t.AsSpan(), x.AsSpan(), 2.0).Report.NominalIntervalS;
        var actual = GapBridging.Bridge(t.AsSpan(), x.AsSpan(), 2.0).Report.NominalIntervalS;

        Assert.Equal(BitConverter.DoubleToInt64Bits(expected), BitConverter.DoubleToInt64Bits(actual));
    }

    [Fact]
    public void The_generated_windows_raise_every_kind_of_flag_and_gap()
    {
        // Common practice: a comparison is only as good as what it covers. The windows above hold bridged and open
        // gaps, edge gaps, spikes and every flag kind, so the equalities above compare each of them.
        var results = GeneratedWindows.All().Where(w => w.Name.EndsWith("seed 1", StringComparison.Ordinal))
            .Select(w => WindowStatistics.Evaluate("x", Interval(w), w.TimesS, w.Values, Settings, w.Limits, Day)).ToList();

        Assert.Contains(results, r => r.Conditioning!.BridgedGaps.Count > 0);
        Assert.Contains(results, r => r.BridgedSamples > 0);
        Assert.Contains(results, r => r.Conditioning!.UnbridgedGaps.Count > 0);
        Assert.Contains(results, r => r.Conditioning!.OpenEdgeGaps.Count > 0);
        Assert.Contains(results, r => r.SpikesReplaced > 0);
        foreach (var kind in new[] { SensorFaultKind.Saturation, SensorFaultKind.Stuck, SensorFaultKind.Implausible })
        {
            Assert.True(results.Any(r => r.Faults.Any(f => f.Kind == kind)), $"no {kind} flag");
        }
        Assert.Contains(results, r => r.Faults.Any(f => f.Kind == SensorFaultKind.Saturation && f.EvidenceValue == 250.3)); // declared
        Assert.Contains(results, r => r.Faults.Any(f => f.Kind == SensorFaultKind.Saturation && f.EvidenceValue == 250.45)); // its own extreme
    }

    [Theory]
    [InlineData(0.30)] // more than a quarter of the window lost to an open gap: the point fails
    [InlineData(0.99975)] // 2 valid samples left of 8000, fewer than the 3 needed
    public void A_failing_window_fails_with_the_same_message(double lostFraction)
    {
        var w = GeneratedWindows.Build("lost", 1000.0, 8000, 7, (_, _, _, x) =>
        {
            var start = lostFraction > 0.9 ? 0 : 100;
            for (var i = start; i < Math.Min(x.Count, start + (int)(lostFraction * x.Count)); i++)
            {
                x[i] = double.NaN;
            }
            return new SensorFaultLimits();
        });
        var expected = Previous(w);

        Assert.StartsWith(lostFraction > 0.9 ? "BcPrepFailure" : "WindowLostFailure", expected, StringComparison.Ordinal);
        Assert.Equal(expected, Buffered(w));
    }

    [Fact]
    public void A_drifting_bridged_window_reports_its_spike_times_although_its_transform_reuses_the_bridged_arrays()
    {
        // The bridged times and values share their arrays with the autocorrelation's transforms (ScratchSlots): every
        // time reported must be taken before the Type A evaluation. A drift makes the autocorrelation decay too slowly
        // for the sections, so it takes the transform of the whole window; a bridged gap with inserted samples puts
        // the times in the shared array; spikes after the gap read them. Reference: the straightforward evaluation
        // with fresh arrays (PreviousWindowStatistics).
        var w = GeneratedWindows.Build("drift, bridged, spikes", 1000.0, 40_000, 31, (_, _, t, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] += 2.0 * i / x.Count;
            }
            t.RemoveRange(15_000, 40);
            x.RemoveRange(15_000, 40);
            foreach (var i in new[] { 20_000, 31_000, 38_500 })
            {
                x[i] += 30.0;
            }
            return new SensorFaultLimits(Resolution: 0.002);
        });
        var expected = Previous(w, RigDefaults);
        // Twice on one thread: the first evaluation leaves the thread's arrays long enough for the transform, so the
        // second one's transform writes over the very arrays its bridged times are in.
        var (first, second, result) = FreshThread.Run(() => (Buffered(w, RigDefaults), Buffered(w, RigDefaults),
            WindowStatistics.Evaluate("x", Interval(w), w.TimesS, w.Values, RigDefaults, w.Limits, Day)));

        Assert.Equal(expected, first);
        Assert.Equal(expected, second);
        Assert.True(result.BridgedSamples > 0);
        foreach (var i in new[] { 20_000, 31_000, 38_500 })
        {
            Assert.Contains(w.TimesS[i], result.Conditioning!.SpikeTimesS);
        }
        // The lags read reach the whole window's transform (the estimator on the raw drifting values, read to the cut-off).
        var finite = w.Values.Where(double.IsFinite).ToArray();
        var rho = new BcPrep.Uncertainty.LazyAutocorrelation(finite, finite.Average());
        _ = rho[result.TypeA.CutoffLag];
        Assert.Equal(BcPrep.Uncertainty.AutocorrelationRoute.WholeWindow, rho.LastRoute);
    }

    [Fact]
    public void Windows_of_different_lengths_in_a_row_on_one_thread_give_what_each_gives_alone()
    {
        // The scratch of one window must not leak into the next: a long bridged window, then a shorter clean one,
        // then a shorter window with edge gaps, then the long one again, all on one thread; each alone on a fresh one.
        var windows = new[]
        {
            GeneratedWindows.Build("long, bridged", 1000.0, 40_000, 11, (r, _, t, x) =>
            {
                for (var k = 0; k < 20; k++)
                {
                    x[r.Next(5, x.Count - 5)] = double.NaN;
                }
                t.RemoveRange(20_000, 30);
                x.RemoveRange(20_000, 30);
                return new SensorFaultLimits(Resolution: 0.002);
            }),
            GeneratedWindows.Build("short, clean", 1000.0, 9_000, 12, (_, _, _, _) => new SensorFaultLimits(Resolution: 0.002)),
            GeneratedWindows.Build("short, edge gaps", 1000.0, 12_000, 13, (_, _, _, x) =>
            {
                x[0] = double.NaN;
                x[^1] = double.NaN;
                x[6000] = 300.0;
                return new SensorFaultLimits(Resolution: 0.002);
            }),
        };
        var alone = windows.Select(w => FreshThread.Run(() => Buffered(w, RigDefaults))).ToArray();

        var inARow = FreshThread.Run(() => string.Join("\n", windows.Concat(windows.Take(1)).Select(w => Buffered(w, RigDefaults))));

        Assert.Equal(string.Join("\n", alone.Concat(alone.Take(1))), inARow);
        Assert.Equal(string.Join("\n", windows.Concat(windows.Take(1)).Select(w => Previous(w, RigDefaults))), inARow);
    }

    [Fact]
    public void A_result_keeps_nothing_of_the_scratch_that_the_next_window_overwrites()
    {
        var first = GeneratedWindows.Build("first", 1000.0, 20_000, 21, (r, _, _, x) =>
        {
            x[3] = double.NaN; // bridged: the samples go through the scratch arrays
            x[700] += 5.0; // a spike, whose time is kept
            return new SensorFaultLimits(Resolution: 0.002, RailTolerance: 0.002);
        });
        var second = GeneratedWindows.Build("second", 1000.0, 20_000, 22, (r, _, _, x) =>
        {
            x[3] = double.NaN;
            return new SensorFaultLimits(Resolution: 0.002, RailTolerance: 0.002);
        });

        var (before, after) = FreshThread.Run(() =>
        {
            var result = WindowStatistics.Evaluate("x", Interval(first), first.TimesS, first.Values, Settings, first.Limits, Day);
            var described = GeneratedWindows.Describe(result);
            WindowStatistics.Evaluate("x", Interval(second), second.TimesS, second.Values, Settings, second.Limits, Day);
            return (described, GeneratedWindows.Describe(result));
        });

        Assert.Equal(before, after);
        Assert.Contains(first.TimesS[700], WindowStatistics.Evaluate("x", Interval(first), first.TimesS, first.Values, Settings, first.Limits, Day).Conditioning!.SpikeTimesS);
    }

    [Fact]
    public void The_callers_arrays_are_left_as_they_were()
    {
        var w = Window("short NaN runs bridged, 1 kHz, seed 2");
        var (t, x) = ((double[])w.TimesS.Clone(), (double[])w.Values.Clone());

        WindowStatistics.Evaluate("x", Interval(w), t, x, Settings, w.Limits, Day);

        Assert.Equal(GeneratedWindows.Describe(w.TimesS), GeneratedWindows.Describe(t));
        Assert.Equal(GeneratedWindows.Describe(w.Values), GeneratedWindows.Describe(x));
    }
}
