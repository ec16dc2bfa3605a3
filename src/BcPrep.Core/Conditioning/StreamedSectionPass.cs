using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// Zero-phase filtering of one gap-free segment through one second-order section, streamed: the forward pass keeps
/// its state from sample to sample, so each sample is filtered forward once; the backward pass runs over the
/// forward output in stretches, each starting <see cref="Overlap"/> samples beyond what it emits from the steady
/// state of the last forward value, whose error has decayed below the seam residual by then. At the segment's two
/// ends the section runs over an odd extension of <see cref="Overlap"/> samples from its steady state, exactly as
/// <see cref="ZeroPhaseFilter.ForwardBackwardPadded(IReadOnlyList{SecondOrderSection}, ReadOnlySpan{double}, int?)"/>
/// does with that pad (<see cref="ChannelConditioner.FilterZeroPhase"/>): the forward pass is the same arithmetic
/// sample for sample. A segment no longer than <see cref="EdgeLength"/> is filtered whole.
/// </summary>
internal sealed partial class StreamedSectionPass
{
    private readonly SecondOrderSection _s;
    private readonly int _core;
    private readonly Action<ReadOnlySpan<double>> _emit;
    private readonly StreamedSectionPass? _next;
    private readonly List<double> _head = [];
    private readonly List<double> _forward = [];
    private readonly double[] _recent;
    private long _recentCount;
    private double[] _pad = [];
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
        Overlap = overlap;
        EdgeLength = overlap + 1;
        _recent = new double[EdgeLength];
        _core = Math.Max(core, overlap);
        _emit = emit;
        _next = next;
    }

    /// <summary>Samples the backward pass runs beyond what it emits.</summary>
    public int Overlap { get; }

    /// <summary>Samples a segment needs before it streams: its odd extension reflects <see cref="Overlap"/> of them about the first.</summary>
    public int EdgeLength { get; }

    /// <summary>Samples of the open segment, in order.</summary>
    public void Push(ReadOnlySpan<double> u)
    {
        if (!_started)
        {
            // A segment's first input is usually a whole stretch of the section before, longer than the edge: it is
            // read where it is instead of being copied into the head first (about a megabyte per section and channel).
            ReadOnlySpan<double> head = u;
            if (_head.Count > 0 || u.Length < EdgeLength)
            {
                _head.AddRange(u);
                if (_head.Count < EdgeLength)
                {
                    return;
                }
                head = CollectionsMarshal.AsSpan(_head);
            }
            var pad = LeftExtension(head);
            var (u0, u1) = _s.StepState();
            (_z0, _z1) = (u0 * pad[0], u1 * pad[0]);
            FilterForward(pad, pad);
            _started = true;
            Forward(head);
            // The head waits only for a segment's first samples; once they stream, its array (as long as the first
            // input, up to a stretch of the section before) is not kept for the rest of the day.
            _head.Clear();
            _head.Capacity = 0;
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
                _emit(ZeroPhaseFilter.ForwardBackwardPadded([_s], CollectionsMarshal.AsSpan(_head), ChannelConditioner.EdgePad(_s, _head.Count)));
                _head.Clear();
            }
        }
        else
        {
            // The forward pass runs on over the odd extension past the last sample, and the backward pass comes back
            // over it from the steady state of its last value, as the whole-record filter does.
            var pad = RightExtension(RecentInOrder());
            FilterForward(pad, pad);
            var (u0, u1) = _s.StepState();
            var (z0, z1) = BackwardState(pad, u0 * pad[^1], u1 * pad[^1]);
            Backward(z0, z1, _forward.Count);
            _recentCount = 0;
            _started = false;
        }
        _next?.End();
    }

    /// <summary>
    /// Keeps the segment's last <see cref="EdgeLength"/> inputs, from which its end extension is reflected, in a ring:
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
        ReserveForward(start + u.Length, u.Length);
        CollectionsMarshal.SetCount(_forward, start + u.Length);
        FilterForward(u, CollectionsMarshal.AsSpan(_forward)[start..]);
    }

    /// <summary>
    /// Room for <paramref name="count"/> forward values: at first a stretch, its overlap and an input as long as this
    /// one (the most held before a backward stretch when inputs are alike), so the list does not grow by doubling
    /// through arrays that are copied and dropped (each new one's pages first touched, which costs more than the copy).
    /// </summary>
    private void ReserveForward(int count, int input)
    {
        if (_forward.Capacity < count)
        {
            _forward.Capacity = Math.Max(count, Math.Max(_forward.Capacity * 2, _core + Overlap + input));
        }
    }

    /// <summary>Filters forward from the carried state, carrying it on (<paramref name="u"/> and <paramref name="f"/> may be the same span).</summary>
    private void FilterForward(ReadOnlySpan<double> u, Span<double> f)
    {
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

    /// <summary>The backward pass's state after running from (z0, z1) back over <paramref name="f"/> (its outputs are not needed).</summary>
    private (double Z0, double Z1) BackwardState(ReadOnlySpan<double> f, double z0, double z1)
    {
        double b0 = _s.B0, b1 = _s.B1, b2 = _s.B2, a1 = _s.A1, a2 = _s.A2;
        for (var i = f.Length - 1; i >= 0; i--)
        {
            var x = f[i];
            var yi = (b0 * x) + z0;
            z0 = (b1 * x) - (a1 * yi) + z1;
            z1 = (b2 * x) - (a2 * yi);
        }
        return (z0, z1);
    }

    /// <summary>The <see cref="Overlap"/> samples before the first, reflected about it: 2·x[0] − x[Overlap…1].</summary>
    private Span<double> LeftExtension(ReadOnlySpan<double> x)
    {
        var pad = PadBuffer();
        for (var i = 0; i < pad.Length; i++)
        {
            pad[i] = (2.0 * x[0]) - x[Overlap - i];
        }
        return pad;
    }

    /// <summary>The <see cref="Overlap"/> samples after the last of <paramref name="recent"/>, reflected about it: 2·x[n−1] − x[n−2…n−1−Overlap].</summary>
    private Span<double> RightExtension(ReadOnlySpan<double> recent)
    {
        var pad = PadBuffer();
        var n = recent.Length;
        for (var i = 0; i < pad.Length; i++)
        {
            pad[i] = (2.0 * recent[n - 1]) - recent[n - 2 - i];
        }
        return pad;
    }

    private Span<double> PadBuffer()
    {
        if (_pad.Length != Overlap)
        {
            _pad = new double[Overlap];
        }
        return _pad;
    }

    /// <summary>Backward pass over every forward value held, from the state (z0, z1) at the last; emits the first <paramref name="count"/>.</summary>
    /// <remarks>
    /// The emitted values overwrite the forward values they come from (each is read before it is written); the
    /// overlap beyond them is run for the state only and keeps its forward values for the next stretch.
    /// </remarks>
    private void Backward(double z0, double z1, int count)
    {
        var f = CollectionsMarshal.AsSpan(_forward);
        (z0, z1) = BackwardState(f[count..], z0, z1);
        double b0 = _s.B0, b1 = _s.B1, b2 = _s.B2, a1 = _s.A1, a2 = _s.A2;
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
