using System.Globalization;

namespace BcPrep.Writing;

/// <summary>
/// A whole output folder built next to its target under a temporary name and swapped into place only when complete,
/// so that an interrupted run leaves the previous folder intact and never a mix of old and new members. An existing
/// target is replaced only when it is empty or holds <c>marker</c> (a folder this tool wrote before); anything else
/// is refused rather than deleted.
/// </summary>
public sealed class StagedDirectory : IDisposable
{
    private readonly string _target;
    private bool _completed;

    private StagedDirectory(string target, string staging)
    {
        _target = target;
        Path = staging;
    }

    /// <summary>The staging folder to write into.</summary>
    public string Path { get; }

    /// <summary>Checks the target and creates the staging folder; throws <see cref="BcPrepFailure"/> (output) when it cannot.</summary>
    public static StagedDirectory Begin(string targetDirectory, string marker)
    {
        var target = System.IO.Path.GetFullPath(targetDirectory).TrimEnd(System.IO.Path.DirectorySeparatorChar);
        if (File.Exists(target))
        {
            throw Failure(targetDirectory, "it is a file, not a folder");
        }

        if (Directory.Exists(target) && Directory.EnumerateFileSystemEntries(target).Any() && !File.Exists(System.IO.Path.Combine(target, marker)))
        {
            throw Failure(targetDirectory, $"the folder exists, is not empty and holds no {marker}: it was not written by this command, so it is left alone (choose another --out)");
        }

        var staging = target + ".partial-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture);
        try
        {
            if (Directory.Exists(staging))
            {
                Directory.Delete(staging, recursive: true);
            }

            Directory.CreateDirectory(staging);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw Failure(targetDirectory, e.Message);
        }

        return new StagedDirectory(target, staging);
    }

    /// <summary>
    /// Writes files into the staging folder directly: no per-file temporary name or flush, because nothing is visible
    /// under the target name until <see cref="Complete"/>.
    /// </summary>
    public void Write(OutputFileSet files)
    {
        ArgumentNullException.ThrowIfNull(files);
        try
        {
            foreach (var (relative, content) in files.Files)
            {
                var target = System.IO.Path.GetFullPath(System.IO.Path.Combine(Path, relative));
                if (!target.StartsWith(Path + System.IO.Path.DirectorySeparatorChar, StringComparison.Ordinal))
                {
                    throw Failure(_target, $"refusing to write '{relative}' outside the output folder");
                }

                Directory.CreateDirectory(System.IO.Path.GetDirectoryName(target)!);
                File.WriteAllBytes(target, content);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw Failure(_target, e.Message);
        }
    }

    /// <summary>Moves the finished staging folder into place (the previous folder, if any, is removed after the swap).</summary>
    public void Complete()
    {
        var previous = _target + ".previous-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture);
        try
        {
            if (Directory.Exists(_target))
            {
                Directory.Move(_target, previous);
            }

            Directory.Move(Path, _target);
            _completed = true;
            if (Directory.Exists(previous))
            {
                Directory.Delete(previous, recursive: true);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            if (!_completed && !Directory.Exists(_target) && Directory.Exists(previous))
            {
                Directory.Move(previous, _target);
            }

            throw Failure(_target, e.Message);
        }
    }

    /// <summary>Removes the staging folder of an unfinished run.</summary>
    public void Dispose()
    {
        if (!_completed && Directory.Exists(Path))
        {
            try
            {
                Directory.Delete(Path, recursive: true);
            }
            catch (IOException)
            {
                // Left behind under its '.partial-' name; the next run of the same process id replaces it.
            }
        }
    }

    private static BcPrepFailure Failure(string target, string reason) =>
        new(FailureKind.Output, new SourceLocation(target), "cannot write the ensemble: " + reason);
}
