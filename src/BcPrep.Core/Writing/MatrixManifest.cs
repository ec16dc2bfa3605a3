using System.Text.Json;
using BcPrep.Pipeline;

namespace BcPrep.Writing;

/// <summary>
/// Writes the manifest's "test_matrix" section: the matrix file, each matched point with its original id, the row
/// it matched and every planned value against the measured one, the points no row admits, and the planned points
/// no operating point reached.
/// </summary>
public static class MatrixManifest
{
    public static void Write(Utf8JsonWriter json, DayResult day, InputFingerprint? file)
    {
        if (day.Matrix is not { } report)
        {
            return;
        }
        json.WriteStartObject("test_matrix");
        json.WriteString("file", file?.Name ?? report.SourceFile);
        if (file is not null)
        {
            json.WriteString("sha256", file.Sha256);
        }
        json.WriteString("rule", "a point matches the row whose every planned value lies within its tolerance of the measured value; values in SI");
        json.WriteStartArray("matched");
        foreach (var match in report.Matches)
        {
            json.WriteStartObject();
            json.WriteString("id", match.NewId);
            json.WriteString("window_id", match.PointId);
            json.WriteString("row", match.Row.Name);
            json.WriteNumber("line", match.Row.Location.Line ?? 0);
            json.WriteStartArray("set_points");
            foreach (var deviation in match.Deviations)
            {
                json.WriteStartObject();
                json.WriteString("quantity", deviation.Quantity);
                json.WriteNumber("planned", deviation.PlannedSi);
                json.WriteNumber("measured", deviation.MeasuredSi);
                json.WriteNumber("tolerance", deviation.ToleranceSi);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteEndObject();
        }
        json.WriteEndArray();
        JsonFields.Strings(json, "unmatched_points", report.UnmatchedPoints);
        json.WriteStartArray("rows_without_point");
        foreach (var row in report.RowsWithoutPoint)
        {
            json.WriteStartObject();
            json.WriteString("row", row.Name);
            json.WriteNumber("line", row.Location.Line ?? 0);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        JsonFields.Strings(json, "warnings", report.Warnings);
        json.WriteEndObject();
    }
}
