using BcPrep.Conditioning;
using BcPrep.Uncertainty;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// What one channel did inside one window: counts, the mean and its Type A uncertainty (from de-spiked but
/// unfiltered samples, because a low-pass narrows the scatter and would understate the uncertainty), and what
/// conditioning changed.
/// </summary>
public sealed record ChannelWindowStats(
    string Channel,
    string Window,
    int SampleCount,
    int MissingCount,
    int BridgedSamples,
    int SpikesReplaced,
    double Mean,
    double StandardDeviation,
    double Min,
    double Max,
    WindowMeanResult TypeA,
    IReadOnlyList<SensorFaultFlag> Faults)
{
    /// <summary>What conditioning did in this window (gaps, spike times, fault verdicts); null when not recorded.</summary>
    public WindowConditioning? Conditioning { get; init; }
}

/// <summary>Reduces one channel's window samples to <see cref="ChannelWindowStats"/>.</summary>
public static class WindowStatistics
{
    /// <summary>
    /// Bridges gaps up to <see cref="ConditioningSettings.MaxBridgeS"/>. A longer gap inside the window is left open:
    /// the statistics use the samples on both sides of it (the mean and Type A over the segments, with the reduced
    /// sample count), and the gap is reported; only when such gaps take more than <see cref="LostFractionLimit"/> of
    /// the window does it fail, with <see cref="WindowLostFailure"/>. Missing cells at the window edges are dropped
    /// and reported. Then it removes
    /// spikes with the Hampel filter of <paramref name="settings"/> (floor of the robust σ =
    /// <see cref="ConditioningSettings.HampelScaleFloor"/>), screens the de-spiked samples for sensor faults with
    /// <paramref name="limits"/>, and takes the mean and Type A uncertainty of the de-spiked, unfiltered samples.
    /// Notch and low-pass settings are not used here on purpose: a low-pass narrows the scatter and would
    /// understate the Type A uncertainty. What was done is in <see cref="ChannelWindowStats.Conditioning"/>.
    /// </summary>
    /// <remarks>Messages give times since <paramref name="dayStart"/>, the first sample of the day (by default the clock's zero).</remarks>
    /// <remarks>
    /// Working arrays: the bridged, finite samples and the de-spiked ones live in per-thread scratch
    /// (<see cref="ThreadScratch"/>; statistics run on the fixed <see cref="StatisticsWorkers"/> threads), and a window
    /// whose times are evenly spaced and whose values are all finite, the usual one, is not copied at all. Nothing
    /// that grows with the window reaches the result: it keeps scalars, gaps, spike times and flags.
    /// </remarks>
    public static ChannelWindowStats Evaluate(string channel, TimeWindow window, double[] timesS, double[] values, ConditioningSettings settings, SensorFaultLimits limits, DayStart dayStart = default)
    {
        ArgumentNullException.ThrowIfNull(values);
        return Evaluate(channel, window, timesS, values.AsMemory(), settings, limits, dayStart);
    }

    /// <inheritdoc cref="Evaluate(string, TimeWindow, double[], double[], ConditioningSettings, SensorFaultLimits, DayStart)"/>
    /// <remarks>The values as the first elements of a longer array (a statistics thread's scratch, <see cref="GatheredWindow.Load"/>).</remarks>
    internal static ChannelWindowStats Evaluate(string channel, TimeWindow window, double[] timesS, ReadOnlyMemory<double> values, ConditioningSettings settings, SensorFaultLimits limits, DayStart dayStart = default) =>
        Evaluate(channel, window, timesS, values, default, null, ScratchSlots.CleanSamples, settings, limits, dayStart);

    /// <inheritdoc cref="Evaluate(string, TimeWindow, double[], double[], ConditioningSettings, SensorFaultLimits, DayStart)"/>
    /// <remarks>
    /// The values are the caller's to write over (a statistics thread's loaded channel, <see cref="GatheredWindow.Load"/>):
    /// when the gaps are cells without a value and the Hampel window is the usual one, the gaps are bridged and the
    /// spikes replaced in <paramref name="values"/> itself, each cell written recorded in <paramref name="edits"/>
    /// (so that the caller can put the loaded samples back for a second reduction), instead of in a second window-long
    /// array. The statistics are the same, bit for bit. Other windows are bridged into the thread's window arrays and
    /// de-spiked into <paramref name="copySlot"/>'s array: a caller whose values are that slot's array and who does not
    /// need them back after a failure (<see cref="GatheredChannel"/>) names it, so that a window with inserted samples
    /// needs no window-long array more than one without.
    /// </remarks>
    internal static ChannelWindowStats EvaluateInPlace(string channel, TimeWindow window, double[] timesS, Memory<double> values, SampleEdits edits, ConditioningSettings settings, SensorFaultLimits limits, DayStart dayStart = default,
        int copySlot = ScratchSlots.CleanSamples)
    {
        ArgumentNullException.ThrowIfNull(edits);
        return Evaluate(channel, window, timesS, values, values, edits, copySlot, settings, limits, dayStart);
    }

    private static ChannelWindowStats Evaluate(string channel, TimeWindow window, double[] timesS, ReadOnlyMemory<double> values, Memory<double> writable, SampleEdits? edits,
        int copySlot, ConditioningSettings settings, SensorFaultLimits limits, DayStart dayStart)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(timesS);
        var finite = values.Length - GapBridging.CountNonFinite(values.Span);
        if (finite < 3)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel),
                $"window '{window.Id}' ({dayStart.Since(window.Start).Value:F1}–{dayStart.Since(window.End).Value:F1} s since the first sample of the day) holds {finite} valid samples of '{channel}'; at least 3 are needed");
        }
        var search = GapBridging.Search(timesS, values.Span, settings.MaxBridgeS);
        var gaps = search.Report.Gaps;
        var interior = gaps.Where(g => !g.Bridged && !g.AtRecordEdge).ToList();
        var lostS = interior.Sum(g => g.DurationS);
        if (window.DurationS > 0 && lostS > LostFractionLimit * window.DurationS)
        {
            var gap = interior.OrderByDescending(g => g.DurationS).First();
            throw new WindowLostFailure(new SourceLocation("(logs)", Key: channel), string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"channel '{channel}' lost {lostS:F1} s of window '{window.Id}' ({dayStart.Since(window.Start).Value:F1}–{dayStart.Since(window.End).Value:F1} s since the first sample of the day) to {interior.Count} gap(s) longer than the {settings.MaxBridgeS:G} s that may be bridged, the longest {gap.DurationS:F1} s from {dayStart.Since(new LoggerSeconds(gap.StartS)).Value:F1} s; more than {LostFractionLimit:P0} of the window is too little left to stand for it"));
        }
        ReadOnlyMemory<double> keptTimes;
        ReadOnlyMemory<double> clean;
        IReadOnlyList<int> replaced;
        if (edits is not null && InPlace(timesS, writable, search, finite, settings, edits) is { } inPlace)
        {
            (keptTimes, clean, replaced) = (timesS, writable, inPlace);
        }
        else
        {
            ReadOnlyMemory<double> kept;
            (keptTimes, kept) = BridgedFiniteSamples(timesS, values, search, finite);
            // Scratch of the thread's current length or longer (no new array when the next channel keeps a sample more).
            // The caller's slot only when the kept samples were copied out of its values, which are dead then.
            var slot = kept.Span.Overlaps(values.Span) ? ScratchSlots.CleanSamples : copySlot;
            var into = ThreadScratch.Rent(slot, kept.Length).AsMemory(0, kept.Length);
            replaced = HampelFilter.ApplyInto(kept.Span, into.Span, settings.HampelHalfWindow, settings.HampelSigmas, settings.HampelScaleFloor);
            clean = into;
        }
        var faults = SensorFaults.Check(clean.Span, limits, out var min, out var max).Flags;
        // Every time reported is taken before the Type A evaluation: the bridged times and values share their arrays
        // with its transforms (ScratchSlots.WindowTimes).
        var report = new WindowConditioning(
            [.. gaps.Where(g => g.Bridged)], [.. gaps.Where(g => !g.Bridged && g.AtRecordEdge)],
            SpikeTimes(replaced, keptTimes),
            [.. faults.Select(f => new FaultVerdict(f, FaultSeverity.Warning, f.FirstIndex >= 0 && f.FirstIndex < keptTimes.Length ? keptTimes.Span[f.FirstIndex] : double.NaN))]);
        var typeA = WindowMean.Evaluate(clean);
        return new ChannelWindowStats(
            channel, window.Id, clean.Length, values.Length - finite, search.Report.InterpolatedSamples,
            replaced.Count, typeA.Mean, typeA.StandardDeviation, min, max, typeA, faults)
        {
            Conditioning = report with { UnbridgedGaps = interior },
        };
    }

    /// <summary>
    /// The largest part of a window (0.25) that gaps too long to bridge may take before the point fails. With three
    /// quarters left, the mean still stands for the whole window: the plateau is steady, so the missing quarter
    /// holds the same value, and the Type A uncertainty, taken over the samples on both sides of each gap, already
    /// carries the smaller sample count. Common practice, no standard behind the number.
    /// </summary>
    public const double LostFractionLimit = 0.25;

    /// <summary>
    /// Bridges and de-spikes <paramref name="valuesMemory"/> where they are, recording each cell written in
    /// <paramref name="edits"/>, and returns the replaced indices; or returns null with the values as they were
    /// (the caller then takes the copying path) when the series would change length (inserted samples, or cells
    /// left without a value) or the Hampel window is not the one done in place.
    /// </summary>
    private static List<int>? InPlace(double[] timesS, Memory<double> valuesMemory, GapSearch search, int finite, ConditioningSettings settings, SampleEdits edits)
    {
        var values = valuesMemory.Span;
        var nonFinite = values.Length - finite;
        if (search.Report.InsertedSamples != 0 || (nonFinite > 0 && search.BridgedPairs.Count == 0)
            || settings.HampelHalfWindow != TwentyOnePointWindow.HalfWindow || !TwentyOnePointWindow.IsAccelerated)
        {
            return null;
        }
        if (nonFinite > 0 && GapBridging.BridgeInPlace(timesS, values, search, edits) != nonFinite)
        {
            // Some cells stay without a value (a gap left open): the copying path drops them.
            edits.Undo(values);
            return null;
        }
        var replaced = new List<int>();
        var originals = new List<double>();
        if (!InPlaceHampel.TryApply(values, settings.HampelSigmas, settings.HampelScaleFloor, replaced, originals))
        {
            edits.Undo(values);
            return null;
        }
        edits.Record(replaced, originals);
        return replaced;
    }

    /// <summary>
    /// The bridged series without its NaN/∞ cells (those of gaps left open), with times: the given arrays themselves
    /// when nothing is bridged or dropped (the usual case), else the thread's scratch arrays, valid until its next window.
    /// </summary>
    private static (ReadOnlyMemory<double> TimesS, ReadOnlyMemory<double> Values) BridgedFiniteSamples(double[] timesS, ReadOnlyMemory<double> valuesMemory, GapSearch search, int finite)
    {
        if (search.BridgedPairs.Count == 0 && finite == valuesMemory.Length)
        {
            return (timesS, valuesMemory);
        }
        var values = valuesMemory.Span;
        var length = values.Length + search.Report.InsertedSamples;
        // These slots are the Type A transform's arrays (ScratchSlots.WindowTimes), which a slow channel of a window
        // this long grows to the transform's length: asked for at that length at once, they are made once, not once
        // at the window's length and again (the first pair then large-object garbage) for the transform.
        var capacity = Math.Max(length, LazyAutocorrelation.WholeWindowPoints(length));
        var t = ThreadScratch.Rent(ScratchSlots.WindowTimes, capacity);
        var x = ThreadScratch.Rent(ScratchSlots.WindowValues, capacity);
        var o = 0;
        if (search.BridgedPairs.Count == 0)
        {
            for (var i = 0; i < values.Length; i++)
            {
                t[o] = timesS[i];
                x[o] = values[i];
                o += double.IsFinite(values[i]) ? 1 : 0;
            }
            return (t.AsMemory(0, o), x.AsMemory(0, o));
        }
        // NaN cells keep their time stamps, so without inserted samples the times are the given ones.
        var sameTimes = search.Report.InsertedSamples == 0;
        length = GapBridging.AssembleInto(timesS, values, search, sameTimes ? [] : t, x, []);
        if (GapBridging.CountNonFinite(x.AsSpan(0, length)) == 0)
        {
            return (sameTimes ? timesS.AsMemory() : t.AsMemory(0, length), x.AsMemory(0, length));
        }
        var bridgedTimes = sameTimes ? timesS : t;
        for (var i = 0; i < length; i++)
        {
            t[o] = bridgedTimes[i];
            x[o] = x[i];
            o += double.IsFinite(x[i]) ? 1 : 0;
        }
        return (t.AsMemory(0, o), x.AsMemory(0, o));
    }

    private static List<double> SpikeTimes(IReadOnlyList<int> replaced, ReadOnlyMemory<double> keptTimes)
    {
        var times = keptTimes.Span;
        var result = new List<double>(replaced.Count);
        foreach (var i in replaced)
        {
            result.Add(times[i]);
        }
        return result;
    }
}
