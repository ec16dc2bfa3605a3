namespace BcPrep.Uncertainty;

/// <summary>
/// cos, sin(2πk/L) for k &lt; <see cref="Count"/> = L/2, the twiddles of one FFT stage, read in place from
/// <see cref="RadixTwoFft"/>'s contiguous table (entry offset + k·stride) or made from its factored tables (index
/// k·stride), so that no stage needs a copy of its own.
/// </summary>
internal readonly struct StageTwiddles
{
    private readonly double[]? _cos;
    private readonly double[]? _sin;
    private readonly FactoredTwiddles? _factored;
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

    public StageTwiddles(FactoredTwiddles factored, int stride, int count)
    {
        _factored = factored;
        _stride = stride;
        Count = count;
    }

    /// <summary>Entries: half the stage's length.</summary>
    public int Count { get; }

    /// <summary>cos and sin of 2πk/L together (the factored tables make both from the same two entries).</summary>
    public (double Cos, double Sin) At(int k) =>
        _factored is { } factored ? factored.At(k * _stride) : (_cos![_offset + (k * _stride)], _sin![_offset + (k * _stride)]);

    public double Cos(int k) => At(k).Cos;

    public double Sin(int k) => At(k).Sin;
}
