using System.Runtime.InteropServices;

namespace BcPrep.Writing;

/// <summary>
/// Linux <c>renameat2(…, RENAME_EXCHANGE)</c>: swaps two paths in one atomic step (Linux 3.15, glibc 2.28), the only
/// way to replace a whole non-empty folder with no instant at which its name refers to nothing.
/// </summary>
internal static class NativeRename
{
    private const int AtCurrentDirectory = -100;
    private const uint RenameExchange = 2;
    private const int NotImplemented = 38;
    private const int InvalidArgument = 22;
    private const int NotSupported = 95;

    /// <summary>True when swapped; false when the system or file system cannot exchange (the caller falls back).</summary>
    public static bool Exchange(string a, string b)
    {
        if (renameat2(AtCurrentDirectory, a, AtCurrentDirectory, b, RenameExchange) == 0)
        {
            return true;
        }
        var errno = Marshal.GetLastPInvokeError();
        if (errno is NotImplemented or InvalidArgument or NotSupported)
        {
            return false;
        }
        throw new IOException($"cannot swap '{b}' with its new content (errno {errno})");
    }

    [DllImport("libc", SetLastError = true)]
    private static extern int renameat2(int oldDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string oldPath, int newDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string newPath, uint flags);
}
