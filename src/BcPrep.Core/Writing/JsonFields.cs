using System.Text.Json;

namespace BcPrep.Writing;

/// <summary>The few field shapes every part of the manifest writes, written the same way everywhere.</summary>
internal static class JsonFields
{
    /// <summary>JSON has no NaN or infinity: a missing or non-finite number is written as null.</summary>
    public static void Number(Utf8JsonWriter json, string name, double? value)
    {
        if (value is { } v && double.IsFinite(v))
        {
            json.WriteNumber(name, v);
        }
        else
        {
            json.WriteNull(name);
        }
    }

    public static void Strings(Utf8JsonWriter json, string name, IEnumerable<string> values)
    {
        json.WriteStartArray(name);
        foreach (var value in values)
        {
            json.WriteStringValue(value);
        }
        json.WriteEndArray();
    }
}
