using System.Security.Cryptography;
using BcPrep.Reading;
using BcPrep.Writing;

namespace BcPrep.Cli;

/// <summary>
/// Resolves the LOG arguments: '-' means standard input, which is copied to a temporary file first (the day is
/// read twice when operating points are detected); everything else is a path.
/// </summary>
public sealed class LogArguments : IDisposable
{
    private readonly List<string> _temporary = [];

    public LogArguments(IReadOnlyList<string> arguments, CliContext context)
    {
        if (arguments.Count(a => a == "-") > 1)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)"), "standard input ('-') can be given only once");
        }
        if (arguments.FirstOrDefault(LooksLikeMistypedOption) is { } option)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: option),
                $"unknown option '{option}' (and no log file has that name)");
        }
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < arguments.Count; i++)
        {
            if (arguments[i] == "-" || !TryFullPath(arguments[i], out var full))
            {
                continue;
            }
            if (seen.TryGetValue(full, out var first))
            {
                throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: arguments[i]),
                    $"the log '{arguments[i]}' is given more than once (LOG arguments {first + 1} and {i + 1}); each file of the day is given once");
            }
            seen[full] = i;
        }
        Inputs = arguments.Select(a => a == "-" ? Spill(context.OpenStandardInput, "(standard input)") : FromPath(a)).ToList();
    }

    public IReadOnlyList<LogInput> Inputs { get; }

    public static InputFingerprint Fingerprint(string displayName, string path)
    {
        try
        {
            // Large reads: the default 4 KB chunks cost a system call each, a quarter of a million for a GB-sized log.
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 0);
            using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
            var buffer = new byte[1 << 20];
            int read;
            while ((read = stream.Read(buffer)) > 0)
            {
                sha.AppendData(buffer, 0, read);
            }
            return new InputFingerprint(displayName, stream.Length, Convert.ToHexStringLower(sha.GetHashAndReset()));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            var reason = Directory.Exists(path) ? "it is a directory, not a file" : e.Message;
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(displayName), "cannot read: " + reason);
        }
    }

    /// <summary>The parser hands an unknown "--xyz" to the LOG argument; unless such a file exists, it is a typo.</summary>
    private static bool LooksLikeMistypedOption(string argument) =>
        argument.Length > 1 && argument[0] == '-' && !File.Exists(argument) && !Directory.Exists(argument);

    public IReadOnlyList<InputFingerprint> Fingerprints() => Fingerprints(EarlyFingerprints.None);

    /// <summary>The logs' fingerprints, taking those hashed early (<see cref="EarlyFingerprints"/>) from there.</summary>
    public IReadOnlyList<InputFingerprint> Fingerprints(EarlyFingerprints early) => Inputs.Select(early.For).ToList();

    /// <summary>Byte sizes of the logs (0 for one that cannot be read: the reading stage reports it properly).</summary>
    public IEnumerable<long> Sizes() => Inputs.Select(i => File.Exists(i.Path) ? new FileInfo(i.Path).Length : 0L);

    public void Dispose()
    {
        foreach (var path in _temporary)
        {
            try
            {
                File.Delete(path);
            }
            catch (IOException)
            {
            }
        }
    }

    private static bool TryFullPath(string argument, out string full)
    {
        try
        {
            full = Path.GetFullPath(argument);
            return true;
        }
        catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            full = "";
            return false;
        }
    }

    /// <summary>
    /// A path that is a pipe (process substitution, a named FIFO) can be read only once and cannot seek: it is copied
    /// once to a temporary file, like standard input. Anything else is left to the reader, which reports what is wrong.
    /// </summary>
    private LogInput FromPath(string argument)
    {
        FileStream? stream = null;
        try
        {
            if (File.Exists(argument))
            {
                stream = new FileStream(argument, FileMode.Open, FileAccess.Read, FileShare.ReadWrite, 1);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
        }
        using (stream)
        {
            return stream is null || stream.CanSeek ? LogInput.FromPath(argument) : Spill(() => stream, argument);
        }
    }

    private LogInput Spill(Func<Stream> open, string displayName)
    {
        var path = Path.Combine(Path.GetTempPath(), "bcprep-stdin-" + Guid.NewGuid().ToString("N") + ".log");
        _temporary.Add(path);
        try
        {
            using var target = File.Create(path);
            using var source = open();
            source.CopyTo(target);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(displayName), "cannot read the log: " + e.Message);
        }
        return new LogInput(displayName, path);
    }
}
