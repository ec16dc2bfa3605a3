using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace BcPrep.Conditioning;

/// <summary>
/// Four passes of the same section in step (four channels on one time axis, in the same state): their forward and
/// backward recursions run in the four lanes of one vector. A biquad's recursion waits on its previous sample, so one
/// channel at a time leaves the multiplier idle most of each step; four independent channels fill it. Each lane does
/// the operations of <see cref="Push"/> in the same order, without fused multiply-adds, so every value is the one the
/// pass gives alone, bit for bit.
/// </summary>
internal sealed partial class StreamedSectionPass
{
    /// <summary>Passes held together in one call.</summary>
    public const int Lanes = 4;

    /// <summary>
    /// True when the four passes (and the sections after them) can take the same input lengths together: the same
    /// section, overlap and stretch, and the same counts of held samples.
    /// </summary>
    public static bool InStep(IReadOnlyList<StreamedSectionPass> lanes)
    {
        foreach (var lane in lanes)
        {
            for (StreamedSectionPass? first = lanes[0], other = lane; first is not null; first = first._next, other = other._next)
            {
                if (other is null || other._s != first._s || other.Overlap != first.Overlap || other._core != first._core
                    || other._started != first._started || other._head.Count != first._head.Count
                    || other._forward.Count != first._forward.Count || other._recentCount != first._recentCount
                    || (other._next is null) != (first._next is null))
                {
                    return false;
                }
            }
        }
        return true;
    }

    /// <summary>As <see cref="Push"/> on each of four passes in step (<see cref="InStep"/>), with inputs of equal length.</summary>
    public static void PushLanes(StreamedSectionPass[] lanes, ReadOnlySpan<double> u0, ReadOnlySpan<double> u1, ReadOnlySpan<double> u2, ReadOnlySpan<double> u3)
    {
        var p = lanes[0];
        if (!p._started)
        {
            // As Push: a first input longer than the edge is read where it is.
            ReadOnlySpan<double> h0 = u0, h1 = u1, h2 = u2, h3 = u3;
            if (p._head.Count > 0 || u0.Length < p.EdgeLength)
            {
                for (var j = 0; j < Lanes; j++)
                {
                    lanes[j]._head.AddRange(Pick(j, u0, u1, u2, u3));
                }
                if (p._head.Count < p.EdgeLength)
                {
                    return;
                }
                h0 = CollectionsMarshal.AsSpan(lanes[0]._head);
                h1 = CollectionsMarshal.AsSpan(lanes[1]._head);
                h2 = CollectionsMarshal.AsSpan(lanes[2]._head);
                h3 = CollectionsMarshal.AsSpan(lanes[3]._head);
            }
            for (var j = 0; j < Lanes; j++)
            {
                var lane = lanes[j];
                // As Push: the forward state comes from the odd extension before the segment's first sample.
                var pad = lane.LeftExtension(Pick(j, h0, h1, h2, h3));
                var (s0, s1) = lane._s.StepState();
                (lane._z0, lane._z1) = (s0 * pad[0], s1 * pad[0]);
                lane.FilterForward(pad, pad);
                lane._started = true;
            }
            ForwardLanes(lanes, h0, h1, h2, h3);
            foreach (var lane in lanes)
            {
                lane._head.Clear();
                lane._head.Capacity = 0;
            }
        }
        else
        {
            ForwardLanes(lanes, u0, u1, u2, u3);
        }
        while (p._forward.Count >= p._core + p.Overlap)
        {
            BackwardLanes(lanes, p._forward.Count - p.Overlap);
        }
    }

    private static ReadOnlySpan<double> Pick(int j, ReadOnlySpan<double> u0, ReadOnlySpan<double> u1, ReadOnlySpan<double> u2, ReadOnlySpan<double> u3) =>
        j switch { 0 => u0, 1 => u1, 2 => u2, _ => u3 };

    /// <summary>As <see cref="Forward"/> on each lane.</summary>
    private static void ForwardLanes(StreamedSectionPass[] lanes, ReadOnlySpan<double> u0, ReadOnlySpan<double> u1, ReadOnlySpan<double> u2, ReadOnlySpan<double> u3)
    {
        var n = u0.Length;
        if (u1.Length != n || u2.Length != n || u3.Length != n)
        {
            throw new ArgumentException("Lanes take inputs of equal length.");
        }
        var start = lanes[0]._forward.Count;
        for (var j = 0; j < Lanes; j++)
        {
            lanes[j].Remember(Pick(j, u0, u1, u2, u3));
            lanes[j].ReserveForward(start + n, n);
            CollectionsMarshal.SetCount(lanes[j]._forward, start + n);
        }
        var f0 = CollectionsMarshal.AsSpan(lanes[0]._forward).Slice(start, n);
        var f1 = CollectionsMarshal.AsSpan(lanes[1]._forward).Slice(start, n);
        var f2 = CollectionsMarshal.AsSpan(lanes[2]._forward).Slice(start, n);
        var f3 = CollectionsMarshal.AsSpan(lanes[3]._forward).Slice(start, n);
        var s = lanes[0]._s;
        var b0 = Vector256.Create(s.B0);
        var b1 = Vector256.Create(s.B1);
        var b2 = Vector256.Create(s.B2);
        var a1 = Vector256.Create(s.A1);
        var a2 = Vector256.Create(s.A2);
        var z0 = Vector256.Create(lanes[0]._z0, lanes[1]._z0, lanes[2]._z0, lanes[3]._z0);
        var z1 = Vector256.Create(lanes[0]._z1, lanes[1]._z1, lanes[2]._z1, lanes[3]._z1);
        for (var i = 0; i < n; i++)
        {
            var x = Vector256.Create(u0[i], u1[i], u2[i], u3[i]);
            var y = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * y) + z1;
            z1 = (b2 * x) - (a2 * y);
            f0[i] = y.GetElement(0);
            f1[i] = y.GetElement(1);
            f2[i] = y.GetElement(2);
            f3[i] = y.GetElement(3);
        }
        for (var j = 0; j < Lanes; j++)
        {
            lanes[j]._z0 = z0.GetElement(j);
            lanes[j]._z1 = z1.GetElement(j);
        }
    }

    /// <summary>As <see cref="Push"/>'s backward stretch on each lane: from each lane's steady state at its last forward value.</summary>
    private static void BackwardLanes(StreamedSectionPass[] lanes, int count)
    {
        var f0 = CollectionsMarshal.AsSpan(lanes[0]._forward);
        var f1 = CollectionsMarshal.AsSpan(lanes[1]._forward);
        var f2 = CollectionsMarshal.AsSpan(lanes[2]._forward);
        var f3 = CollectionsMarshal.AsSpan(lanes[3]._forward);
        var n = f0.Length;
        if (f1.Length != n || f2.Length != n || f3.Length != n)
        {
            throw new InvalidOperationException("Lanes out of step.");
        }
        var s = lanes[0]._s;
        var (s0, s1) = s.StepState();
        var z0 = Vector256.Create(s0 * f0[^1], s0 * f1[^1], s0 * f2[^1], s0 * f3[^1]);
        var z1 = Vector256.Create(s1 * f0[^1], s1 * f1[^1], s1 * f2[^1], s1 * f3[^1]);
        var b0 = Vector256.Create(s.B0);
        var b1 = Vector256.Create(s.B1);
        var b2 = Vector256.Create(s.B2);
        var a1 = Vector256.Create(s.A1);
        var a2 = Vector256.Create(s.A2);
        for (var i = n - 1; i >= count; i--)
        {
            var x = Vector256.Create(f0[i], f1[i], f2[i], f3[i]);
            var y = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * y) + z1;
            z1 = (b2 * x) - (a2 * y);
        }
        for (var i = count - 1; i >= 0; i--)
        {
            var x = Vector256.Create(f0[i], f1[i], f2[i], f3[i]);
            var y = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * y) + z1;
            z1 = (b2 * x) - (a2 * y);
            f0[i] = y.GetElement(0);
            f1[i] = y.GetElement(1);
            f2[i] = y.GetElement(2);
            f3[i] = y.GetElement(3);
        }
        if (lanes[0]._next is not null)
        {
            var next = new StreamedSectionPass[Lanes];
            for (var j = 0; j < Lanes; j++)
            {
                next[j] = lanes[j]._next!;
            }
            PushLanes(next, f0[..count], f1[..count], f2[..count], f3[..count]);
        }
        else
        {
            lanes[0]._emit(f0[..count]);
            lanes[1]._emit(f1[..count]);
            lanes[2]._emit(f2[..count]);
            lanes[3]._emit(f3[..count]);
        }
        foreach (var lane in lanes)
        {
            lane._forward.RemoveRange(0, count);
        }
    }
}
