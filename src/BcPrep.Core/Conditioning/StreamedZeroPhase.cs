using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// The notch and low-pass of the conditioning chain on a stream of gap-bridged, de-spiked samples: cut into gap-free
/// segments as <see cref="ChannelConditioner.Condition"/> cuts them (a missing value or a time step longer than
/// <see cref="GapBridging.JumpFactor"/> nominal intervals), each segment filtered zero-phase one section after the
/// other (<see cref="StreamedSectionPass"/>), a segment not longer than the default pad set to NaN. Conditioned
/// values are appended to the output list in order, one per sample accepted, with a delay of about the sections'
/// cores and overlaps; the caller keeps their times (<see cref="TimeRuns"/>), which the filters do not change.
/// </summary>
internal sealed partial class StreamedZeroPhase
{
    private readonly StreamedSectionPass[] _passes;
    private readonly int _minimumPad;
    private readonly double _jumpS;
    private readonly List<double> _outValues;
    private long _held;
    private readonly List<double> _segmentStart = [];
    private bool _open;
    private bool _streaming;
    private double _lastS;

    /// <param name="sections">The cascade (notches, then low-pass); empty passes samples through.</param>
    /// <param name="nominalIntervalS">The sample interval, for the jump that cuts a segment.</param>
    /// <param name="core">Samples emitted per backward stretch of a section (at least its overlap).</param>
    /// <param name="coreOverlaps">A stretch is also at least this many of the section's overlaps long.</param>
    /// <param name="outValues">Receives the conditioned values, in the order the samples were accepted.</param>
    public StreamedZeroPhase(IReadOnlyList<SecondOrderSection> sections, double nominalIntervalS, int core, int coreOverlaps, List<double> outValues)
    {
        _outValues = outValues;
        _jumpS = GapBridging.JumpFactor * nominalIntervalS;
        _minimumPad = sections.Count > 0 ? ZeroPhaseFilter.DefaultPadLength(sections) : 0;
        _passes = new StreamedSectionPass[sections.Count];
        for (var k = sections.Count - 1; k >= 0; k--)
        {
            var overlap = ChannelConditioner.EdgePad(sections[k], int.MaxValue);
            var next = k + 1 < sections.Count ? _passes[k + 1] : null;
            Action<ReadOnlySpan<double>> emit = next is null ? Emit : next.Push;
            _passes[k] = new StreamedSectionPass(sections[k], overlap, Math.Max(core, coreOverlaps * overlap), emit, next);
        }
    }

    /// <summary>The longest backward overlap of the sections (0 without sections).</summary>
    public int Overlap => _passes.Length == 0 ? 0 : _passes.Max(p => p.Overlap);

    /// <summary>Gap-free segments filtered so far.</summary>
    public int Segments { get; private set; }

    /// <summary>Samples of segments too short to filter, set to NaN.</summary>
    public long Unfiltered { get; private set; }

    /// <summary>Samples in time order (after those of earlier calls).</summary>
    public void Accept(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values)
    {
        if (_passes.Length == 0)
        {
            _outValues.AddRange(values);
            return;
        }
        var i = 0;
        while (i < values.Length)
        {
            if (!double.IsFinite(values[i]))
            {
                EndSegment();
                _outValues.Add(values[i]);
                i++;
                continue;
            }
            if (_open && timesS[i] - _lastS > _jumpS)
            {
                EndSegment();
            }
            var end = i + 1;
            while (end < values.Length && double.IsFinite(values[end]) && timesS[end] - timesS[end - 1] <= _jumpS)
            {
                end++;
            }
            Feed(timesS[i..end], values[i..end]);
            i = end;
        }
    }

    /// <summary>Ends the open segment (the end of the stream).</summary>
    public void Complete() => EndSegment();

    private void Feed(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values)
    {
        _open = true;
        _lastS = timesS[^1];
        _held += timesS.Length;
        if (_streaming)
        {
            _passes[0].Push(values);
            return;
        }
        // The first samples wait until the segment is known to be longer than the pad (else it stays unfiltered); a
        // first input already longer goes on where it is.
        if (_segmentStart.Count == 0 && values.Length > _minimumPad)
        {
            _streaming = true;
            _passes[0].Push(values);
            return;
        }
        _segmentStart.AddRange(values);
        if (_segmentStart.Count > _minimumPad)
        {
            _streaming = true;
            _passes[0].Push(CollectionsMarshal.AsSpan(_segmentStart));
            _segmentStart.Clear();
            _segmentStart.Capacity = 0; // as a section's head: not kept once the segment streams
        }
    }

    private void EndSegment()
    {
        if (!_open)
        {
            return;
        }
        if (_streaming)
        {
            _passes[0].End();
            Segments++;
        }
        else
        {
            Unfiltered += _segmentStart.Count;
            var nan = new double[_segmentStart.Count];
            Array.Fill(nan, double.NaN);
            Emit(nan);
            _segmentStart.Clear();
        }
        if (_held != 0)
        {
            throw new InvalidOperationException($"{_held} samples of a segment were not emitted");
        }
        _open = false;
        _streaming = false;
    }

    private void Emit(ReadOnlySpan<double> values)
    {
        if (values.Length > _held)
        {
            throw new InvalidOperationException($"{values.Length} samples emitted of {_held} held");
        }
        _outValues.AddRange(values);
        _held -= values.Length;
    }
}
