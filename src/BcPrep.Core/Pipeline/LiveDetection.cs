using BcPrep.Rig;
using BcPrep.Steady;

namespace BcPrep.Pipeline;

/// <summary>
/// Finds the operating points of a single-logger day while it is read, and gathers each point's window from the
/// rows kept back, so its statistics run during the read instead of in a second pass over the log.
/// <para>
/// The detector is fed block means as they become final (<see cref="SteadyScan"/>); a steady stretch is judged as
/// soon as the day leaves it, and its averaging window then lies within the last
/// <see cref="KeptSpanS"/> of the detector's clock, which is what the rows kept back cover. This scan is the day's
/// detection: <see cref="Finish"/> feeds the last blocks, judges the last run and returns the result, which is final.
/// A window accepted before the end keeps its point id (windows are accepted in time order and pinned windows are
/// known from the start), so the statistics gathered for it during the read are the point's. A detected window the
/// kept rows no longer cover is left to the next <see cref="IWindowSource"/>, a second read.
/// </para>
/// </summary>
internal sealed class LiveDetection : IBlockSink, IWindowSource
{
    private readonly IBlockSink _detectionFeed;
    private readonly BlockMeanSink _blocks;
    private readonly double _dayStartS;
    private readonly IReadOnlyList<TimeWindow> _pinned;
    private readonly IReadOnlyList<string> _keys;
    private readonly SteadyScan _scan;
    private readonly double[] _keyMeans;
    private readonly Action<TimeWindow, string, double[], double[]> _onWindow;
    private readonly RecentRows _rows = new();
    private readonly HashSet<TimeWindow> _gathered = [];
    private int _fedBlocks;
    private int _judged;

    /// <param name="rig">The rig: key channels and detection settings.</param>
    /// <param name="dayStartS">Log-clock time of the day's first sample (s).</param>
    /// <param name="detectionFeed">The block sink the block means come from (directly or through conditioning).</param>
    /// <param name="blocks">The block means that sink fills.</param>
    /// <param name="pinned">Windows pinned in the rig file, which replace the detected windows they overlap.</param>
    /// <param name="onWindow">Receives (window, channel, times, values) of each gathered window and channel.</param>
    /// <param name="keptSpanS">How far back rows are kept (s); null for <see cref="KeptSpanS"/>'s default.</param>
    public LiveDetection(RigDescription rig, double dayStartS, IBlockSink detectionFeed, BlockMeanSink blocks, IReadOnlyList<TimeWindow> pinned,
        Action<TimeWindow, string, double[], double[]> onWindow, double? keptSpanS = null)
    {
        _detectionFeed = detectionFeed;
        _blocks = blocks;
        _dayStartS = dayStartS;
        _pinned = pinned;
        _onWindow = onWindow;
        var keyChannels = WindowFinder.KeyChannels(rig, _ => []);
        _keys = [.. keyChannels.Select(k => k.Name)];
        _keyMeans = new double[_keys.Count];
        var settings = WindowFinder.Settings(rig.Steady);
        _scan = new SteadyScan(keyChannels, settings);
        KeptSpanS = keptSpanS ?? (settings.TailS + (settings.WindowS / 2) + (2 * settings.StepS) + (2 * rig.Steady.BlockS));
    }

    /// <summary>
    /// How far back from the detector's latest block a window may start when its stretch is judged: its averaging
    /// tail, the trailing blocks a departure may trim (at most half a test window), the step that shows the stretch
    /// has ended, and two blocks for the block means still filling.
    /// </summary>
    public double KeptSpanS { get; }

    public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        _detectionFeed.AcceptBlock(channels, timeS, valuesSi, count);
        _rows.Add(channels, timeS, valuesSi, count);
        FeedBlocks(_blocks.FinalBlocks);
        while (_judged < _scan.Accepted.Count)
        {
            Gather(_scan.Accepted[_judged++]);
        }
        if (_fedBlocks > 0)
        {
            _rows.DropBefore(_blocks.TimeAt(_fedBlocks - 1) - KeptSpanS);
        }
    }

    /// <summary>
    /// Call when the read is over and the block means are complete (after the detection feed's own completion): feeds
    /// the blocks not yet final during the read, judges the last run and returns the day's detection. It is the same
    /// scan over the same block means (times since the day's first sample) as <see cref="WindowFinder.Detect"/>.
    /// </summary>
    public SteadyDetectionResult Finish()
    {
        _rows.Complete();
        FeedBlocks(_blocks.Length);
        return _scan.Finish();
    }

    /// <summary>
    /// True when <paramref name="window"/> (id and times) was gathered during the read or can be gathered now from
    /// the kept rows; false when it must be read again.
    /// </summary>
    public bool TryGather(TimeWindow window)
    {
        if (_gathered.Contains(window))
        {
            return true;
        }
        if (!_rows.Covers(window))
        {
            return false;
        }
        _rows.Gather(window, (channel, times, values) => _onWindow(window, channel, times, values));
        _gathered.Add(window);
        return true;
    }

    private void FeedBlocks(int count)
    {
        for (; _fedBlocks < count; _fedBlocks++)
        {
            for (var k = 0; k < _keys.Count; k++)
            {
                _keyMeans[k] = _blocks.MeanAt(_keys[k], _fedBlocks);
            }
            // The same expression as the day's detection, so the provisional times are the final ones bit for bit.
            _scan.Add(_blocks.TimeAt(_fedBlocks) - _dayStartS, _keyMeans);
        }
    }

    /// <summary>
    /// Plans the windows accepted so far as the day's plan will (ids in time order, pinned windows winning) and
    /// gathers this one if it becomes a point and its rows are still kept.
    /// </summary>
    private void Gather(SteadyWindow accepted)
    {
        var plan = PointWindows.Plan(_pinned, new SteadyDetectionResult(_scan.Accepted, []), _dayStartS);
        var point = plan.Points.FirstOrDefault(p => p.Origin == WindowOrigin.Detected && ReferenceEquals(p.Detected[0], accepted));
        if (point is not null)
        {
            TryGather(point.Window);
        }
    }
}
