namespace BcPrep.Uncertainty;

/// <summary>
/// cos, sin(2πk/L) for k &lt; <see cref="Count"/> = L/2, the twiddles of one FFT stage, read in place from
/// <see cref="RadixTwoFft"/>'s tables (entry offset + k·stride), so that no stage needs a copy of its own.
/// </summary>
internal readonly struct StageTwiddles
{
    private readonly double[] _cos;
    private readonly double[] _sin;
    private readonly int _offset;
    private readonly int _stride;

    public StageTwiddles(double[] cos, double[] sin, int offset, int stride, int count)
    {
        _cos = cos;
        _sin = sin;
        _offset = offset;
        _stride = stride;
        Count = count;
    }

    /// <summary>Entries: half the stage's length.</summary>
    public int Count { get; }

    public double Cos(int k) => _cos[_offset + (k * _stride)];

    public double Sin(int k) => _sin[_offset + (k * _stride)];
}
