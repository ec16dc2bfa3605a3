using System.Runtime.InteropServices;

namespace BcPrep.Live;

/// <summary>
/// The block means of one key channel over the current stretch (times s since the day's first row, values SI).
/// Memory is one pair of doubles per block of the stretch, at most <see cref="MaxBlocks"/>: beyond that the oldest
/// tenth is dropped, which for a settled stretch only shortens the record the fit and the Type A see.
/// </summary>
internal sealed class KeyTrack
{
    /// <summary>Largest number of blocks kept (about 55 h of 1 s blocks). Common practice: a day fits whole.</summary>
    public const int MaxBlocks = 200_000;

    private readonly List<double> _times = new();
    private readonly List<double> _values = new();

    public int Count => _times.Count;

    public ReadOnlySpan<double> Times => CollectionsMarshal.AsSpan(_times);

    public ReadOnlySpan<double> Values => CollectionsMarshal.AsSpan(_values);

    public void Add(double timeS, double value)
    {
        if (_times.Count >= MaxBlocks)
        {
            _times.RemoveRange(0, MaxBlocks / 10);
            _values.RemoveRange(0, MaxBlocks / 10);
        }
        _times.Add(timeS);
        _values.Add(value);
    }

    /// <summary>Mean of the finite values among blocks [from, to).</summary>
    public double MeanOf(int from, int to)
    {
        var sum = 0.0;
        var n = 0;
        for (var i = from; i < to; i++)
        {
            if (double.IsFinite(_values[i]))
            {
                sum += _values[i];
                n++;
            }
        }
        return n == 0 ? double.NaN : sum / n;
    }

    /// <summary>Forgets the blocks before <paramref name="timeS"/> (a new stretch begins there).</summary>
    public void DropBefore(double timeS)
    {
        var keep = _times.FindIndex(t => t >= timeS);
        var drop = keep < 0 ? _times.Count : keep;
        _times.RemoveRange(0, drop);
        _values.RemoveRange(0, drop);
    }

    /// <summary>Blocks whose time lies before <paramref name="timeS"/> (times increase).</summary>
    public int CountBefore(double timeS)
    {
        var n = _times.Count;
        while (n > 0 && _times[n - 1] >= timeS)
        {
            n--;
        }
        return n;
    }

    /// <summary>Finite values from <paramref name="timeS"/> on, before <paramref name="beforeS"/>.</summary>
    public double[] FiniteValuesFrom(double timeS, double beforeS = double.PositiveInfinity)
    {
        var result = new List<double>();
        for (var i = 0; i < _times.Count; i++)
        {
            if (_times[i] >= timeS && _times[i] < beforeS && double.IsFinite(_values[i]))
            {
                result.Add(_values[i]);
            }
        }
        return result.ToArray();
    }
}
