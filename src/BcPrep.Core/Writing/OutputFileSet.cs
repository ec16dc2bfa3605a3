using System.Text;

namespace BcPrep.Writing;

/// <summary>
/// The files one run writes, kept in memory until all are ready, then committed one by one through a temporary
/// name and an atomic rename, the manifest last. An interrupted run leaves the previous outputs intact; a path
/// that would land outside the output folder is refused.
/// </summary>
public sealed class OutputFileSet
{
    private readonly List<(string RelativePath, byte[] Content)> _files = [];

    public IReadOnlyList<(string RelativePath, byte[] Content)> Files => _files;

    public void Add(string relativePath, string text) => _files.Add((relativePath, new UTF8Encoding(false).GetBytes(text)));

    public void Add(string relativePath, byte[] content) => _files.Add((relativePath, content));

    /// <summary>Writes every file under <paramref name="outputDirectory"/>; files named "manifest.json" go last.</summary>
    public void Commit(string outputDirectory)
    {
        var root = Path.GetFullPath(outputDirectory);
        var ordered = _files.OrderBy(f => Path.GetFileName(f.RelativePath) == "manifest.json" ? 1 : 0).ToList();
        foreach (var (relative, _) in ordered)
        {
            Target(root, relative);
        }
        try
        {
            Directory.CreateDirectory(root);
            foreach (var (relative, content) in ordered)
            {
                var target = Target(root, relative);
                Directory.CreateDirectory(Path.GetDirectoryName(target)!);
                var temporary = target + ".partial-" + Environment.ProcessId.ToString(System.Globalization.CultureInfo.InvariantCulture);
                using (var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None))
                {
                    stream.Write(content);
                    stream.Flush(flushToDisk: true);
                }
                File.Move(temporary, target, overwrite: true);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new BcPrepFailure(FailureKind.Output, new SourceLocation(outputDirectory), "cannot write the outputs: " + e.Message);
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
