using System.Security.Cryptography;
using System.Text.Json;
using BcPrep.Writing;

namespace BcPrep.Cli;

/// <summary>
/// Decides whether an output folder already holds the result of a run: its manifest records the same run key
/// (tool version and SHA-256 of the rig file and every log) and every file the manifest lists is present with the
/// SHA-256 the manifest records. A folder left without manifest by an interrupted commit, a table edited by hand,
/// or a manifest without file hashes is not up to date, so the next run recomputes.
/// </summary>
public static class ExistingOutputs
{
    /// <summary>The files a manifest lists (relative paths); empty when there is no readable manifest.</summary>
    public static IReadOnlyList<string> ListedFiles(string outputDirectory)
    {
        try
        {
            using var document = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(outputDirectory, DayOutputs.ManifestName)));
            return document.RootElement.GetProperty("files").EnumerateArray().Select(f => f.GetString() ?? "").Where(f => f.Length > 0).ToList();
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException or InvalidOperationException or KeyNotFoundException)
        {
            return [];
        }
    }

    /// <summary>
    /// Whether the manifest lists points that failed (exit code 6 again when an up-to-date folder is not recomputed,
    /// so that a script learns the same thing from every call); false without a readable manifest.
    /// </summary>
    public static bool HasFailedPoints(string outputDirectory)
    {
        try
        {
            using var document = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(outputDirectory, DayOutputs.ManifestName)));
            return document.RootElement.TryGetProperty("failed_points", out var failed) && failed.GetArrayLength() > 0;
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException or InvalidOperationException)
        {
            return false;
        }
    }

    /// <summary>
    /// A cheap first test: false when the folder cannot be up to date whatever the logs hash to (no manifest, or
    /// its logs have other sizes). Only when it is true are the logs hashed before the run; otherwise hashing
    /// overlaps the processing.
    /// </summary>
    public static bool MayBeUpToDate(string outputDirectory, IEnumerable<long> logBytes)
    {
        try
        {
            var manifest = Path.Combine(outputDirectory, DayOutputs.ManifestName);
            if (!File.Exists(manifest))
            {
                return false;
            }
            using var document = JsonDocument.Parse(File.ReadAllBytes(manifest));
            var recorded = document.RootElement.GetProperty("logs").EnumerateArray().Select(l => l.GetProperty("bytes").GetInt64()).Order();
            return recorded.SequenceEqual(logBytes.Order());
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException or InvalidOperationException or KeyNotFoundException or FormatException)
        {
            return false;
        }
    }

    public static bool IsUpToDate(string outputDirectory, string runKey)
    {
        var manifest = Path.Combine(outputDirectory, DayOutputs.ManifestName);
        try
        {
            if (!File.Exists(manifest))
            {
                return false;
            }
            using var document = JsonDocument.Parse(File.ReadAllBytes(manifest));
            var root = document.RootElement;
            if (!root.TryGetProperty("run_key", out var key) || key.GetString() != runKey ||
                !root.TryGetProperty("files", out var files) || !root.TryGetProperty("file_sha256", out var hashes))
            {
                return false;
            }
            foreach (var file in files.EnumerateArray().Select(f => f.GetString() ?? ""))
            {
                if (file == DayOutputs.ManifestName)
                {
                    continue;
                }
                var path = Path.Combine(outputDirectory, file);
                if (!hashes.TryGetProperty(file, out var expected) || !File.Exists(path) ||
                    expected.GetString() != Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(path))))
                {
                    return false;
                }
            }
            return true;
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException or InvalidOperationException)
        {
            // An unreadable or malformed manifest is no proof of anything: recompute.
            return false;
        }
    }
}
