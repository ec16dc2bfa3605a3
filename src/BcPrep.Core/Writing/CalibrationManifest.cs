using System.Globalization;
using System.Text.Json;
using BcPrep.Lab;

namespace BcPrep.Writing;

/// <summary>
/// Writes the manifest's "calibration" section: the test dates the due dates were checked against (from the logs or
/// the rig file, never the clock, so the manifest stays reproducible), every channel's certificate, calibration and
/// due dates with its standing, and which expired calibrations were explicitly allowed.
/// </summary>
public static class CalibrationManifest
{
    public static void Write(Utf8JsonWriter json, CalibrationReport? report)
    {
        if (report is null)
        {
            return;
        }
        json.WriteStartObject("calibration");
        json.WriteStartObject("test_dates");
        WriteDate(json, "first", report.Dates.First);
        WriteDate(json, "last", report.Dates.Last);
        json.WriteString("source", SourceText(report.Dates.Source));
        json.WriteEndObject();
        json.WriteString("rule", "a sensor may be used up to and including its calibration due date; later use fails unless explicitly allowed");
        JsonFields.Strings(json, "allow_expired", report.AllowExpired);
        json.WriteStartArray("channels");
        foreach (var channel in report.Channels)
        {
            json.WriteStartObject();
            json.WriteString("id", channel.Channel);
            WriteText(json, "certificate", channel.Certificate);
            WriteDate(json, "calibrated", channel.CalibratedOn);
            WriteDate(json, "due", channel.DueOn);
            WriteText(json, "interval", channel.Interval);
            json.WriteString("state", StateText(channel.State));
            json.WriteBoolean("expired_use_allowed", channel.Overridden);
            json.WriteEndObject();
        }
        json.WriteEndArray();
        JsonFields.Strings(json, "warnings", report.Warnings);
        json.WriteEndObject();
    }

    public static string StateText(CalibrationState state) => state switch
    {
        CalibrationState.Valid => "valid",
        CalibrationState.Expired => "expired",
        CalibrationState.NoDueDate => "no due date",
        _ => "not checked (test date unknown)",
    };

    private static string SourceText(TestDateSource source) => source switch
    {
        TestDateSource.LogTimestamps => "log timestamps (first and last sample)",
        TestDateSource.RigFile => "rig file [log] test_date",
        TestDateSource.Given => "given by the caller",
        _ => "unknown",
    };

    private static void WriteDate(Utf8JsonWriter json, string name, DateOnly? date)
    {
        if (date is { } d)
        {
            json.WriteString(name, d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
        }
        else
        {
            json.WriteNull(name);
        }
    }

    private static void WriteText(Utf8JsonWriter json, string name, string? text)
    {
        if (text is null)
        {
            json.WriteNull(name);
        }
        else
        {
            json.WriteString(name, text);
        }
    }
}
