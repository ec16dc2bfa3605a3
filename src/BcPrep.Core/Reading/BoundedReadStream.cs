namespace BcPrep.Reading;

/// <summary>
/// A read-only view of the first <c>limit</c> bytes of a stream: what a logger has completed of a file it is still
/// writing. Bytes appended later are not seen, so a partly written last line never reaches the parser.
/// </summary>
internal sealed class BoundedReadStream(Stream inner, long limit) : Stream
{
    public override bool CanRead => true;

    public override bool CanSeek => inner.CanSeek;

    public override bool CanWrite => false;

    public override long Length => Math.Min(limit, inner.Length);

    public override long Position
    {
        get => inner.Position;
        set => inner.Position = value;
    }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        var left = limit - inner.Position;
        if (left <= 0)
        {
            return 0;
        }
        return inner.Read(buffer[..(int)Math.Min(buffer.Length, left)]);
    }

    public override long Seek(long offset, SeekOrigin origin) => inner.Seek(offset, origin);

    public override void Flush()
    {
    }

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            inner.Dispose();
        }
        base.Dispose(disposing);
    }
}
