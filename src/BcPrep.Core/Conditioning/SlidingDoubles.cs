namespace BcPrep.Conditioning;

/// <summary>
/// The live stretch of a long series of doubles, addressed by absolute index (0 = the first value ever appended):
/// appended at the end and dropped from the front without moving what stays. The live part moves to the front of
/// the buffer only when the end runs out of room and at least half the buffer was dropped, so each value is moved
/// about once at most. A logger's time axis is one of these, read by every channel's conditioner in place of a copy
/// per channel (17 channels of a 1 kHz hour copied the same times several times each).
/// </summary>
internal sealed class SlidingDoubles
{
    private double[] _buffer = [];
    private int _offset;

    /// <summary>Absolute index of the first live value.</summary>
    public long Start { get; private set; }

    /// <summary>Live values.</summary>
    public int Count { get; private set; }

    /// <summary>Absolute index after the last value.</summary>
    public long End => Start + Count;

    /// <summary>All live values.</summary>
    public ReadOnlySpan<double> Live => _buffer.AsSpan(_offset, Count);

    public void Append(ReadOnlySpan<double> values)
    {
        var needed = Count + values.Length;
        if (_offset + needed > _buffer.Length)
        {
            if (needed <= _buffer.Length / 2)
            {
                _buffer.AsSpan(_offset, Count).CopyTo(_buffer);
            }
            else
            {
                var grown = new double[Math.Max(1024, 2 * needed)];
                _buffer.AsSpan(_offset, Count).CopyTo(grown);
                _buffer = grown;
            }
            _offset = 0;
        }
        values.CopyTo(_buffer.AsSpan(_offset + Count));
        Count = needed;
    }

    /// <summary>The values at absolute indices [from, from + length); they must be live.</summary>
    public ReadOnlySpan<double> Slice(long from, int length)
    {
        if (from < Start || length < 0 || from + length > End)
        {
            throw new ArgumentOutOfRangeException(nameof(from), from, $"values [{from}, {from + length}) are not live (live: [{Start}, {End}))");
        }
        return _buffer.AsSpan(_offset + (int)(from - Start), length);
    }

    /// <summary>Drops the values before absolute index <paramref name="absolute"/> (nothing when it is not after <see cref="Start"/>).</summary>
    public void DropBefore(long absolute)
    {
        if (absolute <= Start)
        {
            return;
        }
        var k = (int)Math.Min(absolute - Start, Count);
        _offset += k;
        Count -= k;
        Start += k;
        if (Count == 0)
        {
            _offset = 0;
        }
    }
}
