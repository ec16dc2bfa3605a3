using System.Globalization;
using System.Text;

namespace BcPrep.Writing;

/// <summary>
/// The files one run writes, kept in memory until all are ready, then committed in two phases. Phase one writes
/// every file under a temporary name (<c>NAME.partial-PID</c>) beside its target and flushes it to disk; this is
/// where nearly all of the commit's time goes, and an interruption here leaves the previous outputs untouched. Phase
/// two removes the previous manifest, renames the files into place and writes the new manifest last. An
/// interruption during those few renames leaves a folder without manifest.json, which marks it incomplete; a folder
/// with a manifest always holds the files the manifest lists, with the hashes it records. Temporary files left by
/// an interrupted run are deleted by the next commit. A path that would land outside the output folder is refused.
/// </summary>
public sealed class OutputFileSet
{
    public const string ManifestFileName = "manifest.json";

    /// <summary>Marks a temporary file: <c>NAME.partial-PID</c>. Never an output; removed by the next commit.</summary>
    public const string PartialMarker = ".partial-";

    private readonly List<(string RelativePath, byte[] Content)> _files = [];

    public IReadOnlyList<(string RelativePath, byte[] Content)> Files => _files;

    public void Add(string relativePath, string text) => _files.Add((relativePath, new UTF8Encoding(false).GetBytes(text)));

    public void Add(string relativePath, byte[] content) => _files.Add((relativePath, content));

    /// <summary>SHA-256 (lower-case hex) of every file added so far, by relative path, in the order added.</summary>
    public IReadOnlyList<(string RelativePath, string Sha256)> Hashes() =>
        _files.Select(f => (f.RelativePath, Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(f.Content)))).ToList();

    /// <summary>True for a temporary file name of an interrupted commit (<c>NAME.partial-DIGITS</c>).</summary>
    public static bool IsPartialFileName(string fileName)
    {
        var at = fileName.LastIndexOf(PartialMarker, StringComparison.Ordinal);
        return at > 0 && at + PartialMarker.Length < fileName.Length && fileName.AsSpan(at + PartialMarker.Length).ContainsAnyExcept("0123456789") is false;
    }

    /// <summary>Writes every file under <paramref name="outputDirectory"/>; files named "manifest.json" go last.</summary>
    public void Commit(string outputDirectory)
    {
        var root = Path.GetFullPath(outputDirectory);
        var ordered = _files.OrderBy(f => IsManifest(f.RelativePath) ? 1 : 0).ToList();
        var targets = ordered.Select(f => Target(root, f.RelativePath)).ToList();
        var suffix = PartialMarker + Environment.ProcessId.ToString(CultureInfo.InvariantCulture);
        var written = new List<string>();
        try
        {
            Directory.CreateDirectory(root);
            RemoveStalePartials(OwnedDirectories(root, targets.Select(t => Path.GetDirectoryName(t)!)));
            for (var i = 0; i < ordered.Count; i++)
            {
                Directory.CreateDirectory(Path.GetDirectoryName(targets[i])!);
                var temporary = targets[i] + suffix;
                written.Add(temporary);
                using var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None);
                stream.Write(ordered[i].Content);
                stream.Flush(flushToDisk: true);
            }
            foreach (var manifest in targets.Where(IsManifest))
            {
                File.Delete(manifest);
            }
            for (var i = 0; i < ordered.Count; i++)
            {
                File.Move(targets[i] + suffix, targets[i], overwrite: true);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            DeleteQuietly(written);
            throw new BcPrepFailure(FailureKind.Output, new SourceLocation(outputDirectory), "cannot write the outputs: " + e.Message);
        }
    }

    private static bool IsManifest(string path) => Path.GetFileName(path) == ManifestFileName;

    /// <summary>
    /// Deletes temporary files of interrupted runs in the folders of the given output files (only there: the output
    /// folder may be a busy directory, and it is not ours to sweep). Used when a run finds nothing to recompute.
    /// </summary>
    public static void RemoveStalePartials(string outputDirectory, IEnumerable<string> relativePaths)
    {
        var root = Path.GetFullPath(outputDirectory);
        try
        {
            RemoveStalePartials(OwnedDirectories(root, relativePaths.Select(r => Path.GetDirectoryName(Target(root, r))!)));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new BcPrepFailure(FailureKind.Output, new SourceLocation(outputDirectory), "cannot remove temporary files of an interrupted run: " + e.Message);
        }
    }

    /// <summary>
    /// The folders a run may sweep: those its files go to, plus every point folder under points/ (a folder of ours
    /// alone), where an interrupted run of a day with other points may have left temporaries.
    /// </summary>
    private static IEnumerable<string> OwnedDirectories(string root, IEnumerable<string> targetDirectories)
    {
        var points = Path.Combine(root, "points");
        var pointFolders = Directory.Exists(points) ? Directory.EnumerateDirectories(points) : [];
        return targetDirectories.Concat(pointFolders).Distinct(StringComparer.Ordinal).ToList();
    }

    private static void RemoveStalePartials(IEnumerable<string> directories)
    {
        foreach (var directory in directories.Where(Directory.Exists))
        {
            foreach (var path in Directory.EnumerateFiles(directory, "*" + PartialMarker + "*", SearchOption.TopDirectoryOnly))
            {
                if (IsPartialFileName(Path.GetFileName(path)))
                {
                    File.Delete(path);
                }
            }
        }
    }

    private static void DeleteQuietly(IEnumerable<string> paths)
    {
        foreach (var path in paths)
        {
            try
            {
                File.Delete(path);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
            }
        }
    }

    private static string Target(string root, string relative)
    {
        var target = Path.GetFullPath(Path.Combine(root, relative));
        if (!target.StartsWith(root + Path.DirectorySeparatorChar, StringComparison.Ordinal))
        {
            throw new BcPrepFailure(FailureKind.Output, new SourceLocation(relative), $"refusing to write outside the output folder {root}");
        }
        return target;
    }
}
