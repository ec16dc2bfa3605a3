using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// cos, sin(2πj/Size) for j &lt; Size/2 (Size a power of two) from two small tables instead of one of Size/2 entries:
/// with j = h·F + l (F a power of two near √(Size/2)), the angle is the sum of a coarse angle 2πhF/Size and a fine
/// one 2πl/Size, so cos = cᵢ + (cᵢ·(c_f − 1) − sᵢ·s_f) and sin = sᵢ + (sᵢ·(c_f − 1) + cᵢ·s_f). The fine cosine is kept
/// as c_f − 1 = −2 sin²(π l/Size), a small number known to full relative precision, so the correction terms are small
/// and add little to the coarse entry's own rounding: each result is within 4.5e-16 of Math.Cos and Math.Sin of the
/// rounded angle and of the exact twiddle (tested over every index at 2²²: 4.44e-16 at most against either, where the
/// direct values themselves lie up to 3.9e-16 from the exact ones, their angle being rounded). Where l = 0 the
/// coarse entry is returned as it is: exactly Math.Cos/Math.Sin(2πj/Size), the double the direct expression gives.
/// At Size = 2²² the tables hold 2 × 1024 + 3 × 2048 doubles (48 kB) instead of 2 × 2²¹ (32 MB).
/// </summary>
internal sealed class FactoredTwiddles
{
    private readonly double[] _coarseCos;
    private readonly double[] _coarseSin;
    private readonly double[] _fineCosMinusOne;
    private readonly double[] _fineSin;
    private readonly int _fineBits;
    private readonly int _fineMask;

    private FactoredTwiddles(int size)
    {
        Size = size;
        var half = Math.Max(size / 2, 1);
        var bits = BitOperations.Log2((uint)half);
        _fineBits = (bits + 1) / 2;
        var fine = 1 << _fineBits;
        _fineMask = fine - 1;
        var coarse = Math.Max(half >> _fineBits, 1);
        _coarseCos = new double[coarse];
        _coarseSin = new double[coarse];
        for (var h = 0; h < coarse; h++)
        {
            // The expression of the direct table (2πk/n with k = hF), so these are the very doubles it held.
            var angle = 2.0 * Math.PI * (h << _fineBits) / size;
            _coarseCos[h] = Math.Cos(angle);
            _coarseSin[h] = Math.Sin(angle);
        }
        _fineCosMinusOne = new double[fine];
        _fineSin = new double[fine];
        for (var l = 0; l < fine; l++)
        {
            var angle = 2.0 * Math.PI * l / size;
            var halfSin = Math.Sin(Math.PI * l / size);
            _fineCosMinusOne[l] = -2.0 * halfSin * halfSin;
            _fineSin[l] = Math.Sin(angle);
        }
    }

    /// <summary>The transform length the tables are for: index j stands for the angle 2πj/Size.</summary>
    public int Size { get; }

    /// <summary>The tables for <paramref name="size"/> points (a power of two).</summary>
    public static FactoredTwiddles Build(int size) => new(size);

    /// <summary>cos, sin(2πj/Size), j &lt; Size/2.</summary>
    public (double Cos, double Sin) At(int j)
    {
        var l = j & _fineMask;
        return AngleSum(_coarseCos[j >> _fineBits], _coarseSin[j >> _fineBits], _fineCosMinusOne[l], _fineSin[l]);
    }

    /// <summary>cos and sin of a coarse angle (c, s) plus a fine one (its cosine less one, fc, and its sine, fs).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static (double Cos, double Sin) AngleSum(double c, double s, double fc, double fs) =>
        (c + ((c * fc) - (s * fs)), s + ((s * fc) + (c * fs)));

    /// <summary>cos, sin(2πj/Size) for j = first, first + stride, … into <paramref name="cos"/> and <paramref name="sin"/> (one per element).</summary>
    public void Fill(int first, int stride, Span<double> cos, Span<double> sin)
    {
        var coarseCos = _coarseCos;
        var coarseSin = _coarseSin;
        var fineCosMinusOne = _fineCosMinusOne;
        var fineSin = _fineSin;
        for (int i = 0, j = first; i < cos.Length; i++, j += stride)
        {
            var h = j >> _fineBits;
            var l = j & _fineMask;
            (cos[i], sin[i]) = AngleSum(coarseCos[h], coarseSin[h], fineCosMinusOne[l], fineSin[l]);
        }
    }
}
