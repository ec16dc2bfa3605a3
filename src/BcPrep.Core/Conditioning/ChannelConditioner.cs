namespace BcPrep.Conditioning;

/// <summary>Runs the conditioning chain on one channel.</summary>
public static class ChannelConditioner
{
    /// <summary>Text written to the manifest for the edge handling of zero-phase filtering.</summary>
    public const string PaddingMethod =
        "odd extension about each end sample over the section's settling length (to 1e-14), from its steady state, section by section";

    /// <summary>
    /// Gaps are bridged first (<see cref="GapBridging.Bridge(ReadOnlySpan{double}, ReadOnlySpan{double}, double)"/>); Hampel spike removal runs on the result; notch and
    /// low-pass run zero-phase on each gap-free segment separately (NaN cells and unbridged time jumps cut segments),
    /// because filtering across a gap would smear invented values. Sample rate = 1 / nominal interval.
    /// The mains notch is skipped when the mains frequency is not below Nyquist (NotchFrequenciesHz stays empty).
    /// Edges: each second-order section in turn runs over an odd extension of the segment (point reflection about the
    /// end sample) as long as its settling to 1e-14, from its steady state at the extension's first value, or over the
    /// whole segment reflected when that is shorter (<see cref="EdgePad"/>). A cascade of zero-phase sections is zero-phase with gain ∏|Hᵢ|², the gain of forward–backward over the
    /// whole cascade, and each biquad stays well conditioned where the expanded transfer function of a low cutoff
    /// would not. Segments not longer than the scipy default pad are set to NaN and counted in the report.
    /// </summary>
    /// <exception cref="BcPrepDataException">Invalid settings or time stamps (see the step functions).</exception>
    public static ConditionedSeries Condition(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, ConditioningSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var gaps = GapBridging.Bridge(timesS, values, settings.MaxBridgeS);
        var hampel = HampelFilter.Apply(gaps.Values, settings.HampelHalfWindow, settings.HampelSigmas, settings.HampelScaleFloor);
        double[] x = hampel.Values;
        double fs = 1.0 / gaps.Report.NominalIntervalS;

        var sections = new List<SecondOrderSection>();
        var notches = new List<double>();
        // A notch is only possible below Nyquist: at a low sample rate the logger's own anti-alias filter and
        // integration time are what suppress mains pickup, and the report's empty notch list says so.
        if (settings.MainsHz is double mains && mains < fs / 2.0)
        {
            var notch = MainsNotch.WithHarmonics(mains, settings.NotchQ, settings.NotchHarmonics, fs);
            sections.AddRange(notch.Sections);
            notches.AddRange(Enumerable.Range(1, notch.Sections.Count).Select(k => k * mains));
        }

        if (settings.LowPassCutoffHz is double cutoff)
        {
            sections.AddRange(ButterworthDesign.LowPass(settings.LowPassOrder, cutoff, fs).Sections);
        }

        int segments = 0, unfiltered = 0;
        if (sections.Count > 0)
        {
            (segments, unfiltered) = FilterSegments(gaps.TimesS, x, sections, 1.5 * gaps.Report.NominalIntervalS);
        }

        var spikeTimes = hampel.ReplacedIndices.Select(i => gaps.TimesS[i]).ToArray();
        var report = new ConditioningReport(gaps.Report, hampel.ReplacedIndices.Count, spikeTimes, notches,
            settings.LowPassCutoffHz, segments, unfiltered, sections.Count > 0 ? PaddingMethod : "none");
        return new ConditionedSeries(gaps.TimesS, x, gaps.Interpolated, report);
    }

    /// <summary>Zero-phase filtering in place, one section after the other, each padded by <see cref="EdgePad"/>.</summary>
    internal static void FilterZeroPhase(IReadOnlyList<SecondOrderSection> sections, Span<double> x)
    {
        foreach (var section in sections)
        {
            ZeroPhaseFilter.ForwardBackwardPadded([section], x, EdgePad(section, x.Length)).CopyTo(x);
        }
    }

    /// <summary>
    /// The odd extension of one section at a segment's ends: its settling length to <see cref="StreamingConditioner.SeamResidual"/>,
    /// so that the extension's start no longer shows at the segment, or the whole segment (less its end sample) when shorter.
    /// Gustafsson's initial states were used before: with a low cutoff or a narrow notch (poles near z = 1) they are
    /// nearly undetermined, and both that solve and an independent implementation of it left each segment's ends
    /// ramping up from about 0 instead of starting at the signal's level.
    /// </summary>
    internal static int EdgePad(SecondOrderSection section, int segmentLength) =>
        Math.Min(ZeroPhaseFilter.SettlingPadLength([section], StreamingConditioner.SeamResidual), segmentLength - 1);

    private static (int Segments, int Unfiltered) FilterSegments(double[] t, double[] x, List<SecondOrderSection> sections, double jumpS)
    {
        int minimumPad = ZeroPhaseFilter.DefaultPadLength(sections);
        int segments = 0, unfiltered = 0;
        int start = 0;
        while (start < x.Length)
        {
            if (!double.IsFinite(x[start]))
            {
                start++;
                continue;
            }

            int end = start + 1;
            while (end < x.Length && double.IsFinite(x[end]) && t[end] - t[end - 1] <= jumpS)
            {
                end++;
            }

            int length = end - start;
            if (length > minimumPad)
            {
                FilterZeroPhase(sections, x.AsSpan(start, length));
                segments++;
            }
            else
            {
                x.AsSpan(start, length).Fill(double.NaN);
                unfiltered += length;
            }

            start = end;
        }

        return (segments, unfiltered);
    }
}
