namespace BcPrep.Reading;

/// <summary>
/// One log to read: the name used in messages and the path it is read from. Gzip is recognised by its magic
/// bytes, not by the file name. Standard input is first copied to a file by the front end, because finding
/// operating points reads the day twice.
/// </summary>
public sealed record LogInput(string DisplayName, string Path)
{
    public static LogInput FromPath(string path) => new(path, path);

    /// <summary>
    /// Bytes of the file to read (null: all of it). A file a logger is still writing is read up to the end of its
    /// last complete line, so a line being written is never parsed.
    /// </summary>
    public long? LengthLimit { get; init; }

    /// <summary>Where to continue reading (a row's byte offset and line, from an earlier read); null from the start.</summary>
    public (long Offset, long Line)? ResumeAt { get; init; }

    /// <summary>The file as bytes, opened for reading only and shared with a writer, cut at <see cref="LengthLimit"/>.</summary>
    internal Stream OpenRaw(FileOptions options = FileOptions.SequentialScan)
    {
        // ReadWrite sharing: a logger may still be appending to the file (it is read only up to LengthLimit then).
        var share = LengthLimit is null ? FileShare.Read : FileShare.ReadWrite | FileShare.Delete;
        var file = new FileStream(Path, FileMode.Open, FileAccess.Read, share, 1 << 16, options);
        return LengthLimit is { } limit ? new BoundedReadStream(file, limit) : file;
    }

    public Stream Open()
    {
        Stream raw;
        try
        {
            raw = OpenRaw();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            var reason = Directory.Exists(Path) ? "it is a directory, not a file" : e.Message;
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(DisplayName), $"cannot open the log: {reason}");
        }
        Span<byte> magic = stackalloc byte[2];
        var n = raw.ReadAtLeast(magic, 2, throwOnEndOfStream: false);
        raw.Seek(0, SeekOrigin.Begin);
        return n == 2 && magic[0] == 0x1f && magic[1] == 0x8b ? new CheckedGzipStream(raw) : raw;
    }
}
