namespace BcPrep.Rig;

/// <summary>
/// An operating-point id names the point's output folder, so it must be a plain folder name: refused at rig-check
/// time rather than rewritten later, because a rewrite could make two ids share a folder or hide a path that
/// points outside the output folder.
/// </summary>
public static class PointIds
{
    /// <summary>True for 1–64 ASCII letters, digits, '-', '_' or '.', other than "." and "..".</summary>
    public static bool IsSafeFolderName(string id) =>
        id.Length is > 0 and <= 64 && id is not "." and not ".." && id.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.');
}
