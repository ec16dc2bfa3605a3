using BcPrep.Calibration;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Uncertainty;

namespace BcPrep.Live;

/// <summary>
/// Follows the key channels of the <c>[steady]</c> section through a day as its rows arrive: calibrates them
/// (the rig's own conversions), averages them into blocks, splits the day into stretches at set-point steps, and
/// reports each key channel's approach and, once settled, the hold its target needs. No clock: time is the logs'.
/// </summary>
/// <remarks>
/// A step begins where the day's own detection puts it: the block means of the detection's channels (the keys and
/// the heater's step markers, <see cref="DetectionKeys"/>) are fed to the same incremental plateau detection that
/// <c>process</c> runs during its read (<see cref="PlateauScan"/>), and a new plateau there is a new stretch here. So
/// the stretches followed live are the plateaus <c>process</c> finds, step for step. A step is known once the
/// detection is certain of it: when its step finder's run has ended, some 20–40 s after the step on 1 s blocks.
/// A stretch that was settled on every key channel for at least <c>min_duration</c> when the step came is a
/// finished point.
/// </remarks>
public sealed class LiveMonitor
{
    /// <summary>Length of each of the two runs of blocks compared to find a step, s (as the day's detection).</summary>
    public const double StepHalfWindowS = PlateauDetector.StepHalfWindowS;

    private readonly RigDescription _rig;
    private readonly ISettlingEstimator _estimator;
    private readonly SteadyKey[] _keys;
    private readonly ChannelSpec[] _channels;
    private readonly SampleConverter[] _converters;
    private readonly int[] _junctionColumn;
    private readonly SampleConverter?[] _junctionConverter;
    private readonly double[] _fixedReferenceEmfV;
    private readonly KeyTrack[] _tracks;
    private readonly LiveRowParser _parser;
    private readonly double[] _raw;
    private readonly double[] _blockSum;
    private readonly int[] _blockCount;
    private readonly int _half;
    private readonly PlateauScan _scan;
    private readonly int[] _detectionTrack;
    private readonly double[] _detectionMeans;
    private readonly List<double> _steps = [];
    private double _t0 = double.NaN;
    private long _block = -1;
    private double _stretchStartS;

    public LiveMonitor(RigDescription rig, ISettlingEstimator estimator)
    {
        _rig = rig;
        _estimator = estimator;
        _keys = rig.Steady.Keys.ToArray();
        if (_keys.Length == 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(rig.SourceFile, null, null, "steady.key"),
                "following a day needs key channels in [steady] (key = [{ channel = ..., max_change = ..., max_scatter = ... }])");
        }
        // The channels that mark steps in the day's detection: the keys and the heater's step markers, tracked
        // after the keys (which alone are reported).
        var detection = DetectionKeys.For(rig, _ => []);
        _channels = _keys.Select(k => k.Channel).Concat(detection.Select(m => m.Name)).Distinct(StringComparer.Ordinal)
            .Select(id => rig.Channels.Single(c => c.Id == id)).ToArray();
        _detectionTrack = detection.Select(m => Array.FindIndex(_channels, c => c.Id == m.Name)).ToArray();
        _detectionMeans = new double[detection.Count];
        _scan = new PlateauScan(detection, WindowFinder.Settings(rig.Steady), rig.Steady.BlockS);
        var columns = new List<string>();
        int ColumnOf(ChannelSpec c)
        {
            var i = columns.IndexOf(c.Column);
            if (i < 0)
            {
                columns.Add(c.Column);
                i = columns.Count - 1;
            }
            return i;
        }
        foreach (var c in _channels)
        {
            ColumnOf(c);
        }
        _converters = _channels.Select(ChannelConversion.For).ToArray();
        _junctionColumn = new int[_channels.Length];
        _junctionConverter = new SampleConverter?[_channels.Length];
        _fixedReferenceEmfV = new double[_channels.Length];
        for (var i = 0; i < _channels.Length; i++)
        {
            _junctionColumn[i] = -1;
            if (_channels[i].Sensor is ThermocoupleSensor tc)
            {
                if (tc.ColdJunctionChannel is { } cj && rig.Channels.FirstOrDefault(c => c.Id == cj) is { } junction)
                {
                    _junctionColumn[i] = ColumnOf(junction);
                    _junctionConverter[i] = ChannelConversion.For(junction);
                }
                else if (tc.ColdJunctionK is { } k)
                {
                    _fixedReferenceEmfV[i] = Its90Thermocouple.EmfV(tc.Type, k);
                }
            }
        }
        _parser = new LiveRowParser(rig.Log, columns);
        _raw = new double[columns.Count];
        _tracks = _channels.Select(_ => new KeyTrack()).ToArray();
        _blockSum = new double[_channels.Length];
        _blockCount = new int[_channels.Length];
        _half = Math.Max(3, (int)Math.Round(StepHalfWindowS / rig.Steady.BlockS));
    }

    /// <summary>Every step found so far, s since the day's first row.</summary>
    public IReadOnlyList<double> StepsS => _steps;

    /// <summary>Time of the last row read, s since the day's first row (NaN before any).</summary>
    public double NowS { get; private set; } = double.NaN;

    /// <summary>Takes one complete line; returns the point a step has just finished, if any.</summary>
    public FinishedStretch? Feed(FollowedLine line)
    {
        if (!_parser.TryRow(line, _raw, out var timeS))
        {
            return null;
        }
        if (double.IsNaN(_t0))
        {
            _t0 = timeS;
        }
        var t = timeS - _t0;
        if (!(t > (double.IsNaN(NowS) ? -1.0 : NowS)))
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(line.FileName, (int)Math.Min(line.LineNumber, int.MaxValue), null, _rig.Log.TimeColumn),
                "the time does not increase from the previous row: timestamps must increase");
        }
        NowS = t;
        var block = (long)Math.Floor(t / _rig.Steady.BlockS);
        FinishedStretch? finished = null;
        if (block != _block && _block >= 0)
        {
            finished = CloseBlock();
        }
        _block = block;
        for (var i = 0; i < _channels.Length; i++)
        {
            var value = Convert(i, line);
            if (double.IsFinite(value))
            {
                _blockSum[i] += value;
                _blockCount[i]++;
            }
        }
        return finished;
    }

    private double Convert(int i, FollowedLine line)
    {
        var raw = _raw[_parser.ColumnOf(_channels[i].Column)];
        if (double.IsNaN(raw))
        {
            return double.NaN;
        }
        try
        {
            var reference = _fixedReferenceEmfV[i];
            if (_junctionColumn[i] >= 0)
            {
                var junctionK = _junctionConverter[i]!(_raw[_junctionColumn[i]], 0.0);
                if (double.IsNaN(junctionK))
                {
                    return double.NaN;
                }
                reference = Its90Thermocouple.EmfV(((ThermocoupleSensor)_channels[i].Sensor).Type, junctionK);
            }
            return _converters[i](raw, reference);
        }
        catch (BcPrepDataException e) when (e is not BcPrepFailure)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(line.FileName, (int)Math.Min(line.LineNumber, int.MaxValue), null, _channels[i].Column),
                $"channel '{_channels[i].Id}' reads {raw} {_channels[i].Sensor.RawUnit}: {e.Message}");
        }
    }

    private FinishedStretch? CloseBlock()
    {
        var blockTime = (_block + 0.5) * _rig.Steady.BlockS;
        for (var i = 0; i < _channels.Length; i++)
        {
            _tracks[i].Add(blockTime, _blockCount[i] > 0 ? _blockSum[i] / _blockCount[i] : double.NaN);
            _blockSum[i] = 0;
            _blockCount[i] = 0;
        }
        for (var d = 0; d < _detectionTrack.Length; d++)
        {
            _detectionMeans[d] = _tracks[_detectionTrack[d]].Values[^1];
        }
        _scan.Add(blockTime, _detectionMeans);
        var stepS = _scan.PlateauStartS;
        if (!(stepS > _stretchStartS + (0.5 * _rig.Steady.BlockS)))
        {
            return null;
        }
        _steps.Add(stepS);
        var before = Report(stepS);
        FinishedStretch? finished = null;
        if (before.Settled && stepS - before.SettledFromS >= _rig.Steady.MinDurationS)
        {
            finished = new FinishedStretch(_stretchStartS, before.SettledFromS, stepS);
        }
        foreach (var track in _tracks)
        {
            track.DropBefore(stepS);
        }
        _stretchStartS = stepS;
        return finished;
    }

    /// <summary>The current stretch as of <paramref name="nowS"/> (s since the day's first row), from the closed blocks.</summary>
    public StretchReport Report(double nowS)
    {
        var channels = new List<ChannelReport>();
        for (var i = 0; i < _keys.Length; i++)
        {
            channels.Add(ReportChannel(i, nowS));
        }
        return new StretchReport(nowS, _stretchStartS, channels);
    }

    private ChannelReport ReportChannel(int i, double nowS)
    {
        var track = _tracks[i];
        var key = _keys[i];
        // The blocks before nowS only: a stretch is judged at its step, when blocks of the next level are already in.
        var n = track.CountBefore(nowS);
        var last = n > 0 ? track.MeanOf(Math.Max(0, n - _half), n) : double.NaN;
        var view = n >= 2 * _half ? _estimator.Estimate(track.Times[..n], track.Values[..n], _stretchStartS, nowS, key.MaxChangeSi) : null;
        if (view is null)
        {
            return new ChannelReport(_channels[i].Id, ChannelState.Moving, last, double.NaN, double.NaN, double.NaN, double.NaN, null);
        }
        if (view.SettledFromS > nowS)
        {
            return new ChannelReport(_channels[i].Id, ChannelState.Approaching, last, view.TauS, view.RemainingChange, view.SettledFromS, view.SettledFromS - nowS, null);
        }
        var settledSince = Math.Max(view.SettledFromS, _stretchStartS);
        var held = track.FiniteValuesFrom(settledSince, nowS);
        var mean = held.Length > 0 ? held.Average() : last;
        return new ChannelReport(_channels[i].Id, ChannelState.Settled, mean, view.TauS, view.RemainingChange, settledSince, 0.0, Hold(i, held, nowS - settledSince));
    }

    private HoldTimeEstimate? Hold(int i, double[] held, double heldS)
    {
        if (_keys[i].HoldTargetSi is not { } target || held.Length < 3 || !(heldS > 0))
        {
            return null;
        }
        try
        {
            var typeA = WindowMean.Evaluate(held);
            return HoldTime.Estimate(typeA, heldS, TypeBStandard(_channels[i], typeA.Mean), target, _rig.CoverageProbability);
        }
        catch (BcPrepDataException e) when (e is not BcPrepFailure)
        {
            // Too few effectively independent blocks yet (n_eff < 2): no estimate until more of the hold is in.
            return null;
        }
    }

    /// <summary>The channel's own fixed Type B terms at its mean, combined in quadrature (as in its budget).</summary>
    public static double TypeBStandard(ChannelSpec channel, double meanSi)
    {
        var sum = channel.Uncertainty.Sum(term => Math.Pow(TypeBTerms.StandardUncertainty(term, channel, meanSi), 2));
        if (channel.Sensor is TableSensor table)
        {
            var fit = ChannelConversion.Fit(table);
            sum += Math.Pow(fit.ResidualStandardDeviation * Math.Abs(table.UnitToSi.Scale), 2);
        }
        return Math.Sqrt(sum);
    }
}
