using System.Security.Cryptography;

namespace BcPrep.Tests.Cli.Support;

/// <summary>The bundled sample test day (sample-logs/) and helpers to derive variants of it.</summary>
internal static class SampleDay
{
    /// <summary>
    /// The sample rig with its three windows pinned by hand (tests/marten-rig-pinned.toml), which the results these
    /// tests compare were taken on; the bundled sample rig itself relies on detection (<see cref="BundledRig"/>).
    /// </summary>
    public static string Rig { get; } = Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml");

    /// <summary>The bundled sample rig, as README's main command uses it: no pinned window, the points detected.</summary>
    public static string BundledRig { get; } = Path.Combine(RepoRoot.Path, "sample-logs", "marten-rig.toml");

    public static string Morning { get; } = Path.Combine(RepoRoot.Path, "sample-logs", "marten-2026-11-24-am.csv");

    public static string Afternoon { get; } = Path.Combine(RepoRoot.Path, "sample-logs", "marten-2026-11-24-pm.csv");

    public static string[] Logs => [Morning, Afternoon];

    /// <summary>The args of `process` on the sample day into <paramref name="outDir"/>.</summary>
    public static string[] ProcessArgs(string outDir, params string[] extra) => ["process", Rig, Morning, Afternoon, "--out", outDir, .. extra];

    /// <summary>The sample rig file with its pinned [[point]] tables removed (operating points are then detected).</summary>
    public static string RigWithoutPinnedPoints()
    {
        var lines = File.ReadAllLines(Rig);
        var kept = new List<string>();
        var skipping = false;
        foreach (var line in lines)
        {
            if (line.StartsWith('['))
            {
                skipping = line.Trim() == "[[point]]";
            }
            if (!skipping)
            {
                kept.Add(line);
            }
        }
        return string.Join("\n", kept) + "\n";
    }

    /// <summary>
    /// Relative path → content of every file under a folder, in ordinal path order; the lock file of a run (which a
    /// run killed outright leaves behind, holding a dead process id) is not part of a result.
    /// </summary>
    public static SortedDictionary<string, byte[]> Snapshot(string folder) =>
        new(Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories)
            .Where(f => Path.GetRelativePath(folder, f) != BcPrep.Writing.ResultFolder.LockFileName)
            .ToDictionary(f => Path.GetRelativePath(folder, f).Replace('\\', '/'), File.ReadAllBytes), StringComparer.Ordinal);

    public static string Sha256(byte[] bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));
}
