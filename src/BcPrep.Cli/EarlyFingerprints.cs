using BcPrep.Reading;
using BcPrep.Writing;

namespace BcPrep.Cli;

/// <summary>
/// The SHA-256 of the plain log files named on the command line, started the moment a command starts, on its own
/// thread: loading the rig and starting the runtime's code keep one core busy for about 0.2 s before the read begins,
/// while the other core has nothing to do, and the hash of a large day (0.4 s of CPU for 0.5 GB) would otherwise take
/// that time from the read and the window statistics later (per-thread profile, issue 19).
/// <para>
/// Only what can be read twice without harm is hashed early: a regular file with bytes in it, never '-' nor a
/// pipe (whose bytes a read would take from the real reader), and only where the file's type can be asked (Linux). Anything not hashed early, or whose
/// early hash failed, is hashed when asked for by <see cref="LogArguments.Fingerprint"/>, which reports a failure in
/// its usual words at its usual place.
/// </para>
/// </summary>
public sealed class EarlyFingerprints
{
    private readonly Dictionary<string, ChunkedFingerprint> _files;

    private EarlyFingerprints(Dictionary<string, ChunkedFingerprint> files) => _files = files;

    /// <summary>None hashed early: every fingerprint is computed when asked for.</summary>
    public static EarlyFingerprints None { get; } = new(new Dictionary<string, ChunkedFingerprint>(StringComparer.Ordinal));

    /// <summary>Starts hashing the plain files among <paramref name="arguments"/> (LOG arguments as given).</summary>
    public static EarlyFingerprints Start(IReadOnlyList<string> arguments)
    {
        var plain = arguments.Where(IsPlainFile).Distinct(StringComparer.Ordinal).ToList();
        if (plain.Count == 0)
        {
            return None;
        }
        var files = plain.ToDictionary(path => path, path => new ChunkedFingerprint(path), StringComparer.Ordinal);
        // Its own thread, at the lowest priority (BackgroundPriority): it takes the cores the reading, converting and
        // window statistics leave idle. The hash is needed only for the manifest at the end, and what is left then
        // is finished by the thread that asks (ChunkedFingerprint.Finish), at its own priority.
        _ = Task.Factory.StartNew(() =>
        {
            BackgroundPriority.LowerCurrentThread(BackgroundPriority.Idle);
            foreach (var path in plain)
            {
                while (files[path].Advance())
                {
                }
            }
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        return new EarlyFingerprints(files);
    }

    /// <summary>
    /// The fingerprint of <paramref name="input"/>: the early one when it was hashed early (what is left of it hashed
    /// now), else hashed now; a file the early hash could not read is hashed again, which reports it.
    /// </summary>
    public InputFingerprint For(LogInput input) =>
        input.DisplayName == input.Path && _files.TryGetValue(input.Path, out var early) && early.Finish() is { } fingerprint
            ? fingerprint
            : LogArguments.Fingerprint(input.DisplayName, input.Path);

    /// <summary>A regular file with bytes in it (<see cref="RegularFile"/>): never '-', a pipe, a device or a folder.</summary>
    internal static bool IsPlainFile(string argument)
    {
        if (argument == "-" || !RegularFile.Is(argument))
        {
            return false;
        }
        try
        {
            return new FileInfo(argument).Length > 0;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            return false;
        }
    }
}
