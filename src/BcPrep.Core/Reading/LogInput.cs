namespace BcPrep.Reading;

/// <summary>
/// One log to read: the name used in messages and the path it is read from. Gzip is recognised by its magic
/// bytes, not by the file name. Standard input is first copied to a file by the front end, because finding
/// operating points reads the day twice.
/// </summary>
public sealed record LogInput(string DisplayName, string Path)
{
    public static LogInput FromPath(string path) => new(path, path);

    public Stream Open()
    {
        Stream raw;
        try
        {
            raw = new FileStream(Path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16, FileOptions.SequentialScan);
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
