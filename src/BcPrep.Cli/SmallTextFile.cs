using System.Globalization;
using System.Text;

namespace BcPrep.Cli;

/// <summary>
/// Reads a small text input (the rig file, a face points file) whole, but never more than a bound: a device such as
/// /dev/zero, or a log given where the rig file belongs, would otherwise be read until memory runs out.
/// </summary>
public static class SmallTextFile
{
    /// <summary>16 MiB: a rig file or a face points file of a million points is far smaller.</summary>
    public const int MaxBytes = 16 << 20;

    /// <summary>The text of <paramref name="path"/>, or a failure of <paramref name="kind"/> at <paramref name="location"/> saying why not.</summary>
    public static string Read(string path, string what, FailureKind kind, SourceLocation location)
    {
        try
        {
            if (Directory.Exists(path))
            {
                throw new BcPrepFailure(kind, location, $"cannot read the {what} '{path}': it is a directory, not a file");
            }
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
            var buffer = new byte[1 << 16];
            using var content = new MemoryStream();
            int n;
            while ((n = stream.Read(buffer)) > 0)
            {
                content.Write(buffer, 0, n);
                if (content.Length > MaxBytes)
                {
                    throw new BcPrepFailure(kind, location,
                        string.Create(CultureInfo.InvariantCulture, $"cannot read the {what} '{path}': it holds more than {MaxBytes >> 20} MiB (a device or a log given in its place?)"));
                }
            }
            return new UTF8Encoding(false).GetString(content.GetBuffer(), 0, (int)content.Length).TrimStart('\uFEFF');
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new BcPrepFailure(kind, location, $"cannot read the {what} '{path}': {e.Message}");
        }
    }
}
