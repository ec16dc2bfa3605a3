using System.Collections.Concurrent;
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
/// <para>
/// The hashing threads run at the lowest priority (<see cref="BackgroundPriority"/>): at the same priority the hash took
/// its share of the cores from the reader, and the reader cannot make that time up, while later in the read the
/// reader ran with a core idle. What is not hashed when the manifest needs it is hashed then by the asking thread
/// (<see cref="For"/>), a chunk at a time where the background left off (<see cref="ChunkedFingerprint"/>).
/// </para>
/// </summary>
public sealed class EarlyFingerprints
{
    private readonly ConcurrentDictionary<(string DisplayName, string Path), ChunkedFingerprint> _files;

    private EarlyFingerprints(ConcurrentDictionary<(string, string), ChunkedFingerprint> files) => _files = files;

    /// <summary>None hashed early: every fingerprint is computed when asked for (a new set each time: it keeps what it hashed).</summary>
    public static EarlyFingerprints None => new([]);

    /// <summary>Starts hashing the plain files among <paramref name="arguments"/> (LOG arguments as given).</summary>
    public static EarlyFingerprints Start(IReadOnlyList<string> arguments)
    {
        var plain = arguments.Where(IsPlainFile).Distinct(StringComparer.Ordinal).ToList();
        if (plain.Count == 0)
        {
            return None;
        }
        var files = new ConcurrentDictionary<(string, string), ChunkedFingerprint>(plain.Select(path => KeyValuePair.Create((path, path), new ChunkedFingerprint(path, path))));
        // Its own thread, at the lowest priority (BackgroundPriority): it takes the cores the start-up, the reading, the
        // converting and the window statistics leave idle. The hash is needed only for the manifest at the end, and
        // what is left then is finished by the thread that asks (For), at its own priority.
        _ = Task.Factory.StartNew(() =>
        {
            BackgroundPriority.LowerCurrentThread(BackgroundPriority.Idle);
            foreach (var path in plain)
            {
                while (files[(path, path)].Advance())
                {
                }
            }
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        return new EarlyFingerprints(files);
    }

    /// <summary>
    /// The fingerprint of <paramref name="input"/>, finished by the calling thread at its own priority: an early one
    /// is taken over where it stands (the background stops), and any input is hashed once however many threads ask.
    /// A file the chunks could not read is hashed again in one go, which reports it in its usual words.
    /// </summary>
    public InputFingerprint For(LogInput input) => Chunks(input).Finish() ?? LogArguments.Fingerprint(input.DisplayName, input.Path);

    /// <summary>
    /// Hashes <paramref name="inputs"/> in the background, on the calling thread (lowered to the lowest priority: call it
    /// from a thread of its own), until each is hashed or asked for by <see cref="For"/>.
    /// </summary>
    public void HashInBackground(IEnumerable<LogInput> inputs)
    {
        BackgroundPriority.LowerCurrentThread(BackgroundPriority.Idle);
        foreach (var input in inputs)
        {
            var chunks = Chunks(input);
            while (chunks.Advance())
            {
            }
        }
    }

    private ChunkedFingerprint Chunks(LogInput input) =>
        _files.GetOrAdd((input.DisplayName, input.Path), key => new ChunkedFingerprint(key.DisplayName, key.Path));

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
