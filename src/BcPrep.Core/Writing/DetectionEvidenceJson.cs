using System.Text.Json;
using BcPrep.Pipeline;
using BcPrep.Steady;

namespace BcPrep.Writing;

/// <summary>
/// The steady-detection part of the manifest: at day level the settings, the rejected stretches with each failed
/// criterion (value and limit) and the detection warnings; per point the detected window(s) behind it, the methods
/// that accepted them and every key channel's criterion values. Times in s since the first sample of the day.
/// </summary>
public static class DetectionEvidenceJson
{
    /// <summary>Writes the day-level "detection" object (null when detection did not run).</summary>
    public static void WriteDay(Utf8JsonWriter json, DayResult day)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(day);
        if (day.Detection is not { } detection)
        {
            json.WriteNull("detection");
            return;
        }
        var steady = day.Rig.Steady;
        var settings = WindowFinder.Settings(steady);
        json.WriteStartObject("detection");
        json.WriteStartObject("settings");
        JsonFields.Number(json, "block_s", steady.BlockS);
        JsonFields.Number(json, "window_s", settings.WindowS);
        JsonFields.Number(json, "step_s", settings.StepS);
        JsonFields.Number(json, "min_duration_s", settings.MinStretchS);
        JsonFields.Number(json, "settled_tail_s", settings.TailS);
        JsonFields.Number(json, "drift_coverage_factor", settings.DriftCoverageFactor);
        json.WriteString("required_methods", WindowTable.Methods(settings.RequiredMethods));
        json.WriteStartArray("keys");
        foreach (var key in steady.Keys)
        {
            json.WriteStartObject();
            json.WriteString("channel", key.Channel);
            JsonFields.Number(json, "max_change", key.MaxChangeSi);
            JsonFields.Number(json, "drift_limit_per_s", key.MaxChangeSi / steady.WindowS);
            JsonFields.Number(json, "max_scatter", key.MaxScatterSi);
            JsonFields.Number(json, "step", key.StepSi);
            JsonFields.Number(json, "min", key.MinimumSi ?? double.NaN);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        json.WriteEndObject();
        json.WriteNumber("accepted_windows", detection.Accepted.Count);
        json.WriteStartArray("rejected");
        foreach (var r in detection.Rejected)
        {
            json.WriteStartObject();
            JsonFields.Number(json, "start_s", r.StartS);
            JsonFields.Number(json, "end_s", r.EndS);
            JsonFields.Number(json, "evaluated_start_s", r.EvaluatedStartS);
            JsonFields.Number(json, "evaluated_end_s", r.EvaluatedEndS);
            json.WriteString("reason", r.Reason);
            WriteChannels(json, r.Channels);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        JsonFields.Strings(json, "warnings", day.Warnings);
        json.WriteEndObject();
    }

    /// <summary>
    /// Writes a point's "detection" object: for a detected point the window it is; for a pinned point the detected
    /// windows it replaces (empty when detection found none there). Null when detection did not run.
    /// </summary>
    public static void WritePoint(Utf8JsonWriter json, DayResult day, PointResult point)
    {
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(day);
        ArgumentNullException.ThrowIfNull(point);
        if (day.Detection is null)
        {
            json.WriteNull("detection");
            return;
        }
        var pinned = day.Rig.Points.Select(p => new TimeWindow(p.Id, day.Start.Resolve(p.Start).Value, day.Start.Resolve(p.End).Value)).ToList();
        var planned = PointWindows.Plan(pinned, day.Detection, day.Start).Points.FirstOrDefault(p => p.Window.Id == point.Id);
        json.WriteStartObject("detection");
        json.WriteString("relation", point.Origin == WindowOrigin.Detected ? "this window" : "detected windows replaced by the pinned window");
        json.WriteStartArray("windows");
        foreach (var w in planned?.Detected ?? [])
        {
            json.WriteStartObject();
            json.WriteString("accepted_by", WindowTable.Methods(w.AcceptedBy));
            JsonFields.Number(json, "start_s", w.StartS);
            JsonFields.Number(json, "end_s", w.EndS);
            JsonFields.Number(json, "stretch_start_s", w.StretchStartS);
            JsonFields.Number(json, "stretch_end_s", w.StretchEndS);
            WriteChannels(json, w.Channels);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        json.WriteEndObject();
    }

    private static void WriteChannels(Utf8JsonWriter json, IReadOnlyList<ChannelCriteria> channels)
    {
        json.WriteStartArray("channels");
        foreach (var c in channels)
        {
            json.WriteStartObject();
            json.WriteString("id", c.Channel);
            JsonFields.Number(json, "mean", c.Mean);
            JsonFields.Number(json, "slope_per_s", c.SlopePerS);
            JsonFields.Number(json, "slope_standard_uncertainty_per_s", c.SlopeUncertaintyPerS);
            JsonFields.Number(json, "residual_ar1", c.ResidualAr1);
            JsonFields.Number(json, "drift_limit_per_s", c.DriftLimitPerS);
            JsonFields.Number(json, "standard_deviation", c.StandardDeviation);
            JsonFields.Number(json, "scatter_limit", c.ScatterLimit);
            JsonFields.Number(json, "r", c.R);
            JsonFields.Number(json, "r_critical", c.RCritical);
            JsonFields.Number(json, "mser_truncation_s", c.MserTruncationS);
            JsonFields.Number(json, "tau_s", c.TauS);
            JsonFields.Number(json, "remaining_change", c.RemainingChange);
            JsonFields.Number(json, "tolerance", c.Tolerance);
            JsonFields.Number(json, "settled_since_s", c.SettledSinceS);
            json.WriteStartArray("failed");
            foreach (var f in c.Failures)
            {
                json.WriteStartObject();
                json.WriteString("criterion", ChoiceSpelling.Name(f.Criterion));
                JsonFields.Number(json, "value", f.Value);
                JsonFields.Number(json, "limit", f.Limit);
                json.WriteString("description", f.Description);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteEndObject();
        }
        json.WriteEndArray();
    }
}
