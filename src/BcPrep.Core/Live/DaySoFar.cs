using System.Runtime.ExceptionServices;
using BcPrep.Lab;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Values;

namespace BcPrep.Live;

/// <summary>
/// The reduction of a day the logger is still writing, kept up piece by piece: each <see cref="ReadTo"/> scans only
/// the rows completed since the previous one (the same conversion, block means, pinned and tare windows as
/// <c>process</c>), and <see cref="Reduce"/> gives what <c>process</c> would give on the day so far. Only the
/// detected windows are read again, by seeking, and a window whose statistics are already known is not read again.
/// So a finished point costs its own window, not the day so far.
/// </summary>
/// <remarks>
/// Memory is that of <c>process</c>: the block means of the day (one value per channel and block, whatever the
/// sample rate), the samples of the windows open at the time, and the statistics of the windows reduced so far.
/// A pinned window that the logs have not passed yet is left out of a reduction (its point is not reached yet).
/// Mirrors the part of <see cref="DayProcessor.Process"/> after the read; a change there belongs here too.
/// </remarks>
public sealed class DaySoFar
{
    private readonly RigDescription _rig;
    private readonly ProcessOptions _options;
    private readonly Dictionary<string, BlockConverter> _converters;
    private readonly Dictionary<string, (long Offset, long Line)> _resume = new(StringComparer.Ordinal);
    private readonly List<string> _files = [];
    private readonly Dictionary<string, Dictionary<string, ChannelWindowStats>> _stats = new(StringComparer.Ordinal);
    private readonly Dictionary<string, Problem> _lost = new(StringComparer.Ordinal);
    private readonly Dictionary<TimeWindow, Dictionary<string, ChannelWindowStats>> _detectedStats = [];
    private readonly Dictionary<(TimeWindow, WindowOrigin), PointResult> _points = [];
    private (int Tares, int EndTares) _pointsTares;
    private readonly WindowStatsBook _book = new();
    private readonly DayExtentSink _extent = new();
    private readonly ScanIndex _index = new();
    private long _lastFileBytes;
    private Started? _day;
    private ExceptionDispatchInfo? _broken;

    /// <summary>What is known once the first rows are in: the logger's channels, the day's start and the sinks.</summary>
    private sealed record Started(
        IReadOnlyList<ChannelSpec> Channels, DayStart Start, BlockMeanSink Blocks, DetectionFeed Feed, WindowCollector FirstPass,
        IReadOnlyList<TimeWindow> Pinned, IReadOnlyList<TimeWindow> TareWindows);

    public DaySoFar(RigDescription rig, ProcessOptions options)
    {
        _rig = rig;
        _options = options;
        _converters = rig.Channels.ToDictionary(c => c.Id, BlockConverter.For, StringComparer.Ordinal);
    }

    /// <summary>Rows scanned so far in all files, the bytes of the last file included.</summary>
    public long LastFileBytes => _lastFileBytes;

    /// <summary>
    /// Scans what the logger has added: <paramref name="files"/> are the logger's files in order (full paths); all but
    /// the last are finished, the last is read up to <paramref name="lastFileBytes"/> (the end of its last complete line).
    /// </summary>
    /// <exception cref="BcPrepFailure">A bad row, or a pinned or tare window the logs cannot serve; every later call fails the same way.</exception>
    public void ReadTo(IReadOnlyList<string> files, long lastFileBytes)
    {
        _broken?.Throw();
        if (files.Count == 0)
        {
            return;
        }
        try
        {
            var inputs = new List<LogInput>();
            for (var i = 0; i < files.Count; i++)
            {
                var path = files[i];
                var limit = i == files.Count - 1 ? lastFileBytes : new FileInfo(path).Length;
                var known = _resume.TryGetValue(path, out var at);
                if (known && at.Offset >= limit)
                {
                    continue; // nothing new in this file
                }
                inputs.Add(new LogInput(path, path) { LengthLimit = limit, ResumeAt = known ? at : null });
            }
            if (inputs.Count == 0)
            {
                return;
            }
            _day ??= Start(inputs[0]);
            var plan = new DayPlan([new LoggerFiles(_day.Channels, inputs)], _day.Start);
            DayScan.Run(_rig, plan, _converters, [new KeptOpen(_day.FirstPass), _extent], _day.Feed.BlockSink, index: _index,
                onFileRead: (file, _, line) => _resume[file.Path] = (file.LengthLimit!.Value, NextLine(file.Path, line)));
            _files.Clear();
            _files.AddRange(files);
            _lastFileBytes = lastFileBytes;
        }
        catch (Exception e) when (e is BcPrepFailure)
        {
            _broken = ExceptionDispatchInfo.Capture(e);
            throw;
        }
    }

    /// <summary>The line the next piece of a file starts on: after the last row read, else where the previous piece ended (line 2 after the header).</summary>
    private long NextLine(string path, long lastLine) =>
        lastLine > 0 ? lastLine + 1 : _resume.TryGetValue(path, out var at) ? at.Line : 2;

    private Started Start(LogInput first)
    {
        var plan = DayPlan.Create(_rig, [first with { ResumeAt = null }]);
        if (plan.Loggers.Count != 1)
        {
            throw new InvalidOperationException("one followed file makes one logger");
        }
        // Fail at once when a sensor was already out of calibration on the first sample's date, as process does.
        CalibrationCheck.Evaluate(_rig, TestDates.FromLogs(_rig.Log, plan.Start.FirstSample.Value, plan.Start.FirstSample.Value), _options.AllowExpired);
        var blocks = new BlockMeanSink(plan.Start.FirstSample.Value, _rig.Steady.BlockS);
        var feed = DetectionFeed.For(_rig, blocks);
        var tareWindows = DayProcessor.TareWindows(_rig, plan.Start);
        var pinned = _rig.Points.Select(p => new TimeWindow(p.Id, plan.Start.Resolve(p.Start).Value, plan.Start.Resolve(p.End).Value)).ToList();
        var firstPass = new WindowCollector([.. pinned, .. tareWindows],
            (w, c, t, v) => DayProcessor.Collect(_rig, plan.Start, _book, w, c, t, v, DayProcessor.PinnedLocation(_rig, w)),
            collects: (w, c) => w.Serves(c));
        return new Started(plan.Loggers[0].Channels, plan.Start, blocks, feed, firstPass, pinned, tareWindows);
    }

    /// <summary>What <c>process</c> gives on the rows scanned so far (pinned windows not yet passed left out).</summary>
    /// <exception cref="BcPrepFailure">As <c>process</c> fails: no steady point yet, a calibration past due, a bad window.</exception>
    public DayResult Reduce()
    {
        _broken?.Throw();
        if (_day is null)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)"), "no complete row has been logged yet");
        }
        var rig = _rig;
        var dayStart = _day.Start;
        _book.DrainInto(_stats, lost: _lost);
        var calibration = CalibrationCheck.Evaluate(rig, TestDates.FromLogs(rig.Log, _extent.FirstS, _extent.LastS), _options.AllowExpired);
        _day.Feed.Settle(); // the blocks the de-spiking holds back belong to the day so far
        var series = WindowFinder.Series(rig, _day.Blocks);
        // The pinned windows the logs have passed: their samples were handed over whole during the scan.
        var pinned = _day.Pinned.Where(w => _stats.ContainsKey(w.Id) || _lost.ContainsKey(w.Id)).ToList();
        var tareWindows = _day.TareWindows.Where(w => _stats.ContainsKey(w.Id)).ToList();
        SteadyDetectionResult? detection = null;
        if (WindowFinder.IsEnabled(rig) || _day.Pinned.Count == 0)
        {
            WindowFinder.RequireBlocks(rig, series);
            detection = WindowFinder.Detect(rig, series, dayStart);
        }
        var windowPlan = PointWindows.Plan(pinned, detection, dayStart);
        if (windowPlan.Points.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.NoSteadyPoint, WindowFinder.NoSteadyProblems(rig, detection!));
        }
        var stats = new Dictionary<string, Dictionary<string, ChannelWindowStats>>(_stats, StringComparer.Ordinal);
        var lost = new Dictionary<string, Problem>(_lost, StringComparer.Ordinal);
        var detected = windowPlan.Points.Where(p => p.Origin == WindowOrigin.Detected).Select(p => p.Window).ToList();
        var book = new WindowStatsBook();
        var plan = new DayPlan([new LoggerFiles(_day.Channels, ReadPlan())], _day.Start);
        var secondRead = new SeekingSecondRead(rig, plan, _converters, _index, null, (w, c, t, v) => DayProcessor.Collect(rig, dayStart, book, w, c, t, v));
        foreach (var window in detected.Where(w => !_detectedStats.ContainsKey(w)))
        {
            secondRead.TryGather(window);
        }
        secondRead.Complete();
        var fresh = new Dictionary<string, Dictionary<string, ChannelWindowStats>>(StringComparer.Ordinal);
        book.DrainInto(fresh, lost: lost);
        foreach (var window in detected)
        {
            if (fresh.TryGetValue(window.Id, out var byChannel))
            {
                _detectedStats[window] = byChannel;
            }
            if (_detectedStats.TryGetValue(window, out var known))
            {
                stats[window.Id] = known;
            }
        }
        // Windows of earlier reductions that no longer appear (the detection saw more of the day) are forgotten.
        foreach (var gone in _detectedStats.Keys.Where(w => !detected.Contains(w)).ToList())
        {
            _detectedStats.Remove(gone);
        }
        var dayWarnings = DayProcessor.DetectionWarnings(detection, windowPlan, dayStart);
        var tareStats = DayProcessor.TareStats(tareWindows, stats);
        var endTares = DayProcessor.EndTares(tareWindows, stats);
        var (failed, reduced) = DayProcessor.SplitLost(windowPlan, lost);
        // A point whose window, origin and tares are those of an earlier reduction is that reduction's point (its
        // window statistics are the same, see above): only new points are propagated.
        if (_pointsTares != (tareStats.Count, endTares.Count))
        {
            _points.Clear();
            _pointsTares = (tareStats.Count, endTares.Count);
        }
        var evaluated = DayProcessor.InOrder(reduced.Where(p => !_points.ContainsKey((p.Window, p.Origin))).ToList(),
            p => (p, DayProcessor.EvaluatePoint(rig, p.Window, p.Origin, stats[p.Window.Id], tareStats, endTares, _options)));
        foreach (var (p, point) in evaluated)
        {
            _points[(p.Window, p.Origin)] = point;
        }
        IReadOnlyList<PointResult> points = reduced.Select(p => _points[(p.Window, p.Origin)]).ToList();
        foreach (var gone in _points.Keys.Where(k => !reduced.Any(p => (p.Window, p.Origin) == k)).ToList())
        {
            _points.Remove(gone);
        }
        MatrixReport? matrix;
        (points, matrix) = DayProcessor.NameByMatrix(_options, points);
        return new DayResult(rig, _day.Start, points, series, detection, dayWarnings)
        {
            FailedPoints = failed, Calibration = calibration, Matrix = matrix, SecondPassSeeks = _index.Seeks, WindowsReadAgain = secondRead.Count,
        };
    }

    /// <summary>The files scanned so far, each up to where it was scanned, read from the start (seeking by the index).</summary>
    private List<LogInput> ReadPlan() =>
        _files.Select((path, i) => new LogInput(path, path) { LengthLimit = i == _files.Count - 1 ? _lastFileBytes : new FileInfo(path).Length }).ToList();

    /// <summary>
    /// Passes the rows to the pinned and tare window collector but not the end of each piece of the scan: a window
    /// still open when a piece ends is not complete, it goes on in the next piece.
    /// </summary>
    private sealed class KeptOpen(IChannelSink inner) : IChannelSink
    {
        public void Accept(string channel, ReadOnlySpan<double> timeS, ReadOnlySpan<double> valueSi) => inner.Accept(channel, timeS, valueSi);

        public void Complete(string channel)
        {
        }
    }
}
