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
    private readonly Task<Dictionary<string, InputFingerprint>> _work;

    private EarlyFingerprints(Task<Dictionary<string, InputFingerprint>> work) => _work = work;

    /// <summary>None hashed early: every fingerprint is computed when asked for.</summary>
    public static EarlyFingerprints None { get; } = new(Task.FromResult(new Dictionary<string, InputFingerprint>(StringComparer.Ordinal)));

    /// <summary>Starts hashing the plain files among <paramref name="arguments"/> (LOG arguments as given).</summary>
    public static EarlyFingerprints Start(IReadOnlyList<string> arguments)
    {
        var plain = arguments.Where(IsPlainFile).Distinct(StringComparer.Ordinal).ToList();
        if (plain.Count == 0)
        {
            return None;
        }
        return new EarlyFingerprints(Task.Factory.StartNew(() =>
        {
            var hashed = new Dictionary<string, InputFingerprint>(StringComparer.Ordinal);
            foreach (var path in plain)
            {
                try
                {
                    hashed[path] = LogArguments.Fingerprint(path, path);
                }
                catch (BcPrepFailure)
                {
                    // Hashed again when asked for, which reports it.
                }
            }
            return hashed;
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default));
    }

    /// <summary>The fingerprint of <paramref name="input"/>: the early one when it was hashed early, else hashed now.</summary>
    public InputFingerprint For(LogInput input) =>
        input.DisplayName == input.Path && _work.Result.TryGetValue(input.Path, out var early)
            ? early
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
