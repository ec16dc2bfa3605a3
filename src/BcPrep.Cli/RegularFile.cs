using System.Runtime.InteropServices;

namespace BcPrep.Cli;

/// <summary>
/// Whether a path names a regular file (after symbolic links), as Linux <c>statx</c> (Linux 4.11, glibc 2.28) reports
/// its type: a named FIFO or the pipe of a process substitution (/dev/fd/63) also "exists" for .NET and may report
/// a size (the bytes waiting in it), and reading one takes its bytes from whoever reads it next. Elsewhere, or when
/// the call is not there, the answer is false: the caller then leaves the file alone.
/// </summary>
internal static class RegularFile
{
    private const int AtCurrentDirectory = -100;
    private const uint TypeMask = 0x1; // STATX_TYPE
    private const int ModeOffset = 28; // struct statx: u32 mask, u32 blksize, u64 attributes, u32 nlink, uid, gid; u16 mode
    private const int FileTypeBits = 0xF000; // S_IFMT
    private const int Regular = 0x8000; // S_IFREG

    public static bool Is(string path)
    {
        if (!OperatingSystem.IsLinux())
        {
            return false;
        }
        var buffer = new byte[256]; // sizeof(struct statx)
        try
        {
            if (statx(AtCurrentDirectory, path, 0, TypeMask, buffer) != 0)
            {
                return false;
            }
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return false;
        }
        return (BitConverter.ToUInt16(buffer, ModeOffset) & FileTypeBits) == Regular;
    }

    [DllImport("libc", SetLastError = true)]
    private static extern int statx(int directory, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, byte[] buffer);
}
