using System.IO.Compression;
using System.Reflection;

namespace BcPrep.Reading;

/// <summary>
/// Decompresses a gzip log and refuses one that is cut short. The framework's <see cref="GZipStream"/> checks each
/// member's CRC-32 and length when it reaches the member's trailer, but when the file simply ends mid-member (a copy
/// cut short, a full disk) it reports an ordinary end of data, and the rows after the cut would be silently missing.
/// So at the end of the data this asks the decompressor whether it reached the end of its last member, and throws
/// <see cref="InvalidDataException"/> if not. A corrupt member (CRC or length mismatch) is reported in plain words
/// instead of the framework's message about compression methods.
/// </summary>
/// <remarks>
/// The decompressor's state is not public; it is read by reflection (field <c>_deflateStream</c> of GZipStream,
/// <c>_inflater</c> of DeflateStream, method <c>Finished</c>), pinned by <c>CheckedGzipStreamTests</c>. Should a
/// runtime rename them, the check falls back to comparing a single member's trailer (the file's last 8 bytes: CRC-32
/// and length modulo 2³²) with what was decompressed.
/// </remarks>
public sealed class CheckedGzipStream : Stream
{
    private static readonly FieldInfo? DeflateField = typeof(GZipStream).GetField("_deflateStream", BindingFlags.NonPublic | BindingFlags.Instance);
    private static readonly FieldInfo? InflaterField = typeof(DeflateStream).GetField("_inflater", BindingFlags.NonPublic | BindingFlags.Instance);

    private static readonly bool InflaterVisible = DeflateField is not null && InflaterField is not null;

    private readonly Stream _compressed;
    private readonly GZipStream _gzip;
    private readonly byte[]? _trailer;
    private uint _crc = 0xFFFFFFFF;
    private long _length;
    private bool _checked;

    public CheckedGzipStream(Stream compressed)
    {
        _compressed = compressed;
        if (!InflaterVisible && compressed.CanSeek && compressed.Length >= 18)
        {
            var position = compressed.Position;
            compressed.Seek(-8, SeekOrigin.End);
            _trailer = new byte[8];
            compressed.ReadExactly(_trailer);
            compressed.Seek(position, SeekOrigin.Begin);
        }
        _gzip = new GZipStream(compressed, CompressionMode.Decompress);
    }

    public override bool CanRead => true;

    public override bool CanSeek => false;

    public override bool CanWrite => false;

    public override long Length => throw new NotSupportedException();

    public override long Position { get => _length; set => throw new NotSupportedException(); }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        int n;
        try
        {
            n = _gzip.Read(buffer);
        }
        catch (InvalidDataException)
        {
            throw new InvalidDataException("the gzip data is corrupt (a CRC-32 or length check failed, or the compressed data is damaged)");
        }
        if (n > 0)
        {
            Update(buffer[..n]);
        }
        else if (buffer.Length > 0 && !_checked)
        {
            _checked = true;
            if (!ReachedEnd())
            {
                throw new InvalidDataException("the gzip file is truncated: it ends before its last member's end marker and CRC-32 (the copy was cut short?)");
            }
        }
        return n;
    }

    private bool ReachedEnd()
    {
        var deflate = DeflateField?.GetValue(_gzip);
        var inflater = deflate is null ? null : InflaterField?.GetValue(deflate);
        var finished = inflater?.GetType().GetMethod("Finished", BindingFlags.NonPublic | BindingFlags.Public | BindingFlags.Instance);
        if (inflater is not null && finished is not null && finished.Invoke(inflater, null) is bool done)
        {
            return done;
        }
        return _trailer is not null
            && BitConverter.ToUInt32(_trailer, 0) == ~_crc
            && BitConverter.ToUInt32(_trailer, 4) == (uint)_length;
    }

    private void Update(ReadOnlySpan<byte> data)
    {
        _length += data.Length;
        if (_trailer is null)
        {
            return;
        }
        var crc = _crc;
        foreach (var b in data)
        {
            crc = Table[(crc ^ b) & 0xFF] ^ (crc >> 8);
        }
        _crc = crc;
    }

    private static readonly uint[] Table = BuildTable();

    /// <summary>The CRC-32 of gzip (RFC 1952 section 8, reflected polynomial 0xEDB88320).</summary>
    private static uint[] BuildTable()
    {
        var table = new uint[256];
        for (uint i = 0; i < 256; i++)
        {
            var c = i;
            for (var k = 0; k < 8; k++)
            {
                c = (c & 1) != 0 ? 0xEDB88320 ^ (c >> 1) : c >> 1;
            }
            table[i] = c;
        }
        return table;
    }

    public override void Flush()
    {
    }

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _gzip.Dispose();
            _compressed.Dispose();
        }
        base.Dispose(disposing);
    }
}
