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
/// The times are not copied along the chain: a channel keeps runs of absolute positions on the time axis
/// (<see cref="TimeRuns"/>), its own times only for a chunk where gap bridging inserted samples; channels of one
/// logger can read one shared axis (<see cref="Pipeline.ConditionedBlockSink"/>) instead of a copy each.
/// </summary>
public sealed class StreamingConditioner
{
    /// <summary>Residual of a filter transient at the end of the overlap (relative to the step that caused it).</summary>
    public const double SeamResidual = 1e-14;

    private readonly ConditioningSettings _settings;
    private readonly int _coreOverlaps;
    private readonly int _filterCore;
    private int _coreLength;
    private readonly SlidingDoubles _axis;
    private readonly bool _ownsAxis;
    private long _tStart;
    private readonly SlidingDoubles _x = new();
    private int _history;
    private StreamedZeroPhase? _filters;
    private double[] _bridgedTimes = [];
    private double[] _bridgedValues = [];
    private double[] _despiked = [];
    private int _despikedRoom;
    private bool[] _interpolated = [];
    private readonly TimeRuns _pendingRuns = new();
    // A pending chunk keeps the de-spiked array it was written to (from its first emitted sample), instead of a copy
    // of its values; the array comes back to the spares once the chunk is filtered.
    private readonly List<(double[] Values, int Start)> _pendingValues = [];
    private readonly Stack<double[]> _spareDespiked = new();
    private readonly TimeRuns _outRuns = new();

    /// <param name="settings">Conditioning settings (validated when the first chunk is conditioned).</param>
    /// <param name="coreLength">Samples emitted per chunk of the gap bridging and Hampel, and per backward stretch of a filter section (≥ 16).</param>
    /// <param name="coreOverlaps">
    /// A chunk's core is also at least this many of its overlaps long (≥ 1), so that repeated context costs at most
    /// 1/k of the samples emitted. Memory grows with k; the output does not change beyond rounding (the seams move).
    /// </param>
    public StreamingConditioner(ConditioningSettings settings, int coreLength = 65536, int coreOverlaps = 1)
        : this(settings, coreLength, coreOverlaps, null)
    {
    }

    /// <param name="settings">As above.</param>
    /// <param name="coreLength">As above.</param>
    /// <param name="coreOverlaps">As above.</param>
    /// <param name="sharedTimes">
    /// The logger's time axis, appended by the caller before each <see cref="PushValues"/> and read by every channel
    /// of the logger; the caller drops what none needs any longer (<see cref="OldestTimeNeeded"/>) and takes the
    /// conditioned times with <see cref="CopyOutputTimes"/>. <see cref="OutputTimesS"/> then stays empty. Null: the
    /// conditioner keeps its own axis (<see cref="Push"/>).
    /// </param>
    internal StreamingConditioner(ConditioningSettings settings, int coreLength, int coreOverlaps, SlidingDoubles? sharedTimes)
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
        _ownsAxis = sharedTimes is null;
        _axis = sharedTimes ?? new SlidingDoubles();
        _tStart = _axis.End;
    }

    /// <summary>Context samples on each side of a gap bridging and Hampel chunk; 0 until the sample interval is known (first chunk).</summary>
    public int LocalOverlap { get; private set; }

    /// <summary>
    /// The longest context the chain looks at beyond what it emits: the chunks' context or the filters' backward
    /// overlap, whichever is longer; 0 until the first chunk.
    /// </summary>
    public int Overlap => Math.Max(LocalOverlap, _filters?.Overlap ?? 0);

    /// <summary>Conditioned times (s) not yet taken by the caller (empty with a shared time axis).</summary>
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
        if (!_ownsAxis)
        {
            throw new InvalidOperationException("The times of this conditioner come from a shared axis: push values only.");
        }
        if (timesS.Length != values.Length)
        {
            throw new ArgumentException("Times and values must have the same length.", nameof(values));
        }
        _axis.Append(timesS);
        PushValues(values);
        Tidy();
    }

    /// <summary>
    /// Appends samples whose times were just appended to the shared axis (as many as values) and conditions every
    /// full chunk. Channels of one axis may push at the same time; the axis must not change meanwhile.
    /// </summary>
    internal void PushValues(ReadOnlySpan<double> values)
    {
        _x.Append(values);
        if (_axis.End - _tStart != _x.Count)
        {
            throw new InvalidOperationException($"{_x.Count} values against {_axis.End - _tStart} times");
        }
        if (LocalOverlap == 0 && _x.Count >= 64)
        {
            LocalOverlap = LocalOverlapFor(Times);
            // The kept context must lie inside what was emitted, and a long core amortises the repeated context.
            _coreLength = Math.Max(_coreLength, _coreOverlaps * LocalOverlap);
        }
        while (LocalOverlap > 0 && _x.Count - _history >= _coreLength + LocalOverlap)
        {
            ConditionChunk(_history + _coreLength + LocalOverlap, Times[_history + _coreLength]);
        }
    }

    /// <summary>The times of the samples not yet conditioned (and the kept context).</summary>
    private ReadOnlySpan<double> Times => _axis.Slice(_tStart, _x.Count);

    /// <summary>The absolute index of the earliest time on the axis this conditioner still reads.</summary>
    internal long OldestTimeNeeded => Math.Min(_tStart, Math.Min(_pendingRuns.FirstOnAxis ?? long.MaxValue, _outRuns.FirstOnAxis ?? long.MaxValue));

    /// <summary>Copies the times of the first <c>destination.Length</c> values of <see cref="OutputValues"/>.</summary>
    internal void CopyOutputTimes(Span<double> destination) => _outRuns.CopyTo(_axis, destination);

    /// <summary>Whether the first <paramref name="count"/> conditioned times equal those of <paramref name="other"/>.</summary>
    internal bool SameOutputTimes(StreamingConditioner other, int count) => _outRuns.SameAs(_axis, other._outRuns, other._axis, count);

    /// <summary>Forgets the times of the first <paramref name="count"/> conditioned values (taken from <see cref="OutputValues"/> by the caller).</summary>
    internal void DropOutputTimes(int count) => _outRuns.Drop(count);

    /// <summary>
    /// With its own axis: the times of values emitted since go to <see cref="OutputTimesS"/>, and the axis forgets
    /// what is no longer read. With a shared axis the caller does both.
    /// </summary>
    private void Tidy()
    {
        if (!_ownsAxis)
        {
            return;
        }
        var emitted = OutputValues.Count - OutputTimesS.Count;
        if (emitted > 0)
        {
            _outRuns.MoveTo(_axis, OutputTimesS, emitted);
        }
        _axis.DropBefore(OldestTimeNeeded);
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
        if (_x.Count - _history > 0)
        {
            if (_filters is null && _x.Count < 2)
            {
                _outRuns.Add(new TimeRun(_tStart, _x.Count));
                OutputValues.AddRange(_x.Live);
            }
            else
            {
                ConditionChunk(_x.Count, double.PositiveInfinity);
            }
        }
        _tStart += _x.Count;
        _x.DropBefore(_x.End);
        _history = 0;
        Tidy();
    }

    /// <summary>The last part of <see cref="Complete"/>: the filters end the open segment.</summary>
    internal void CompleteFilters()
    {
        _filters?.Complete();
        Tidy();
    }

    /// <summary>Filters the pending chunks (<see cref="DeferFilters"/>) of this channel alone.</summary>
    internal void AcceptPending()
    {
        var p = 0;
        foreach (var run in _pendingRuns.Runs)
        {
            _outRuns.Add(run);
            _filters!.Accept(run.Times(_axis), PendingValues(p++, run.Length));
        }
        ClearPending();
        Tidy();
    }

    /// <summary>
    /// Filters the pending chunks of channels that share one time axis: four at a time in the lanes of one vector
    /// when their chunks have the same times (<see cref="StreamedZeroPhase.AcceptLanes"/>), else channel by channel.
    /// Either way each channel's output is what <see cref="AcceptPending()"/> gives, bit for bit.
    /// </summary>
    internal static void AcceptPending(IReadOnlyList<StreamingConditioner> group)
    {
        var first = group[0];
        // The same pieces (the filters' stretches follow the lengths pushed) with the same times in every channel (on
        // one shared axis: the same positions, found without reading them).
        var together = group.Count == StreamedSectionPass.Lanes && group.All(c => c._filters is not null
            && c._pendingRuns.Runs.Select(r => r.Length).SequenceEqual(first._pendingRuns.Runs.Select(r => r.Length))
            && c._pendingRuns.SameAs(c._axis, first._pendingRuns, first._axis));
        if (!together)
        {
            foreach (var c in group)
            {
                c.AcceptPending();
            }
            return;
        }
        var filters = group.Select(c => c._filters!).ToArray();
        var p = 0;
        foreach (var run in first._pendingRuns.Runs)
        {
            var length = run.Length;
            StreamedZeroPhase.AcceptLanes(filters, run.Times(first._axis), group[0].PendingValues(p, length), group[1].PendingValues(p, length),
                group[2].PendingValues(p, length), group[3].PendingValues(p, length));
            p++;
        }
        foreach (var c in group)
        {
            foreach (var run in c._pendingRuns.Runs)
            {
                c._outRuns.Add(run);
            }
            c.ClearPending();
            c.Tidy();
        }
    }

    /// <summary>The values of pending chunk <paramref name="piece"/> (in the order of the pending runs).</summary>
    private ReadOnlySpan<double> PendingValues(int piece, int length)
    {
        var (values, start) = _pendingValues[piece];
        return values.AsSpan(start, length);
    }

    private void ClearPending()
    {
        _pendingRuns.Clear();
        foreach (var (values, _) in _pendingValues)
        {
            _spareDespiked.Push(values);
        }
        _pendingValues.Clear();
    }

    private void ConditionChunk(int end, double emitBeforeS)
    {
        // Bridged and de-spiked into buffers kept from chunk to chunk: a chunk is about a megabyte per series, and
        // fresh arrays for every chunk of every channel went to the large-object heap faster than it was collected.
        var t = Times[..end];
        var x = _x.Live[..end];
        var search = GapBridging.Search(t, x, _settings.MaxBridgeS);
        var n = end + search.Report.InsertedSamples;
        if (_despiked.Length < n)
        {
            var room = Math.Max(n, _despikedRoom * 5 / 4);
            _despiked = new double[room];
            _despikedRoom = room;
        }
        // Nearly every chunk has nothing to bridge: then the bridged series is the chunk itself, read in place. A
        // bridged chunk without inserted samples keeps its times too; only inserted samples give it times of its own.
        var bridged = search.BridgedPairs.Count > 0;
        var ownTimes = search.Report.InsertedSamples > 0;
        ReadOnlySpan<double> times = t;
        ReadOnlySpan<double> values = x;
        if (bridged)
        {
            if (_bridgedValues.Length < n)
            {
                var room = Math.Max(n, _bridgedValues.Length * 5 / 4);
                _bridgedTimes = new double[room];
                _bridgedValues = new double[room];
                _interpolated = new bool[room];
            }
            var flags = _interpolated.AsSpan(0, n);
            flags.Clear();
            GapBridging.AssembleInto(t, x, search, ownTimes ? _bridgedTimes.AsSpan(0, n) : Span<double>.Empty, _bridgedValues.AsSpan(0, n), flags);
            times = ownTimes ? _bridgedTimes.AsSpan(0, n) : t;
            values = _bridgedValues.AsSpan(0, n);
        }
        var despiked = _despiked.AsSpan(0, n);
        var replaced = HampelFilter.ApplyInto(values, despiked, _settings.HampelHalfWindow, _settings.HampelSigmas, _settings.HampelScaleFloor);
        _filters ??= Filters(search.Report.NominalIntervalS);
        var emitFromS = _history > 0 ? t[_history] : double.NegativeInfinity;
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
        if (bridged)
        {
            foreach (var flag in _interpolated.AsSpan(from, to - from))
            {
                BridgedSamples += flag ? 1 : 0;
            }
        }
        foreach (var i in replaced)
        {
            SpikesReplaced += i >= from && i < to ? 1 : 0;
        }
        // Without inserted samples bridged index i is the chunk's sample i, at absolute position _tStart + i.
        var run = ownTimes ? new TimeRun(0, to - from, times[from..to].ToArray()) : new TimeRun(_tStart + from, to - from);
        if (DeferFilters)
        {
            if (run.Length > 0)
            {
                // The runs skip empty pieces, and so do the values (they are taken piece by piece with the runs).
                _pendingRuns.Add(run);
                _pendingValues.Add((_despiked, from));
                _despiked = _spareDespiked.Count > 0 ? _spareDespiked.Pop() : [];
            }
        }
        else
        {
            _outRuns.Add(run);
            _filters.Accept(times[from..to], despiked[from..to]);
        }
        if (double.IsPositiveInfinity(emitBeforeS))
        {
            return;
        }
        // Keep `LocalOverlap` already emitted samples as the left context of the next chunk.
        var drop = _history + _coreLength - LocalOverlap;
        _tStart += drop;
        _x.DropBefore(_x.Start + drop);
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
        return new StreamedZeroPhase(sections, nominalIntervalS, _filterCore, _coreOverlaps, OutputValues);
    }

    private int LocalOverlapFor(ReadOnlySpan<double> times)
    {
        var steps = new double[times.Length - 1];
        for (var i = 1; i < times.Length; i++)
        {
            steps[i - 1] = times[i] - times[i - 1];
        }
        Array.Sort(steps);
        var nominal = steps[steps.Length / 2];
        var bridge = (int)Math.Ceiling(_settings.MaxBridgeS / nominal);
        return (2 * bridge) + (4 * _settings.HampelHalfWindow) + 16;
    }
}
