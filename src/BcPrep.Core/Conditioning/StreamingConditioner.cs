using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// The conditioning chain of <see cref="ChannelConditioner.Condition"/> applied to a channel of any length with
/// bounded memory, in two parts. Gap bridging and Hampel look only a few samples (and at most the longest bridged
/// gap) away: they run on chunks of <c>coreLength</c> samples, each with <see cref="LocalOverlap"/> samples of context
/// on both sides that are conditioned but not emitted. Notch and low-pass then run on the stream of bridged,
/// de-spiked samples (<see cref="StreamedZeroPhase"/>): each section's forward pass carries its state across
/// chunks, and its backward pass runs one settling length (to <see cref="SeamResidual"/>) beyond what it emits, so
/// a sample is filtered about once forward and once backward instead of re-filtering overlaps of twice the
/// settling on both sides. The output equals the whole-record result to rounding (tested to 1e-11 of the signal
/// level). Memory: a chunk plus its context, and per section a core plus its overlap.
/// </summary>
public sealed class StreamingConditioner
{
    /// <summary>Residual of a filter transient at the end of the overlap (relative to the step that caused it).</summary>
    public const double SeamResidual = 1e-14;

    private readonly ConditioningSettings _settings;
    private readonly int _coreOverlaps;
    private readonly int _filterCore;
    private int _coreLength;
    private readonly List<double> _t = [];
    private readonly List<double> _x = [];
    private int _history;
    private StreamedZeroPhase? _filters;
    private double[] _bridgedTimes = [];
    private double[] _bridgedValues = [];
    private double[] _despiked = [];
    private bool[] _interpolated = [];
    private readonly List<double> _pendingTimes = [];
    private readonly List<double> _pendingValues = [];
    private readonly List<int> _pieces = [];

    /// <param name="settings">Conditioning settings (validated when the first chunk is conditioned).</param>
    /// <param name="coreLength">Samples emitted per chunk of the gap bridging and Hampel, and per backward stretch of a filter section (≥ 16).</param>
    /// <param name="coreOverlaps">
    /// A chunk's core is also at least this many of its overlaps long (≥ 1), so that repeated context costs at most
    /// 1/k of the samples emitted. Memory grows with k; the output does not change beyond rounding (the seams move).
    /// </param>
    public StreamingConditioner(ConditioningSettings settings, int coreLength = 65536, int coreOverlaps = 1)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (coreLength < 16)
        {
            throw new ArgumentOutOfRangeException(nameof(coreLength), coreLength, "A chunk holds at least 16 samples.");
        }
        ArgumentOutOfRangeException.ThrowIfLessThan(coreOverlaps, 1);
        _settings = settings;
        _coreLength = coreLength;
        _filterCore = coreLength;
        _coreOverlaps = coreOverlaps;
    }

    /// <summary>Context samples on each side of a gap bridging and Hampel chunk; 0 until the sample interval is known (first chunk).</summary>
    public int LocalOverlap { get; private set; }

    /// <summary>
    /// The longest context the chain looks at beyond what it emits: the chunks' context or the filters' backward
    /// overlap, whichever is longer; 0 until the first chunk.
    /// </summary>
    public int Overlap => Math.Max(LocalOverlap, _filters?.Overlap ?? 0);

    /// <summary>Conditioned times (s) not yet taken by the caller.</summary>
    public List<double> OutputTimesS { get; } = [];

    /// <summary>Conditioned values not yet taken by the caller (NaN where a gap stays open or a segment was too short).</summary>
    public List<double> OutputValues { get; } = [];

    /// <summary>Samples replaced by the Hampel filter so far (emitted samples only).</summary>
    public long SpikesReplaced { get; private set; }

    /// <summary>Samples filled in by gap bridging so far (emitted samples only).</summary>
    public long BridgedSamples { get; private set; }

    /// <summary>Notch frequencies applied (from the first chunk; empty when mains is off or above Nyquist).</summary>
    public IReadOnlyList<double> NotchFrequenciesHz { get; private set; } = [];

    /// <summary>Appends samples (times strictly increasing across calls) and conditions every full chunk.</summary>
    public void Push(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values)
    {
        if (timesS.Length != values.Length)
        {
            throw new ArgumentException("Times and values must have the same length.", nameof(values));
        }
        _t.AddRange(timesS);
        _x.AddRange(values);
        if (LocalOverlap == 0 && _t.Count >= 64)
        {
            LocalOverlap = LocalOverlapFor(_t);
            // The kept context must lie inside what was emitted, and a long core amortises the repeated context.
            _coreLength = Math.Max(_coreLength, _coreOverlaps * LocalOverlap);
        }
        while (LocalOverlap > 0 && _t.Count - _history >= _coreLength + LocalOverlap)
        {
            ConditionChunk(_history + _coreLength + LocalOverlap, _t[_history + _coreLength]);
        }
    }

    /// <summary>Conditions what is left; call once after the last <see cref="Push"/>.</summary>
    public void Complete()
    {
        CompleteChunks();
        AcceptPending();
        CompleteFilters();
    }

    /// <summary>
    /// Leaves the notch and low-pass input of each chunk pending (in order, chunk by chunk) instead of filtering it
    /// at once, so that <see cref="AcceptPending(IReadOnlyList{StreamingConditioner})"/> can filter several channels
    /// together. The caller then calls <see cref="CompleteChunks"/>, the pending step and <see cref="CompleteFilters"/>
    /// in place of <see cref="Complete"/>.
    /// </summary>
    internal bool DeferFilters { get; init; }

    /// <summary>Samples filtered in the lanes of a vector together with three other channels (for tests).</summary>
    internal long SamplesFilteredInLanes => _filters?.SamplesInLanes ?? 0;

    /// <summary>The first part of <see cref="Complete"/>: gap bridging and Hampel on what is left.</summary>
    internal void CompleteChunks()
    {
        if (_t.Count - _history > 0)
        {
            if (_filters is null && _t.Count < 2)
            {
                OutputTimesS.AddRange(_t);
                OutputValues.AddRange(_x);
            }
            else
            {
                ConditionChunk(_t.Count, double.PositiveInfinity);
            }
        }
        _t.Clear();
        _x.Clear();
        _history = 0;
    }

    /// <summary>The last part of <see cref="Complete"/>: the filters end the open segment.</summary>
    internal void CompleteFilters() => _filters?.Complete();

    /// <summary>Filters the pending chunks (<see cref="DeferFilters"/>) of this channel alone.</summary>
    internal void AcceptPending()
    {
        var offset = 0;
        foreach (var length in _pieces)
        {
            _filters!.Accept(CollectionsMarshal.AsSpan(_pendingTimes).Slice(offset, length), CollectionsMarshal.AsSpan(_pendingValues).Slice(offset, length));
            offset += length;
        }
        ClearPending();
    }

    /// <summary>
    /// Filters the pending chunks of channels that share one time axis: four at a time in the lanes of one vector
    /// when their chunks have the same times (<see cref="StreamedZeroPhase.AcceptLanes"/>), else channel by channel.
    /// Either way each channel's output is what <see cref="AcceptPending()"/> gives, bit for bit.
    /// </summary>
    internal static void AcceptPending(IReadOnlyList<StreamingConditioner> group)
    {
        var first = group[0];
        var together = group.Count == StreamedSectionPass.Lanes && group.All(c => c._filters is not null
            && c._pieces.Count == first._pieces.Count
            && CollectionsMarshal.AsSpan(c._pieces).SequenceEqual(CollectionsMarshal.AsSpan(first._pieces))
            && CollectionsMarshal.AsSpan(c._pendingTimes).SequenceEqual(CollectionsMarshal.AsSpan(first._pendingTimes)));
        if (!together)
        {
            foreach (var c in group)
            {
                c.AcceptPending();
            }
            return;
        }
        var filters = group.Select(c => c._filters!).ToArray();
        var times = CollectionsMarshal.AsSpan(first._pendingTimes);
        var v0 = CollectionsMarshal.AsSpan(group[0]._pendingValues);
        var v1 = CollectionsMarshal.AsSpan(group[1]._pendingValues);
        var v2 = CollectionsMarshal.AsSpan(group[2]._pendingValues);
        var v3 = CollectionsMarshal.AsSpan(group[3]._pendingValues);
        var offset = 0;
        foreach (var length in first._pieces)
        {
            StreamedZeroPhase.AcceptLanes(filters, times.Slice(offset, length), v0.Slice(offset, length), v1.Slice(offset, length), v2.Slice(offset, length), v3.Slice(offset, length));
            offset += length;
        }
        foreach (var c in group)
        {
            c.ClearPending();
        }
    }

    private void ClearPending()
    {
        _pendingTimes.Clear();
        _pendingValues.Clear();
        _pieces.Clear();
    }

    private void ConditionChunk(int end, double emitBeforeS)
    {
        // Bridged and de-spiked into buffers kept from chunk to chunk: a chunk is about a megabyte per series, and
        // fresh arrays for every chunk of every channel went to the large-object heap faster than it was collected.
        var t = CollectionsMarshal.AsSpan(_t)[..end];
        var x = CollectionsMarshal.AsSpan(_x)[..end];
        var search = GapBridging.Search(t, x, _settings.MaxBridgeS);
        var n = end + search.Report.InsertedSamples;
        if (_bridgedTimes.Length < n)
        {
            var room = Math.Max(n, _bridgedTimes.Length * 5 / 4);
            _bridgedTimes = new double[room];
            _bridgedValues = new double[room];
            _despiked = new double[room];
            _interpolated = new bool[room];
        }
        var interpolated = _interpolated.AsSpan(0, n);
        interpolated.Clear();
        GapBridging.AssembleInto(t, x, search, _bridgedTimes.AsSpan(0, n), _bridgedValues.AsSpan(0, n), interpolated);
        var despiked = _despiked.AsSpan(0, n);
        var replaced = HampelFilter.ApplyInto(_bridgedValues.AsSpan(0, n), despiked, _settings.HampelHalfWindow, _settings.HampelSigmas, _settings.HampelScaleFloor);
        _filters ??= Filters(search.Report.NominalIntervalS);
        var emitFromS = _history > 0 ? _t[_history] : double.NegativeInfinity;
        ReadOnlySpan<double> times = _bridgedTimes.AsSpan(0, n);
        var from = 0;
        while (from < times.Length && times[from] < emitFromS)
        {
            from++;
        }
        var to = from;
        while (to < times.Length && times[to] < emitBeforeS)
        {
            to++;
        }
        for (var i = from; i < to; i++)
        {
            BridgedSamples += interpolated[i] ? 1 : 0;
        }
        foreach (var i in replaced)
        {
            SpikesReplaced += i >= from && i < to ? 1 : 0;
        }
        if (DeferFilters)
        {
            _pendingTimes.AddRange(times[from..to]);
            _pendingValues.AddRange(despiked[from..to]);
            _pieces.Add(to - from);
        }
        else
        {
            _filters.Accept(times[from..to], despiked[from..to]);
        }
        if (double.IsPositiveInfinity(emitBeforeS))
        {
            return;
        }
        // Keep `LocalOverlap` already emitted samples as the left context of the next chunk.
        var drop = _history + _coreLength - LocalOverlap;
        _t.RemoveRange(0, drop);
        _x.RemoveRange(0, drop);
        _history = LocalOverlap;
    }

    /// <summary>The notch and low-pass sections at the chunk's sample rate, as <see cref="ChannelConditioner.Condition"/> designs them.</summary>
    private StreamedZeroPhase Filters(double nominalIntervalS)
    {
        var fs = 1.0 / nominalIntervalS;
        var sections = new List<SecondOrderSection>();
        var notches = new List<double>();
        if (_settings.MainsHz is double mains && mains < fs / 2.0)
        {
            var notch = MainsNotch.WithHarmonics(mains, _settings.NotchQ, _settings.NotchHarmonics, fs);
            sections.AddRange(notch.Sections);
            notches.AddRange(Enumerable.Range(1, notch.Sections.Count).Select(k => k * mains));
        }
        if (_settings.LowPassCutoffHz is double cutoff)
        {
            sections.AddRange(ButterworthDesign.LowPass(_settings.LowPassOrder, cutoff, fs).Sections);
        }
        NotchFrequenciesHz = notches;
        return new StreamedZeroPhase(sections, nominalIntervalS, _filterCore, _coreOverlaps, OutputTimesS, OutputValues);
    }

    private int LocalOverlapFor(List<double> times)
    {
        var steps = new double[times.Count - 1];
        for (var i = 1; i < times.Count; i++)
        {
            steps[i - 1] = times[i] - times[i - 1];
        }
        Array.Sort(steps);
        var nominal = steps[steps.Length / 2];
        var bridge = (int)Math.Ceiling(_settings.MaxBridgeS / nominal);
        return (2 * bridge) + (4 * _settings.HampelHalfWindow) + 16;
    }
}
