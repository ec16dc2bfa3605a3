using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// Zero-phase filtering of one gap-free segment through one second-order section, streamed: the forward pass keeps
/// its state from sample to sample, so each sample is filtered forward once; the backward pass runs over the
/// forward output in stretches, each starting <see cref="Overlap"/> samples beyond what it emits from the steady
/// state of the last forward value, whose error has decayed below the seam residual by then. The states at the
/// segment's two ends are Gustafsson's (<see cref="ForwardBackwardGustafsson.InitialStates"/>), taken from the
/// first and last <see cref="EdgeLength"/> samples; a segment no longer than that is filtered whole, exactly as
/// <see cref="ForwardBackwardGustafsson.Apply"/> does.
/// </summary>
internal sealed partial class StreamedSectionPass
{
    private readonly SecondOrderSection _s;
    private readonly double[] _b;
    private readonly double[] _a;
    private readonly int _core;
    private readonly Action<ReadOnlySpan<double>> _emit;
    private readonly StreamedSectionPass? _next;
    private readonly List<double> _head = [];
    private readonly List<double> _forward = [];
    private readonly double[] _recent;
    private long _recentCount;
    private bool _started;
    private double _z0;
    private double _z1;

    /// <param name="section">The section.</param>
    /// <param name="overlap">Samples the backward pass runs beyond what it emits (the section's settling to the seam residual).</param>
    /// <param name="core">Samples emitted per backward stretch (at least <paramref name="overlap"/>): the overlap's share of the work falls as it grows.</param>
    /// <param name="emit">Receives the filtered samples in order (the next section's input, or the output).</param>
    /// <param name="next">The next section, told when the segment ends (after the last samples are emitted).</param>
    public StreamedSectionPass(SecondOrderSection section, int overlap, int core, Action<ReadOnlySpan<double>> emit, StreamedSectionPass? next)
    {
        _s = section;
        _b = section.IsFirstOrder ? [section.B0, section.B1] : [section.B0, section.B1, section.B2];
        _a = section.IsFirstOrder ? [1.0, section.A1] : [1.0, section.A1, section.A2];
        Overlap = overlap;
        EdgeLength = (2 * overlap) + 16;
        _recent = new double[EdgeLength];
        _core = Math.Max(core, overlap);
        _emit = emit;
        _next = next;
    }

    /// <summary>Samples the backward pass runs beyond what it emits.</summary>
    public int Overlap { get; }

    /// <summary>Samples at each end of a segment from which its Gustafsson states are solved (twice the overlap).</summary>
    public int EdgeLength { get; }

    /// <summary>Samples of the open segment, in order.</summary>
    public void Push(ReadOnlySpan<double> u)
    {
        if (!_started)
        {
            _head.AddRange(u);
            if (_head.Count < EdgeLength)
            {
                return;
            }
            var head = CollectionsMarshal.AsSpan(_head);
            var (forward, _) = ForwardBackwardGustafsson.InitialStates(_b, _a, head[..EdgeLength]);
            _z0 = forward[0];
            _z1 = forward.Length > 1 ? forward[1] : 0.0;
            _started = true;
            Forward(head);
            _head.Clear();
        }
        else
        {
            Forward(u);
        }
        while (_forward.Count >= _core + Overlap)
        {
            var last = _forward[^1];
            var (u0, u1) = _s.StepState();
            Backward(u0 * last, u1 * last, _forward.Count - Overlap);
        }
    }

    /// <summary>The segment ends: filters and emits what is left, then ends the segment in the next section.</summary>
    public void End()
    {
        if (!_started)
        {
            if (_head.Count > 0)
            {
                _emit(ForwardBackwardGustafsson.Apply(_b, _a, CollectionsMarshal.AsSpan(_head)));
                _head.Clear();
            }
        }
        else
        {
            var (_, backward) = ForwardBackwardGustafsson.InitialStates(_b, _a, RecentInOrder());
            Backward(backward[0], backward.Length > 1 ? backward[1] : 0.0, _forward.Count);
            _recentCount = 0;
            _started = false;
        }
        _next?.End();
    }

    /// <summary>
    /// Keeps the segment's last <see cref="EdgeLength"/> inputs, from which its end state is solved, in a ring:
    /// sample number k (counted from the segment's start) sits at k mod <see cref="EdgeLength"/>.
    /// </summary>
    private void Remember(ReadOnlySpan<double> u)
    {
        var n = _recent.Length;
        if (u.Length >= n)
        {
            // Only the last n count; placed where the ring would have put them.
            var start = (int)((_recentCount + u.Length - n) % n);
            var tail = u[^n..];
            tail[..(n - start)].CopyTo(_recent.AsSpan(start));
            tail[(n - start)..].CopyTo(_recent);
        }
        else
        {
            var start = (int)(_recentCount % n);
            var first = Math.Min(u.Length, n - start);
            u[..first].CopyTo(_recent.AsSpan(start));
            u[first..].CopyTo(_recent);
        }
        _recentCount += u.Length;
    }

    /// <summary>The last <see cref="EdgeLength"/> inputs in time order (at least that many have been seen).</summary>
    private double[] RecentInOrder()
    {
        var n = _recent.Length;
        var start = (int)(_recentCount % n);
        var ordered = new double[n];
        _recent.AsSpan(start).CopyTo(ordered);
        _recent.AsSpan(0, start).CopyTo(ordered.AsSpan(n - start));
        return ordered;
    }

    private void Forward(ReadOnlySpan<double> u)
    {
        Remember(u);
        var start = _forward.Count;
        CollectionsMarshal.SetCount(_forward, start + u.Length);
        var f = CollectionsMarshal.AsSpan(_forward)[start..];
        double b0 = _s.B0, b1 = _s.B1, b2 = _s.B2, a1 = _s.A1, a2 = _s.A2;
        double z0 = _z0, z1 = _z1;
        for (var i = 0; i < u.Length; i++)
        {
            var x = u[i];
            var y = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * y) + z1;
            z1 = (b2 * x) - (a2 * y);
            f[i] = y;
        }
        _z0 = z0;
        _z1 = z1;
    }

    /// <summary>Backward pass over every forward value held, from the state (z0, z1) at the last; emits the first <paramref name="count"/>.</summary>
    /// <remarks>
    /// The emitted values overwrite the forward values they come from (each is read before it is written); the
    /// overlap beyond them is run for the state only and keeps its forward values for the next stretch.
    /// </remarks>
    private void Backward(double z0, double z1, int count)
    {
        var f = CollectionsMarshal.AsSpan(_forward);
        double b0 = _s.B0, b1 = _s.B1, b2 = _s.B2, a1 = _s.A1, a2 = _s.A2;
        for (var i = f.Length - 1; i >= count; i--)
        {
            var x = f[i];
            var yi = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * yi) + z1;
            z1 = (b2 * x) - (a2 * yi);
        }
        for (var i = count - 1; i >= 0; i--)
        {
            var x = f[i];
            var yi = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * yi) + z1;
            z1 = (b2 * x) - (a2 * yi);
            f[i] = yi;
        }
        _emit(f[..count]);
        _forward.RemoveRange(0, count);
    }
}
