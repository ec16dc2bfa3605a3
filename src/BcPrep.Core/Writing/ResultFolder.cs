using System.Globalization;
using System.Text;
using System.Text.Json;

namespace BcPrep.Writing;

/// <summary>
/// The output folder of a run, which belongs to BcPrep while the run lasts and holds exactly one complete result
/// before and after it.
/// <list type="bullet">
/// <item>Ownership. An existing folder is taken only when it is empty or holds an earlier BcPrep result: a readable
/// manifest.json, and nothing the manifest does not list (a user's own file, a link) besides BcPrep's own lock and
/// temporary files. Anything else is refused (<see cref="FailureKind.Output"/>) and left untouched, as is a folder
/// that holds one of the run's inputs.</item>
/// <item>Lock. A run holds a lock file in the folder (<see cref="LockFileName"/>, holding its process id) from
/// <see cref="Claim"/> to <see cref="Dispose"/>; a second run into the same folder is refused naming that process.</item>
/// <item>Commit. The new result is built whole in a sibling folder (<c>.NAME.bcprep-new-PID</c>) and swapped with
/// the old one in one atomic rename (Linux <c>renameat2</c> with <c>RENAME_EXCHANGE</c>). At every instant the
/// folder's name refers to one complete result, old or new; files of the old result that the new one does not
/// have (points of another day, a report no longer asked for) go with the old folder. Where the exchange is not
/// available, the old folder is first renamed aside (<c>.NAME.bcprep-old-PID</c>); a run killed between the two
/// renames leaves the complete old result under that name, and the next <see cref="Claim"/> puts it back.</item>
/// <item>Links. Nothing is written into the existing folder: files go into the fresh sibling, and old folders are
/// deleted without following links.</item>
/// </list>
/// </summary>
public sealed class ResultFolder : IDisposable
{
    public const string LockFileName = ".bcprep-lock";

    private const string NewMarker = ".bcprep-new-";
    private const string OldMarker = ".bcprep-old-";

    /// <summary>Where the lock byte lies: past any content, so that the process id stays readable on every system.</summary>
    private const long LockOffset = 1L << 30;

    private readonly string _target;
    private readonly string _shownName;
    private readonly Action<string>? _step;
    private readonly bool _created;
    private readonly List<FileStream> _locks = [];
    private bool _committed;

    private ResultFolder(string target, string shownName, bool created, Action<string>? step)
    {
        _target = target;
        _shownName = shownName;
        _created = created;
        _step = step;
    }

    /// <summary>The full path of the output folder.</summary>
    public string Path => _target;

    /// <summary>
    /// Checks that the folder may be written, takes its lock, and removes what interrupted runs left beside it.
    /// <paramref name="inputPaths"/> are the run's input files (none may lie inside the folder); <paramref name="step"/>
    /// is told the name of each step of the commit (tests use it to interrupt the commit at every step).
    /// </summary>
    public static ResultFolder Claim(string outDirectory, IEnumerable<string> inputPaths, Action<string>? step = null)
    {
        if (string.IsNullOrWhiteSpace(outDirectory))
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--out"), "the output folder is empty: name a folder, e.g. --out out");
        }
        string target;
        try
        {
            target = Resolve(outDirectory);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw Refusal(outDirectory, e.Message);
        }
        if (File.Exists(target))
        {
            throw Refusal(outDirectory, "it is a file, not a folder");
        }
        var parent = System.IO.Path.GetDirectoryName(target);
        if (parent is null)
        {
            throw Refusal(outDirectory, "it is the root of the file system");
        }
        try
        {
            RecoverInterruptedSwap(target);
            CheckOwnership(outDirectory, target);
            CheckInputsOutside(outDirectory, target, inputPaths);
            var created = !Directory.Exists(target);
            Directory.CreateDirectory(target);
            var folder = new ResultFolder(target, outDirectory, created, step);
            try
            {
                folder._locks.Add(TakeLock(outDirectory, target));
                // Checked again under the lock: another run may have committed between the first check and the lock.
                CheckOwnership(outDirectory, target);
                RemoveLeftovers(target);
                return folder;
            }
            catch
            {
                folder.Dispose();
                throw;
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw Refusal(outDirectory, e.Message);
        }
    }

    /// <summary>Builds the new result beside the old one and swaps it into place (see the class summary).</summary>
    public void Commit(OutputFileSet files)
    {
        ArgumentNullException.ThrowIfNull(files);
        var staging = Sibling(_target, NewMarker);
        try
        {
            DeleteTree(staging);
            Directory.CreateDirectory(staging);
            Step("staging folder created");
            var count = 0;
            foreach (var (relative, content) in files.Files)
            {
                var path = System.IO.Path.GetFullPath(System.IO.Path.Combine(staging, relative));
                if (!path.StartsWith(staging + System.IO.Path.DirectorySeparatorChar, StringComparison.Ordinal) || relative == LockFileName)
                {
                    throw new BcPrepFailure(FailureKind.Output, new SourceLocation(relative), $"refusing to write outside the output folder {_shownName}");
                }
                Directory.CreateDirectory(System.IO.Path.GetDirectoryName(path)!);
                using (var stream = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.None))
                {
                    stream.Write(content);
                    stream.Flush(flushToDisk: true);
                }
                if (++count == 1)
                {
                    Step("first file written");
                }
            }
            Step("every file written");
            // The new folder carries its own lock, so that a run that opens the folder's name after the swap waits too.
            _locks.Add(TakeLock(_shownName, staging));
            Step("new folder locked");
            if (Exchange(staging, _target))
            {
                Step("folders exchanged");
                _committed = true;
                DeleteTree(staging, () => Step("old result partly removed"));
            }
            else
            {
                var aside = Sibling(_target, OldMarker);
                Directory.Move(_target, aside);
                Step("old result moved aside");
                Directory.Move(staging, _target);
                _committed = true;
                Step("new result in place");
                DeleteTree(aside, () => Step("old result partly removed"));
            }
            Step("old result removed");
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            if (!_committed)
            {
                TryDeleteTree(staging);
            }
            throw new BcPrepFailure(FailureKind.Output, new SourceLocation(_shownName), "cannot write the outputs: " + e.Message);
        }
    }

    /// <summary>Releases the lock (removing the lock file) and, after a failed run, anything this run created.</summary>
    public void Dispose()
    {
        if (_locks.Count > 0)
        {
            // Deleted while still held: a run waiting on this file finds, once it gets the lock, that the name no
            // longer refers to it, and opens the name again.
            TryDelete(System.IO.Path.Combine(_target, LockFileName));
            foreach (var held in _locks)
            {
                held.Dispose();
            }
            _locks.Clear();
            if (!_committed)
            {
                TryDeleteTree(Sibling(_target, NewMarker));
                if (_created && Directory.Exists(_target) && !Directory.EnumerateFileSystemEntries(_target).Any())
                {
                    TryDelete(_target, directory: true);
                }
            }
        }
    }

    private void Step(string name) => _step?.Invoke(name);

    /// <summary>The folder a user's --out names: a link to a folder is followed once (the user chose it), dangling links refused.</summary>
    private static string Resolve(string outDirectory)
    {
        var full = System.IO.Path.TrimEndingDirectorySeparator(System.IO.Path.GetFullPath(outDirectory));
        var info = new DirectoryInfo(full);
        if (info.LinkTarget is not null)
        {
            var final = info.ResolveLinkTarget(returnFinalTarget: true);
            if (final is null || !final.Exists)
            {
                throw new IOException("it is a link to a folder that does not exist");
            }
            return System.IO.Path.TrimEndingDirectorySeparator(final.FullName);
        }
        return full;
    }

    private static void CheckOwnership(string shown, string target)
    {
        if (!Directory.Exists(target))
        {
            return;
        }
        var entries = Walk(target).Where(e => !IsOwnControlFile(target, e)).ToList();
        if (entries.Count == 0)
        {
            return;
        }
        var manifest = System.IO.Path.Combine(target, OutputFileSet.ManifestFileName);
        var listed = ListedFiles(manifest);
        if (listed is null)
        {
            throw Refusal(shown, $"the folder is not empty and holds no {OutputFileSet.ManifestFileName} of an earlier BcPrep result (it holds e.g. '{Relative(target, entries[0])}'): it is left untouched; choose a new or empty folder");
        }
        var folders = listed.SelectMany(ParentFolders).ToHashSet(StringComparer.Ordinal);
        foreach (var entry in entries)
        {
            var relative = Relative(target, entry);
            if (entry.LinkTarget is { } link)
            {
                throw Refusal(shown, $"'{relative}' is a link (to {link}); BcPrep writes no links and never writes through one, so the folder is left untouched");
            }
            var ours = entry is DirectoryInfo ? folders.Contains(relative) : listed.Contains(relative) || relative == OutputFileSet.ManifestFileName;
            if (!ours)
            {
                throw Refusal(shown, $"it holds '{relative}', which the earlier result's {OutputFileSet.ManifestFileName} does not list; a result is replaced as a whole, so the folder is left untouched (move that {(entry is DirectoryInfo ? "folder" : "file")} out, or choose another folder)");
            }
        }
    }

    private static void CheckInputsOutside(string shown, string target, IEnumerable<string> inputPaths)
    {
        foreach (var input in inputPaths)
        {
            string full;
            try
            {
                full = System.IO.Path.GetFullPath(input);
            }
            catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
            {
                continue;
            }
            if (full.StartsWith(target + System.IO.Path.DirectorySeparatorChar, StringComparison.Ordinal) || full == target)
            {
                throw Refusal(shown, $"the input '{input}' lies inside it, and a result is replaced as a whole: choose an output folder that holds no input");
            }
        }
    }

    /// <summary>The files an earlier result's manifest lists, or null when there is no readable BcPrep manifest.</summary>
    private static HashSet<string>? ListedFiles(string manifest)
    {
        try
        {
            if (!File.Exists(manifest) || new FileInfo(manifest).LinkTarget is not null)
            {
                return null;
            }
            using var document = JsonDocument.Parse(File.ReadAllBytes(manifest));
            if (document.RootElement.ValueKind != JsonValueKind.Object || !document.RootElement.TryGetProperty("files", out var files) || files.ValueKind != JsonValueKind.Array)
            {
                return null;
            }
            return files.EnumerateArray().Where(f => f.ValueKind == JsonValueKind.String).Select(f => f.GetString()!).ToHashSet(StringComparer.Ordinal);
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }

    private static IEnumerable<string> ParentFolders(string relative)
    {
        for (var at = relative.LastIndexOf('/'); at > 0; at = relative.LastIndexOf('/', at - 1))
        {
            yield return relative[..at];
        }
    }

    /// <summary>Every entry under the folder, depth first; links are listed, never entered.</summary>
    private static IEnumerable<FileSystemInfo> Walk(string folder)
    {
        foreach (var entry in new DirectoryInfo(folder).EnumerateFileSystemInfos().OrderBy(e => e.Name, StringComparer.Ordinal))
        {
            yield return entry;
            if (entry is DirectoryInfo && entry.LinkTarget is null)
            {
                foreach (var inner in Walk(entry.FullName))
                {
                    yield return inner;
                }
            }
        }
    }

    private static bool IsOwnControlFile(string target, FileSystemInfo entry) =>
        entry is FileInfo && entry.LinkTarget is null &&
        (System.IO.Path.GetRelativePath(target, entry.FullName) == LockFileName || OutputFileSet.IsPartialFileName(entry.Name));

    private static string Relative(string target, FileSystemInfo entry) =>
        System.IO.Path.GetRelativePath(target, entry.FullName).Replace('\\', '/');

    /// <summary>
    /// Opens and locks the lock file of <paramref name="folder"/>, writes this process's id into it, and checks that
    /// the folder's name still refers to that file (a run that finished meanwhile deletes it).
    /// </summary>
    private static FileStream TakeLock(string shown, string folder)
    {
        var path = System.IO.Path.Combine(folder, LockFileName);
        var mine = Environment.ProcessId.ToString(CultureInfo.InvariantCulture) + " " + Guid.NewGuid().ToString("N");
        for (var attempt = 0; attempt < 5; attempt++)
        {
            var stream = new FileStream(path, FileMode.OpenOrCreate, FileAccess.ReadWrite, OperatingSystem.IsMacOS() ? FileShare.None : FileShare.ReadWrite | FileShare.Delete);
            try
            {
                if (!OperatingSystem.IsMacOS() && !OperatingSystem.IsIOS() && !OperatingSystem.IsTvOS())
                {
                    stream.Lock(LockOffset, 1);
                }
            }
            catch (IOException)
            {
                var holder = ReadHolder(stream);
                stream.Dispose();
                throw new BcPrepFailure(FailureKind.Output, new SourceLocation(shown),
                    $"the folder is in use by {(holder is null ? "another process" : "process " + holder)} (another bcprep run writing into it); wait for it to finish, or choose another folder");
            }
            stream.SetLength(0);
            stream.Write(Encoding.ASCII.GetBytes(mine + "\n"));
            stream.Flush(flushToDisk: true);
            // The name must still refer to the file just locked (a run that finished meanwhile deletes it). Checked by
            // stat alone: opening and closing another handle to the file would drop this process's POSIX lock.
            var atPath = new FileInfo(path);
            if (atPath.Exists && atPath.Length == stream.Length && atPath.LastWriteTimeUtc == File.GetLastWriteTimeUtc(stream.SafeFileHandle))
            {
                return stream;
            }
            stream.Dispose();
        }
        throw new BcPrepFailure(FailureKind.Output, new SourceLocation(shown), "the folder is in use by other bcprep runs that keep replacing it; try again");
    }

    private static string? ReadHolder(FileStream stream)
    {
        try
        {
            stream.Position = 0;
            var buffer = new byte[64];
            var n = stream.Read(buffer);
            var text = Encoding.ASCII.GetString(buffer, 0, n).Split(' ', '\n')[0];
            return int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var pid) ? pid.ToString(CultureInfo.InvariantCulture) : null;
        }
        catch (IOException)
        {
            return null;
        }
    }

    /// <summary>A run killed between the two renames of the fallback swap left the old result aside: put it back.</summary>
    private static void RecoverInterruptedSwap(string target)
    {
        if (Directory.Exists(target) || File.Exists(target))
        {
            return;
        }
        var aside = Leftovers(target, OldMarker).FirstOrDefault(d => File.Exists(System.IO.Path.Combine(d, OutputFileSet.ManifestFileName)));
        if (aside is not null)
        {
            Directory.Move(aside, target);
        }
    }

    /// <summary>Staging and set-aside folders of interrupted runs (the lock is held, so none of them is in use).</summary>
    private static void RemoveLeftovers(string target)
    {
        foreach (var leftover in Leftovers(target, NewMarker).Concat(Leftovers(target, OldMarker)))
        {
            DeleteTree(leftover);
        }
    }

    private static IEnumerable<string> Leftovers(string target, string marker)
    {
        var parent = System.IO.Path.GetDirectoryName(target)!;
        var prefix = "." + System.IO.Path.GetFileName(target) + marker;
        return Directory.EnumerateDirectories(parent, prefix + "*")
            .Where(d => System.IO.Path.GetFileName(d).AsSpan(prefix.Length) is { Length: > 0 } pid && !pid.ContainsAnyExcept("0123456789"))
            .Where(d => new DirectoryInfo(d).LinkTarget is null)
            .ToList();
    }

    private static string Sibling(string target, string marker) =>
        System.IO.Path.Combine(System.IO.Path.GetDirectoryName(target)!, "." + System.IO.Path.GetFileName(target) + marker + Environment.ProcessId.ToString(CultureInfo.InvariantCulture));

    /// <summary>Swaps two folders' names in one step; false where the system cannot (the caller then renames twice).</summary>
    private static bool Exchange(string a, string b)
    {
        if (!OperatingSystem.IsLinux() || Environment.GetEnvironmentVariable("BCPREP_NO_EXCHANGE") == "1")
        {
            return false;
        }
        try
        {
            return NativeRename.Exchange(a, b);
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return false;
        }
    }

    /// <summary>Deletes a folder and everything in it; a link is removed itself, its target never touched.</summary>
    private static void DeleteTree(string path, Action? afterFirst = null)
    {
        var info = new DirectoryInfo(path);
        if (info.LinkTarget is not null)
        {
            info.Delete();
            return;
        }
        if (!info.Exists)
        {
            return;
        }
        var first = true;
        foreach (var entry in info.EnumerateFileSystemInfos())
        {
            if (entry is DirectoryInfo && entry.LinkTarget is null)
            {
                DeleteTree(entry.FullName);
            }
            else
            {
                entry.Delete();
            }
            if (first)
            {
                first = false;
                afterFirst?.Invoke();
            }
        }
        info.Delete();
    }

    private static void TryDeleteTree(string path)
    {
        try
        {
            DeleteTree(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Left under its hidden name; the next run into this folder removes it.
        }
    }

    private static void TryDelete(string path, bool directory = false)
    {
        try
        {
            if (directory)
            {
                Directory.Delete(path);
            }
            else
            {
                File.Delete(path);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
        }
    }

    private static BcPrepFailure Refusal(string shown, string reason) =>
        new(FailureKind.Output, new SourceLocation(shown), "cannot write the outputs: " + reason);
}
