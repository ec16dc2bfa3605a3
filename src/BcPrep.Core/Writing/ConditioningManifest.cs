using System.Globalization;
using System.Text.Json;
using BcPrep.Conditioning;
using BcPrep.Pipeline;
using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Writing;

/// <summary>The conditioning parts of the manifest and the summary: settings used, and per channel and window what was changed.</summary>
public static class ConditioningManifest
{
    /// <summary>At most this many spike times are listed per channel and window (the count is always complete).</summary>
    public const int ListedSpikeTimes = 10;

    /// <summary>Which signal feeds which stage; repeated in the manifest because it decides the Type A uncertainty.</summary>
    public const string SignalUse =
        "window mean and Type A uncertainty: gap-bridged, de-spiked, unfiltered samples (a low-pass narrows the scatter and would understate the uncertainty); " +
        "block means for steady detection and the day plots: conditioned samples (bridged, de-spiked, notch and low-pass) when a notch or low-pass is set, calibrated samples otherwise; " +
        "calibrate --conditioned writes the conditioned series";

    /// <summary>Writes the "conditioning" object of the conventions: the settings in force (SI).</summary>
    public static void WriteSettings(Utf8JsonWriter json, ConditioningSpec spec)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(spec);
        json.WriteStartObject("conditioning");
        json.WriteNumber("max_bridge_s", spec.MaxBridgeS);
        json.WriteNumber("hampel_half_window", spec.HampelHalfWindow);
        json.WriteNumber("hampel_sigmas", spec.HampelSigmas);
        json.WriteNumber("lowpass_order", spec.LowPassOrder);
        JsonFields.Number(json, "lowpass_cutoff_hz", spec.LowPassCutoffHz);
        JsonFields.Number(json, "mains_hz", spec.MainsHz);
        json.WriteNumber("notch_q", spec.NotchQ);
        json.WriteNumber("notch_harmonics", spec.NotchHarmonics);
        json.WriteString("zero_phase_edges", ChannelConditioner.PaddingMethod);
        json.WriteString("signal_use", SignalUse);
        json.WriteString("fault_policy", "implausible readings, or readings at a declared rail, on a channel the boundary conditions use fail the point (exit code 3); stuck channels, flat at the window's own extreme, and faults on 'other' channels are warnings");
        json.WriteEndObject();
    }

    /// <summary>Writes a channel's "conditioning" object: bridged and open gaps, spikes, faults; times in s since day start.</summary>
    public static void WriteChannel(Utf8JsonWriter json, ChannelWindowStats stats, DayStart dayStart)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(stats);
        if (stats.Conditioning is not { } c)
        {
            return;
        }
        json.WriteStartObject("conditioning");
        WriteGaps(json, "bridged_gaps", c.BridgedGaps, dayStart);
        WriteGaps(json, "open_edge_gaps", c.OpenEdgeGaps, dayStart);
        WriteGaps(json, "unbridged_gaps", c.UnbridgedGaps, dayStart);
        json.WriteNumber("spikes_replaced", c.SpikeTimesS.Count);
        json.WriteStartArray("first_spike_times_s");
        foreach (var t in c.SpikeTimesS.Take(ListedSpikeTimes))
        {
            json.WriteNumberValue(SinceStart(dayStart, t));
        }
        json.WriteEndArray();
        json.WriteStartArray("faults");
        foreach (var v in c.Faults)
        {
            json.WriteStartObject();
            json.WriteString("kind", v.Flag.Kind.ToString().ToLowerInvariant());
            json.WriteString("severity", v.Severity == FaultSeverity.Failure ? "failure" : "warning");
            json.WriteNumber("samples", v.Flag.SampleCount);
            JsonFields.Number(json, "fraction", v.Flag.Fraction);
            JsonFields.Number(json, "first_time_s", SinceStart(dayStart, v.FirstTimeS));
            JsonFields.Number(json, "evidence_value", v.Flag.EvidenceValue);
            json.WriteString("evidence", v.Flag.Evidence);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        json.WriteEndObject();
    }

    /// <summary>
    /// Compact summary cell of a point: "bridged B; spikes S; faults F" summed over its channels, and
    /// "; gaps G (L s)" when gaps too long to bridge were left open inside the window (count and seconds lost).
    /// </summary>
    public static string SummaryCell(PointResult point)
    {
        ArgumentNullException.ThrowIfNull(point);
        var channels = point.Channels.Values;
        var bridged = channels.Sum(s => s.BridgedSamples);
        var spikes = channels.Sum(s => s.SpikesReplaced);
        var faults = channels.Sum(s => s.Faults.Count);
        var open = channels.SelectMany(s => s.Conditioning?.UnbridgedGaps ?? []).ToList();
        var gaps = open.Count == 0 ? "" : string.Create(CultureInfo.InvariantCulture, $"; gaps {open.Count} ({open.Sum(g => g.DurationS):F1} s)");
        return string.Create(CultureInfo.InvariantCulture, $"bridged {bridged}; spikes {spikes}; faults {faults}{gaps}");
    }

    private static void WriteGaps(Utf8JsonWriter json, string name, IReadOnlyList<DataGap> gaps, DayStart dayStart)
    {
        json.WriteStartArray(name);
        foreach (var g in gaps)
        {
            json.WriteStartObject();
            json.WriteNumber("start_s", SinceStart(dayStart, g.StartS));
            json.WriteNumber("end_s", SinceStart(dayStart, g.EndS));
            json.WriteNumber("missing_samples", g.MissingSamples);
            json.WriteEndObject();
        }
        json.WriteEndArray();
    }

    // Conditioning works on plain arrays of logger-clock seconds; the manifest gives times since the first sample.
    private static double SinceStart(DayStart dayStart, double clockS) => dayStart.Since(new LoggerSeconds(clockS)).Value;
}
