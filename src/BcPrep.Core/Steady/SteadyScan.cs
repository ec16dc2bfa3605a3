namespace BcPrep.Steady;

/// <summary>One position of the sliding test window and its verdict.</summary>
internal sealed record WindowEvaluation(int Start, int End, bool Steady, double WorstRatio, IReadOnlyList<ChannelCriteria> Channels);

/// <summary>
/// <see cref="SteadyStateDetector"/> fed one block mean at a time. A run of steady (or unsteady) test windows is
/// judged as soon as a test window of the other kind ends it, and every criterion looks only at the run and the
/// half window before it, so a closed run's verdict is already final: its accepted windows (<see cref="Accepted"/>)
/// are known while the day is still being read. <see cref="Finish"/> judges the last run and gives the result
/// that <see cref="SteadyStateDetector.Detect"/> gives for the whole series.
/// </summary>
public sealed class SteadyScan
{
    private readonly IReadOnlyList<KeyChannel> _channels;
    private readonly SteadySettings _settings;
    private readonly List<WindowEvaluation> _run = [];
    private readonly List<SteadyWindow> _accepted = [];
    private readonly List<RejectedStretch> _rejected = [];
    private double[] _t = new double[1024];
    private readonly double[][] _y;
    private int _count;
    private int _start;
    private int _end;
    private double? _nextStartS;
    private bool _anyWindow;
    private bool _finished;

    /// <param name="channels">Key channels: names and limits (their <see cref="KeyChannel.Values"/> are not read).</param>
    /// <param name="settings">Detector settings.</param>
    /// <exception cref="BcPrepDataException">No channel, or invalid limits or settings.</exception>
    public SteadyScan(IReadOnlyList<KeyChannel> channels, SteadySettings settings)
    {
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(settings);
        SteadyStateDetector.ValidateLimits(channels, settings);
        _channels = channels;
        _settings = settings;
        _y = [.. channels.Select(_ => new double[_t.Length])];
    }

    /// <summary>Windows accepted so far, in time order; a window of a run still open is not among them.</summary>
    public IReadOnlyList<SteadyWindow> Accepted => _accepted;

    /// <summary>Adds the next block mean of every key channel (same order as the constructor's channels).</summary>
    /// <exception cref="BcPrepDataException">The time does not increase.</exception>
    /// <exception cref="InvalidOperationException">The scan is finished (a caller's mistake).</exception>
    /// <exception cref="ArgumentException">The values do not match the key channels (a caller's mistake).</exception>
    public void Add(double timeS, ReadOnlySpan<double> values)
    {
        if (_finished)
        {
            throw new InvalidOperationException("The scan is finished: no block mean can be added.");
        }
        if (values.Length != _channels.Count)
        {
            throw new ArgumentException(SteadyStateDetector.Format($"{values.Length} values do not match {_channels.Count} key channels."), nameof(values));
        }
        if (!double.IsFinite(timeS) || (_count > 0 && timeS <= _t[_count - 1]))
        {
            throw new BcPrepDataException(SteadyStateDetector.Format(
                $"Time stamp {_count} ({timeS} s) is not finite or not after the previous one."));
        }

        if (_count == _t.Length)
        {
            Array.Resize(ref _t, _t.Length * 2);
            for (int c = 0; c < _y.Length; c++)
            {
                Array.Resize(ref _y[c], _t.Length);
            }
        }

        _t[_count] = timeS;
        for (int c = 0; c < _y.Length; c++)
        {
            _y[c][_count] = values[c];
        }

        _count++;
        // A test window is judged once a later time stamp lies beyond its length: then no future one can join it.
        EvaluateWindows(static (span, windowS) => span > windowS);
    }

    /// <summary>Judges the last run and returns the accepted windows and rejected stretches of the whole series.</summary>
    public SteadyDetectionResult Finish()
    {
        if (!_finished)
        {
            _finished = true;
            if (_count > 0)
            {
                EvaluateWindows(static (span, windowS) => span >= windowS);
                CloseRun();
            }

            if (!_anyWindow && _count > 0)
            {
                var t = Times;
                _rejected.Add(new RejectedStretch(t[0], t[^1], t[0], t[^1],
                    SteadyStateDetector.Format($"record of {t[^1] - t[0]} s is shorter than the test window {_settings.WindowS} s"), []));
            }
        }

        return new SteadyDetectionResult([.. _accepted], [.. _rejected.OrderBy(r => r.StartS)]);
    }

    private ReadOnlySpan<double> Times => _t.AsSpan(0, _count);

    /// <summary>
    /// Slides the test window in StepS steps from the first time stamp, judging each position whose extent is known.
    /// </summary>
    private void EvaluateWindows(Func<double, double, bool> extentKnown)
    {
        while (true)
        {
            if (_nextStartS is double next)
            {
                while (_start < _count && _t[_start] < next)
                {
                    _start++;
                }

                if (_start >= _count)
                {
                    return;
                }

                _nextStartS = null;
            }

            if (!extentKnown(_t[_count - 1] - _t[_start], _settings.WindowS))
            {
                return;
            }

            _end = Math.Max(_end, _start);
            while (_end + 1 < _count && _t[_end + 1] - _t[_start] <= _settings.WindowS)
            {
                _end++;
            }

            var criteria = new ChannelCriteria[_channels.Count];
            double worst = 0.0;
            for (int c = 0; c < _channels.Count; c++)
            {
                (criteria[c], double ratio) = SteadyStateDetector.DriftScatter(Times, _y[c], _channels[c], _settings, _start, _end);
                worst = Math.Max(worst, ratio);
            }

            OnWindow(new WindowEvaluation(_start, _end, criteria.All(c => c.Failures.Count == 0), worst, criteria));
            _nextStartS = _t[_start] + _settings.StepS;
        }
    }

    private void OnWindow(WindowEvaluation window)
    {
        _anyWindow = true;
        if (_run.Count > 0 && _run[0].Steady != window.Steady)
        {
            CloseRun();
        }

        _run.Add(window);
    }

    private void CloseRun()
    {
        if (_run.Count == 0)
        {
            return;
        }

        var t = Times;
        if (_run[0].Steady)
        {
            foreach (var (s, e) in SteadyStateDetector.SplitAtSetPointSteps(t, _y, _channels, _run[0].Start, _run[^1].End, _settings))
            {
                SteadyStateDetector.EvaluateStretch(t, _y, _channels, _settings, s, SteadyStateDetector.TrimTrailingDeparture(t, _y, s, e, _settings), _accepted, _rejected);
            }
        }
        else
        {
            _rejected.Add(SteadyStateDetector.ExplainFailingRun(t, _run, 0, _run.Count - 1));
        }

        _run.Clear();
    }
}
