using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// A full sliding window of finite values kept sorted without data-dependent branches: each slide counts with
/// vector compares where the leaving value sits and where the entering one goes, then rebuilds the sorted values
/// by a vector blend of the old ones shifted by −1, 0 or +1 place. On noisy signals the insertion loops of a plain
/// sorted window mispredict on almost every sample; this costs the same whatever the values.
/// </summary>
internal sealed class VectorSortedWindow
{
    private static readonly int Lanes = Vector<double>.Count;
    private static readonly Vector<long> FirstLanes = Vector<long>.Indices;

    private readonly int _count;
    private readonly int _chunks;
    private double[] _current;
    private double[] _next;

    /// <summary>Sorts the first window (any finite values).</summary>
    public VectorSortedWindow(ReadOnlySpan<double> first)
    {
        _count = first.Length;
        _chunks = (_count + Lanes - 1) / Lanes;
        // Values sit at [1, count]; one slot before and a vector's worth after are +∞ padding, which no finite
        // value counts as below, so reading past either end changes no count and no blend.
        _current = NewBuffer();
        _next = NewBuffer();
        first.CopyTo(_current.AsSpan(1));
        _current.AsSpan(1, _count).Sort();
    }

    /// <summary>The window's values, ascending.</summary>
    public ReadOnlySpan<double> Sorted => _current.AsSpan(1, _count);

    /// <summary>Middle value of the odd-sized window.</summary>
    public double Median => _current[1 + (_count / 2)];

    /// <summary>Removes <paramref name="leaving"/> (a value of the window) and adds <paramref name="entering"/>, both finite.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Slide(double leaving, double entering)
    {
        var (p, belowEntering) = CountBelow(leaving, entering);
        int q = belowEntering - (leaving < entering ? 1 : 0);
        ref double source = ref MemoryMarshal.GetArrayDataReference(_current);
        ref double target = ref MemoryMarshal.GetArrayDataReference(_next);
        var lane = FirstLanes;
        var step = new Vector<long>(Lanes);
        var pv = new Vector<long>(p);
        var qv = new Vector<long>(q);
        var ev = new Vector<double>(entering);
        for (int c = 0; c < _chunks; c++)
        {
            int i = c * Lanes;
            // Element j of the new order: below the insertion point it is the old order without the leaving value,
            // at it the entering value, above it the old order without the leaving value, one place on.
            var before = Vector.LoadUnsafe(ref source, (nuint)i);
            var at = Vector.LoadUnsafe(ref source, (nuint)(i + 1));
            var after = Vector.LoadUnsafe(ref source, (nuint)(i + 2));
            var below = Vector.ConditionalSelect(Vector.LessThan(lane, pv).As<long, double>(), at, after);
            var above = Vector.ConditionalSelect(Vector.LessThanOrEqual(lane, pv).As<long, double>(), before, at);
            var placed = Vector.ConditionalSelect(Vector.Equals(lane, qv).As<long, double>(), ev, above);
            Vector.ConditionalSelect(Vector.LessThan(lane, qv).As<long, double>(), below, placed).StoreUnsafe(ref target, (nuint)(i + 1));
            lane += step;
        }
        // Lanes past the last value take "one place on" from the +∞ padding, so the padding stays +∞.
        (_current, _next) = (_next, _current);
    }

    /// <summary>How many values lie strictly between <paramref name="low"/> and <paramref name="high"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public int CountInside(double low, double high)
    {
        ref double values = ref MemoryMarshal.GetArrayDataReference(_current);
        var lo = new Vector<double>(low);
        var hi = new Vector<double>(high);
        var count = Vector<long>.Zero;
        for (int c = 0; c < _chunks; c++)
        {
            var v = Vector.LoadUnsafe(ref values, (nuint)(1 + (c * Lanes)));
            count -= Vector.BitwiseAnd(Vector.GreaterThan(v, lo), Vector.LessThan(v, hi));
        }
        return (int)Vector.Sum(count);
    }

    /// <summary>The numbers of values below <paramref name="first"/> and below <paramref name="second"/>, in one sweep.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private (int First, int Second) CountBelow(double first, double second)
    {
        ref double values = ref MemoryMarshal.GetArrayDataReference(_current);
        var a = new Vector<double>(first);
        var b = new Vector<double>(second);
        var countA = Vector<long>.Zero;
        var countB = Vector<long>.Zero;
        for (int c = 0; c < _chunks; c++)
        {
            var v = Vector.LoadUnsafe(ref values, (nuint)(1 + (c * Lanes)));
            countA -= Vector.LessThan(v, a);
            countB -= Vector.LessThan(v, b);
        }
        return ((int)Vector.Sum(countA), (int)Vector.Sum(countB));
    }

    private double[] NewBuffer()
    {
        var buffer = new double[1 + (_chunks * Lanes) + Lanes];
        Array.Fill(buffer, double.PositiveInfinity);
        return buffer;
    }
}
