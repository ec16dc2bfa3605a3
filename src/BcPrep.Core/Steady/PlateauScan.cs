using static BcPrep.Steady.WindowCriteria;

namespace BcPrep.Steady;

/// <summary>
/// <see cref="PlateauDetector"/> fed one block mean at a time, so that the detection runs while a day is read. A
/// plateau is judged as soon as the step that ends it is certain, and an accepted window is final
/// (<see cref="Final"/>) once the next plateau cannot merge into it; the last ones when the day ends
/// (<see cref="Finish"/>). Everything the detector derives from the day as a whole is taken from the blocks up to
/// the moment it is needed, so that the result does not depend on when it is asked for:
/// <list type="bullet">
/// <item>a block's de-spiked value needs the <see cref="BlockDespike.DefaultHalfWindow"/> blocks after it;</item>
/// <item>the noise and level behind a step threshold are those of the blocks before the compared means end, taken
/// at a grid of block counts (every <see cref="GridS"/> of blocks, then every sixteenth of the day so far) so that
/// they cost O(n log n) over a day, not O(n²);</item>
/// <item>a plateau's noise (settling fit) and the thresholds its window merges by are those of the blocks up to
/// the plateau's end;</item>
/// <item>a flow key's rest minimum, a fraction of the day's largest flow, can only be known at the end of the day:
/// it is applied to the final windows then (a window it rejects was only gathered in vain).</item>
/// </list>
/// Fed all blocks before <see cref="Finish"/> (<see cref="PlateauDetector.Detect"/>), it judges the whole day at
/// once; fed during the read, it gives the same result.
/// </summary>
public sealed class PlateauScan
{
    /// <summary>Base spacing of the grid at which noise and level are re-estimated, in seconds of blocks.</summary>
    public const double GridS = 60.0;

    private readonly IReadOnlyList<KeyChannel> _channels;
    private readonly SteadySettings _settings;
    private readonly double _blockS;
    private readonly int _half;
    private readonly int _grid;
    private readonly int[] _keys;
    private readonly int[] _markers;
    private readonly List<double> _scratch = [];
    private double[] _t = new double[1024];
    private double[][] _raw;
    private double[][] _clean;
    private int _count;
    private int _cleanCount;
    private readonly List<(int Blocks, double[] Noise, double[] Thresholds)> _snapshots = [];
    private int _nextSnapshot;
    private readonly MarkerState[] _state;
    private readonly List<int> _candidates = [];
    private int _lastStep = int.MinValue;
    private int _bound;
    private int _plateau;
    private (SteadyWindow Window, int Plateau)? _pending;
    private readonly List<SteadyWindow> _final = [];
    private readonly List<SteadyWindow> _judged = [];
    private readonly List<RejectedStretch> _rejected = [];
    private bool _finished;

    /// <param name="channels">Key and step-marker channels; their <see cref="KeyChannel.Values"/> are not read.</param>
    /// <param name="settings">Detection settings.</param>
    /// <param name="blockS">Width of one block (s): the block means' own, so that no time is inferred from the day's length.</param>
    public PlateauScan(IReadOnlyList<KeyChannel> channels, SteadySettings settings, double blockS)
    {
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(settings);
        if (!(blockS > 0) || !double.IsFinite(blockS))
        {
            throw new ArgumentOutOfRangeException(nameof(blockS), blockS, "block width must be positive");
        }
        ValidateLimits(channels, settings);
        _channels = channels;
        _settings = settings;
        _blockS = blockS;
        _half = Math.Max(3, (int)Math.Round(PlateauDetector.StepHalfWindowS / blockS));
        _grid = Math.Max(6 * _half, (int)Math.Round(GridS / blockS));
        _nextSnapshot = _grid;
        _keys = [.. Enumerable.Range(0, channels.Count).Where(i => !channels[i].StepOnly)];
        _markers = [.. Enumerable.Range(0, channels.Count).Where(i => channels[i].MarksSteps)];
        _raw = [.. channels.Select(_ => new double[1024])];
        _clean = [.. channels.Select(_ => new double[1024])];
        _state = [.. _markers.Select(_ => new MarkerState(_half))];
    }

    /// <summary>Accepted windows that can no longer change, in time order (before the rest minimum, see the class remarks).</summary>
    public IReadOnlyList<SteadyWindow> Final => _final;

    /// <summary>
    /// Each plateau's accepted window as soon as the plateau is judged, in time order: the final window itself, or,
    /// when the next plateau merges into it (<see cref="PlateauDetector"/>'s "no flicker"), the first part of one.
    /// </summary>
    public IReadOnlyList<SteadyWindow> Judged => _judged;

    /// <summary>
    /// The start (s, the scan's clock) of the plateau under way: no window judged later starts before it. A window
    /// that a later plateau extends by a merge started earlier, when its first part was judged.
    /// </summary>
    public double OpenSinceS => _count == 0 ? double.NegativeInfinity : _t[_bound] - (_blockS / 2);

    /// <summary>Start (s, the scan's clock) of the plateau under way: the last step the scan is certain of, or its first block's start.</summary>
    public double PlateauStartS => _count == 0 ? double.NegativeInfinity : _t[_bound] - (_blockS / 2);

    /// <summary>Blocks added so far.</summary>
    public int Count => _count;

    /// <summary>Adds the next block (time and one mean per channel, NaN for none) and judges what it makes certain.</summary>
    public void Add(double timeS, ReadOnlySpan<double> means)
    {
        Append(timeS, means);
        Advance(atEnd: false);
    }

    /// <summary>Adds the next block without judging anything yet (the whole-day form judges at <see cref="Finish"/>).</summary>
    internal void Append(double timeS, ReadOnlySpan<double> means)
    {
        if (_finished)
        {
            throw new InvalidOperationException("the scan has finished");
        }
        if (means.Length != _channels.Count)
        {
            throw new ArgumentException(Format($"{means.Length} values do not match {_channels.Count} channels."), nameof(means));
        }
        if (_count == _t.Length)
        {
            Array.Resize(ref _t, 2 * _count);
            for (var c = 0; c < _channels.Count; c++)
            {
                Array.Resize(ref _raw[c], 2 * _count);
                Array.Resize(ref _clean[c], 2 * _count);
            }
        }
        _t[_count] = timeS;
        for (var c = 0; c < _channels.Count; c++)
        {
            _raw[c][_count] = means[c];
        }
        _count++;
    }

    /// <summary>Judges the rest of the day and returns its detection; the scan takes no block after it.</summary>
    public SteadyDetectionResult Finish()
    {
        if (!_finished)
        {
            Advance(atEnd: true);
            _finished = true;
        }
        return ApplyRestMinimum();
    }

    private void Advance(bool atEnd)
    {
        var cleanUpTo = atEnd ? _count : _count - BlockDespike.DefaultHalfWindow;
        for (; _cleanCount < cleanUpTo; _cleanCount++)
        {
            for (var c = 0; c < _channels.Count; c++)
            {
                _clean[c][_cleanCount] = BlockDespike.At(_raw[c], _count, _cleanCount, _scratch);
            }
        }
        while (_nextSnapshot <= _cleanCount)
        {
            _snapshots.Add(Snapshot(_nextSnapshot));
            _nextSnapshot += Math.Max(_grid, _nextSnapshot / 16);
        }
        var frontier = int.MaxValue;
        for (var m = 0; m < _markers.Length; m++)
        {
            frontier = Math.Min(frontier, Scan(m, atEnd));
        }
        _candidates.Sort();
        var taken = 0;
        while (taken < _candidates.Count && (atEnd || _candidates[taken] < frontier))
        {
            var k = _candidates[taken++];
            if (_lastStep != int.MinValue && k - _lastStep <= 3 * _half)
            {
                continue;
            }
            _lastStep = k;
            if (k > 0 && k < _count)
            {
                Judge(_bound, k - 2, k);
                _bound = k;
            }
        }
        _candidates.RemoveRange(0, taken);
        if (atEnd)
        {
            Judge(_bound, _count - 1, _count);
            if (_pending is { } open)
            {
                _final.Add(open.Window);
                _pending = null;
            }
        }
    }

    /// <summary>Scores the blocks of one step marker that have become certain; returns the least block a later step of it may start at.</summary>
    private int Scan(int m, bool atEnd)
    {
        var c = _markers[m];
        var y = _clean[c];
        var state = _state[m];
        for (; state.Next + _half <= _cleanCount && state.Next <= _count - _half; state.Next++)
        {
            var k = state.Next;
            var snapshot = SnapshotAt(k + _half);
            var score = snapshot is { } s
                ? Math.Abs(StepFinder.Mean(y, _cleanCount, k, k + _half) - StepFinder.Mean(y, _cleanCount, k - _half, k)) / s.Thresholds[c]
                : 0.0;
            if (score > 1.0)
            {
                if (state.Best < 0)
                {
                    state.RunStart = k;
                }
                if (score > state.Score)
                {
                    state.Score = score;
                    state.Best = k;
                    state.Noise = snapshot!.Value.Noise[c];
                }
            }
            else if (state.Best >= 0)
            {
                EndRun(state, y);
            }
        }
        if (atEnd && state.Best >= 0)
        {
            EndRun(state, y);
        }
        return (state.Best >= 0 ? state.RunStart : state.Next) - _half;
    }

    private void EndRun(MarkerState state, double[] y)
    {
        _candidates.Add(StepFinder.Onset(y, state.Best, state.Noise, _half));
        state.Best = -1;
        state.Score = 0.0;
    }

    /// <summary>The latest snapshot of noise and thresholds taken on at most <paramref name="blocks"/> blocks; null before the first.</summary>
    private (int Blocks, double[] Noise, double[] Thresholds)? SnapshotAt(int blocks)
    {
        for (var i = _snapshots.Count - 1; i >= 0; i--)
        {
            if (_snapshots[i].Blocks <= blocks)
            {
                return _snapshots[i];
            }
        }
        return null;
    }

    /// <summary>Noise and step thresholds of every channel from its first <paramref name="blocks"/> de-spiked blocks.</summary>
    private (int Blocks, double[] Noise, double[] Thresholds) Snapshot(int blocks)
    {
        var noise = new double[_channels.Count];
        var thresholds = new double[_channels.Count];
        for (var c = 0; c < _channels.Count; c++)
        {
            var prefix = _clean[c].AsSpan(0, blocks);
            noise[c] = StepFinder.Noise(prefix);
            thresholds[c] = PlateauDetector.StepThreshold(_channels[c], PlateauDetector.MedianAbs(prefix), noise[c], _half);
        }
        return (blocks, noise, thresholds);
    }

    /// <summary>Judges the plateau [first, last] that ends before block <paramref name="end"/> (the next step, or the day's end).</summary>
    private void Judge(int first, int last, int end)
    {
        var p = _plateau++;
        if (last - first < 4)
        {
            CloseMerge();
            return;
        }
        var (_, noise, thresholds) = Snapshot(end);
        var outcome = PlateauDetector.Judge(_t, _clean, _channels, _keys, _settings, _blockS, noise, first, last);
        if (outcome.Rejected is { } rejected)
        {
            _rejected.Add(rejected);
            CloseMerge();
            return;
        }
        var window = outcome.Accepted!;
        _judged.Add(window);
        if (_pending is { } open && outcome.Immediate && open.Plateau == p - 1 && PlateauDetector.SameLevel(open.Window, window, _keys, thresholds))
        {
            _pending = (open.Window with { EndS = window.EndS, StretchEndS = window.StretchEndS }, p);
            return;
        }
        CloseMerge();
        _pending = (window, p);
    }

    private void CloseMerge()
    {
        if (_pending is { } open)
        {
            _final.Add(open.Window);
            _pending = null;
        }
    }

    /// <summary>
    /// Rejects the final windows whose mean of a flow key lies below its rest minimum, a fraction of the day's
    /// largest flow (its 99th percentile of block means): the rig at rest is steady, yet no operating point.
    /// </summary>
    private SteadyDetectionResult ApplyRestMinimum()
    {
        var accepted = new List<SteadyWindow>();
        var rejected = new List<RejectedStretch>(_rejected);
        var minima = _keys.Select(c => _channels[c].RestFractionOfLargest is { } fraction
            ? fraction * PlateauDetector.Percentile99(new ArraySegment<double>(_raw[c], 0, _count))
            : double.NegativeInfinity).ToArray();
        foreach (var window in _final)
        {
            var failures = new List<CriterionFailure>();
            for (var k = 0; k < _keys.Length; k++)
            {
                var mean = window.Channels[k].Mean;
                if (mean < minima[k])
                {
                    failures.Add(new CriterionFailure(SteadyCriterion.Range, mean, minima[k],
                        Format($"{window.Channels[k].Channel}: mean {MeasurementText.Number(mean)} below the operating minimum {MeasurementText.Number(minima[k])} in [{window.StartS + (_blockS / 2)}, {window.EndS - (_blockS / 2)}] s (rig at rest, not an operating point)")));
                }
            }
            if (failures.Count == 0)
            {
                accepted.Add(window);
                continue;
            }
            var channels = window.Channels.Select((c, k) => c with { Failures = [.. c.Failures, .. failures.Where(f => f.Description.StartsWith(c.Channel + ":", StringComparison.Ordinal))] }).ToList();
            rejected.Add(new RejectedStretch(window.StretchStartS, window.StretchEndS, window.StartS, window.EndS,
                "closest window still failed: " + string.Join("; ", failures.Select(f => f.Description)), channels));
        }
        return new SteadyDetectionResult(accepted, [.. rejected.OrderBy(r => r.StartS)]);
    }

    private sealed class MarkerState(int half)
    {
        public int Next { get; set; } = half;

        public int Best { get; set; } = -1;

        public double Score { get; set; }

        public int RunStart { get; set; }

        public double Noise { get; set; }
    }
}
