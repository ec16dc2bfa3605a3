using System.Text;
using System.Text.Json;
using BcPrep.Pipeline;
using BcPrep.Profiles;

namespace BcPrep.Writing;

/// <summary>
/// Writes the run manifest: provenance (tool version, SHA-256 of the rig file and of every log), the conventions
/// used, and per operating point its window, conditioning actions, checks, warnings and every quantity with its
/// uncertainty and budget. Keys are in a fixed order and nothing depends on the clock, so the same inputs give
/// the same bytes.
/// </summary>
public static class ManifestWriter
{
    public const int FormatVersion = 1;

    // outputHashes: SHA-256 of every other output file, written as "file_sha256" so that a reader can check that
    // the files beside the manifest are the ones it describes (null: the key is left out).
    public static string Write(DayResult day, RunProvenance provenance, IReadOnlyList<string> files, IReadOnlyList<(string RelativePath, string Sha256)>? outputHashes = null) =>
        Encoding.UTF8.GetString(WriteUtf8(day, provenance, files, outputHashes));

    /// <summary>
    /// The manifest as the UTF-8 bytes of <see cref="Write"/> (no byte-order mark), made without the text in between: a
    /// long day's manifest runs to megabytes (6 MB for 8 h at 1 kHz), and its string and a second encoding of it were
    /// about 18 MB more at the very end of the run, where peak memory was reached.
    /// </summary>
    public static byte[] WriteUtf8(DayResult day, RunProvenance provenance, IReadOnlyList<string> files, IReadOnlyList<(string RelativePath, string Sha256)>? outputHashes = null)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            json.WriteStartObject();
            json.WriteString("format", "bcprep-manifest");
            json.WriteNumber("format_version", FormatVersion);
            json.WriteStartObject("tool");
            json.WriteString("name", "bcprep");
            json.WriteString("version", provenance.ToolVersion);
            json.WriteEndObject();
            json.WriteString("run_key", provenance.Key);
            JsonFields.Strings(json, "cautions", Cautions.All);
            json.WriteStartObject("rig");
            json.WriteString("name", day.Rig.Name);
            WriteFingerprint(json, provenance.Rig);
            json.WriteEndObject();
            json.WriteStartArray("logs");
            foreach (var log in provenance.Logs)
            {
                json.WriteStartObject();
                WriteFingerprint(json, log);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            WriteConventions(json, day);
            CalibrationManifest.Write(json, day.Calibration);
            MatrixManifest.Write(json, day, provenance.Matrix);
            DetectionEvidenceJson.WriteDay(json, day);
            json.WriteStartArray("points");
            foreach (var point in day.Points)
            {
                WritePoint(json, day, point);
            }
            json.WriteEndArray();
            json.WriteStartArray("failed_points");
            foreach (var failed in day.FailedPoints)
            {
                json.WriteStartObject();
                json.WriteString("id", failed.Id);
                JsonFields.Number(json, "start_s", day.Start.Since(failed.Start).Value);
                JsonFields.Number(json, "end_s", day.Start.Since(failed.End).Value);
                json.WriteString("reason", failed.Reason);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            JsonFields.Strings(json, "files", files);
            if (outputHashes is not null)
            {
                json.WriteStartObject("file_sha256");
                foreach (var (path, sha256) in outputHashes)
                {
                    json.WriteString(path, sha256);
                }
                json.WriteEndObject();
            }
            json.WriteEndObject();
        }
        var bytes = new byte[stream.Length + 1];
        stream.GetBuffer().AsSpan(0, (int)stream.Length).CopyTo(bytes);
        bytes[^1] = (byte)'\n';
        return bytes;
    }

    private static void WriteFingerprint(Utf8JsonWriter json, InputFingerprint fingerprint)
    {
        json.WriteString("file", fingerprint.Name);
        json.WriteNumber("bytes", fingerprint.Bytes);
        json.WriteString("sha256", fingerprint.Sha256);
    }

    private static void WriteConventions(Utf8JsonWriter json, DayResult day)
    {
        json.WriteStartObject("conventions");
        json.WriteString("units", "SI throughout: Pa (absolute), K, kg/s, m, W");
        json.WriteString("time", "window times in s since the first sample of the day; day_start in s since 1970-01-01 UTC when the log has dates, else on the logger clock");
        JsonFields.Number(json, "day_start", day.Start.FirstSample.Value);
        JsonFields.Number(json, "coverage_probability", day.Rig.CoverageProbability);
        json.WriteString("expanded_uncertainty", "U = k u, k from Student's t at the effective degrees of freedom (Welch-Satterthwaite; conservative rule with correlated inputs)");
        json.WriteString("type_a", "window mean of de-spiked, unfiltered samples; standard uncertainty corrected for autocorrelation (integrated autocorrelation time, Sokal window)");
        json.WriteString("turbulence", InletTurbulence.ConventionDescription);
        json.WriteString("properties", Physics.DryAir.PropertySourceDescription);
        ConditioningManifest.WriteSettings(json, day.Rig.Conditioning);
        json.WriteEndObject();
    }

    private static void WritePoint(Utf8JsonWriter json, DayResult day, PointResult point)
    {
        json.WriteStartObject();
        json.WriteString("id", point.Id);
        json.WriteString("window_origin", point.Origin == WindowOrigin.RigFile ? "rig file" : "detected");
        json.WriteStartObject("window");
        JsonFields.Number(json, "start_s", day.Start.Since(point.Window.Start).Value);
        JsonFields.Number(json, "end_s", day.Start.Since(point.Window.End).Value);
        JsonFields.Number(json, "duration_s", point.Window.DurationS);
        json.WriteEndObject();
        json.WriteStartArray("checks");
        foreach (var check in point.Checks)
        {
            json.WriteStartObject();
            json.WriteString("name", check.Name);
            json.WriteString("verdict", check.Passed ? "pass" : "warn");
            JsonFields.Number(json, "value", check.Value);
            JsonFields.Number(json, "limit", check.Limit);
            json.WriteString("unit", check.Unit);
            json.WriteString("basis", check.Basis);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        JsonFields.Strings(json, "warnings", point.Warnings);
        ManifestBoundary.Write(json, point);
        DetectionEvidenceJson.WritePoint(json, day, point);
        json.WriteStartArray("channels");
        foreach (var stats in point.Channels.Values.OrderBy(s => s.Channel, StringComparer.Ordinal))
        {
            json.WriteStartObject();
            json.WriteString("id", stats.Channel);
            json.WriteNumber("samples", stats.SampleCount);
            json.WriteNumber("missing_cells", stats.MissingCount);
            json.WriteNumber("bridged_samples", stats.BridgedSamples);
            json.WriteNumber("spikes_replaced", stats.SpikesReplaced);
            JsonFields.Number(json, "mean", stats.Mean);
            JsonFields.Number(json, "standard_deviation", stats.StandardDeviation);
            JsonFields.Number(json, "type_a_standard_uncertainty", stats.TypeA.StandardUncertainty);
            JsonFields.Number(json, "effective_samples", stats.TypeA.EffectiveSampleCount);
            JsonFields.Number(json, "naive_standard_uncertainty", stats.TypeA.NaiveStandardUncertainty);
            JsonFields.Strings(json, "faults", stats.Faults.Select(f => $"{ChoiceSpelling.Name(f.Kind)}: {f.Evidence}").ToList());
            ConditioningManifest.WriteChannel(json, stats, day.Start);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        json.WriteStartArray("quantities");
        for (var i = 0; i < point.Model.Outputs.Count; i++)
        {
            var definition = point.Model.Outputs[i];
            var g = point.Gum.Outputs[i];
            json.WriteStartObject();
            json.WriteString("name", definition.Name);
            json.WriteString("unit", definition.Unit);
            JsonFields.Number(json, "value", g.Estimate);
            JsonFields.Number(json, "standard_uncertainty", g.StandardUncertainty);
            JsonFields.Number(json, "expanded_uncertainty", g.ExpandedUncertainty);
            JsonFields.Number(json, "coverage_factor", g.CoverageFactor);
            JsonFields.Number(json, "degrees_of_freedom", g.DegreesOfFreedom);
            if (point.MonteCarlo is { } mc)
            {
                json.WriteStartObject("monte_carlo");
                JsonFields.Number(json, "value", mc.Outputs[i].Estimate);
                JsonFields.Number(json, "standard_uncertainty", mc.Outputs[i].StandardUncertainty);
                JsonFields.Number(json, "interval_low", mc.Outputs[i].Low);
                JsonFields.Number(json, "interval_high", mc.Outputs[i].High);
                json.WriteBoolean("gum_validated", point.Validation![i].IsValidated);
                json.WriteEndObject();
            }
            if (definition.Kind != QuantityKind.ProfilePoint)
            {
                json.WriteStartArray("budget");
                foreach (var line in g.Budget.Where(b => b.VarianceShare > 0).OrderByDescending(b => b.VarianceShare))
                {
                    json.WriteStartObject();
                    json.WriteString("input", line.InputName);
                    json.WriteString("type", line.Evaluation == Uncertainty.EvaluationType.TypeA ? "A" : "B");
                    JsonFields.Number(json, "contribution", line.Contribution);
                    JsonFields.Number(json, "variance_share", line.VarianceShare);
                    json.WriteEndObject();
                }
                json.WriteEndArray();
            }
            json.WriteEndObject();
        }
        json.WriteEndArray();
        CovarianceTables.WriteManifest(json, point);
        json.WriteEndObject();
    }
}
