using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace BcPrep.Pipeline;

/// <summary>
/// Kept row blocks in temporary files, in a folder the caller names (the command line gives the system's temporary
/// folder, which honours TMPDIR), so that the rows since the start of a long plateau at a high rate are kept whole
/// without holding them in memory. Blocks are appended to segment files of about <see cref="SegmentBytes"/>; a
/// segment is deleted as soon as none of its blocks is kept or still to be read by a gathered window, so the disk
/// holds about the plateau under way (8 bytes × (channels + 1) × rate × seconds), not the day.
/// </summary>
/// <remarks>
/// Each file is opened for deletion on close and, outside Windows, unlinked as soon as it is open (the open handle
/// keeps it readable; deletion on close alone happens only when the handle is closed, which a killed process never
/// does there), so a run that fails or is killed leaves nothing behind. Any failure to create, write or read a file
/// (a missing or read-only folder, a full disk) is a <see cref="FailureKind.Output"/> failure that names the folder.
/// </remarks>
internal sealed class DiskRowBlocks : IRowBlockStore
{
    /// <summary>About how large a segment file grows before the next block starts another (32 MB).</summary>
    public const long SegmentBytes = 32L << 20;

    /// <summary>
    /// Values kept at most on disk: 2 GiB, over 4 h of 17 channels at 1 kHz or a day of 13 channels at 200 Hz. It
    /// bounds the disk a plateau that never ends can take; a window that starts before what is left is read again.
    /// </summary>
    public const long DefaultMaxKeptValues = (2L << 30) / sizeof(double);

    private readonly string _directory;
    private readonly long _segmentBytes;
    private readonly object _gate = new();
    private Segment? _current;
    private bool _disposed;

    /// <summary>Creates the first segment now, so that a folder that cannot take files fails before the long read.</summary>
    /// <param name="directory">The folder for the temporary files.</param>
    /// <param name="segmentBytes">About how large a segment grows (<see cref="SegmentBytes"/>; tests use small ones).</param>
    public DiskRowBlocks(string directory, long segmentBytes = SegmentBytes)
    {
        _directory = directory;
        _segmentBytes = segmentBytes;
        _current = Open();
    }

    public long MaxKeptValues => DefaultMaxKeptValues;

    /// <summary>For tests: called with the bytes about to be written; an exception it throws stands for a failed write.</summary>
    internal Action<long>? BeforeWrite { get; init; }

    /// <summary>Segment files open now (for tests: a segment no block needs is closed, which deletes it).</summary>
    internal int OpenSegments
    {
        get
        {
            lock (_gate)
            {
                return _openSegments;
            }
        }
    }

    private int _openSegments;

    public StoredBlock Write(double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        var columns = valuesSi.Count + 1;
        var bytes = (long)columns * count * sizeof(double);
        Segment segment;
        long offset;
        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_disposed, this);
            if (_current is { LiveBlocks: 0 })
            {
                _current.Length = 0; // nothing in it is needed any more: write over it
            }
            if (_current is null || _current.Length >= _segmentBytes)
            {
                var full = _current;
                _current = Open();
                if (full is not null)
                {
                    CloseIfUnused(full);
                }
            }
            segment = _current;
            offset = segment.Length;
            segment.Length += bytes;
            segment.LiveBlocks++;
        }
        try
        {
            BeforeWrite?.Invoke(bytes);
            RandomAccess.Write(segment.Handle, MemoryMarshal.AsBytes(timeS.AsSpan(0, count)), offset);
            for (var c = 0; c < valuesSi.Count; c++)
            {
                RandomAccess.Write(segment.Handle, MemoryMarshal.AsBytes(valuesSi[c].AsSpan(0, count)), offset + ((long)(c + 1) * count * sizeof(double)));
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            lock (_gate)
            {
                // The segment's end is not trusted any more: no block goes after this one.
                if (_current == segment)
                {
                    _current = null;
                }
                segment.LiveBlocks--;
                CloseIfUnused(segment);
            }
            throw Failure("write", e);
        }
        return new StoredBlock(this, columns, count, timeS[0], timeS[count - 1], new Place(segment, offset));
    }

    public void Read(StoredBlock block, int column, int first, Span<double> into)
    {
        var place = (Place)block.Location;
        var offset = place.Offset + (((long)column * block.Count) + first) * sizeof(double);
        var bytes = MemoryMarshal.AsBytes(into);
        try
        {
            while (!bytes.IsEmpty)
            {
                var read = RandomAccess.Read(place.Segment.Handle, bytes, offset);
                if (read == 0)
                {
                    throw new IOException("the file ended before the rows written to it");
                }
                bytes = bytes[read..];
                offset += read;
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw Failure("read", e);
        }
    }

    public void Free(StoredBlock block)
    {
        var segment = ((Place)block.Location).Segment;
        lock (_gate)
        {
            segment.LiveBlocks--;
            CloseIfUnused(segment);
        }
    }

    /// <summary>No more rows will be written: the segments close (and go) as soon as no block in them is needed.</summary>
    public void Dispose()
    {
        lock (_gate)
        {
            _disposed = true;
            if (_current is { } current)
            {
                _current = null;
                CloseIfUnused(current);
            }
        }
    }

    /// <summary>Closes (and so deletes) a segment none of whose blocks is needed, unless rows may still go into it.</summary>
    private void CloseIfUnused(Segment segment)
    {
        if (segment.LiveBlocks > 0 || (segment == _current && !_disposed) || segment.Handle.IsClosed)
        {
            return;
        }
        segment.Handle.Dispose();
        _openSegments--;
    }

    private Segment Open()
    {
        var path = Path.Combine(_directory, $"bcprep-rows-{Environment.ProcessId}-{Guid.NewGuid():N}.tmp");
        SafeFileHandle handle;
        try
        {
            handle = File.OpenHandle(path, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, FileOptions.DeleteOnClose);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw Failure("create", e);
        }
        if (!OperatingSystem.IsWindows())
        {
            try
            {
                File.Delete(path);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // Still deleted when the handle is closed; only a killed run would leave it.
            }
        }
        _openSegments++;
        return new Segment(handle);
    }

    private BcPrepFailure Failure(string verb, Exception e) =>
        new(FailureKind.Output, new SourceLocation(_directory),
            $"cannot {verb} the temporary file that keeps the rows of the plateau under way ({Reason(e)}); " +
            "make sure this folder exists, is writable and has room (8 bytes × (channels + 1) × rate × seconds of the longest plateau), " +
            "or set TMPDIR to another folder");

    /// <summary>The cause in our words (no framework message reaches the user); the system's error number when unnamed.</summary>
    private static string Reason(Exception e) => e switch
    {
        DirectoryNotFoundException => "the folder does not exist",
        UnauthorizedAccessException => "permission denied",
        // ENOSPC, EDQUOT on Linux; ERROR_DISK_FULL, ERROR_HANDLE_DISK_FULL on Windows.
        IOException { HResult: 28 or 122 or unchecked((int)0x80070070) or unchecked((int)0x80070027) } => "no room left on its file system",
        IOException { HResult: 30 } => "its file system is read-only",
        IOException io when io.Message.StartsWith("the file ended", StringComparison.Ordinal) => io.Message,
        IOException io => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"input/output error, system code {io.HResult}"),
        _ => "the path is not valid",
    };

    private sealed class Segment(SafeFileHandle handle)
    {
        public SafeFileHandle Handle { get; } = handle;

        /// <summary>Bytes written or reserved so far: where the next block goes.</summary>
        public long Length { get; set; }

        /// <summary>Blocks in the segment not yet freed.</summary>
        public int LiveBlocks { get; set; }
    }

    private sealed record Place(Segment Segment, long Offset);
}
