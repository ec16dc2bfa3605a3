using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// The day's steady detection, run while a single-logger day is read, and the source of its windows' samples
/// (<see cref="IWindowSource"/>): each block mean goes to the plateau detector as soon as it is final
/// (<see cref="PlateauScan"/>), and each window the detector makes final is gathered from the rows kept back, so its
/// statistics run during the read instead of in a second pass over the log. <see cref="Finish"/> judges the rest of
/// the day and returns the detection, which is final: the same as <see cref="WindowFinder.Detect"/> over the whole
/// day's block means.
/// <para>
/// Windows are gathered under their time interval alone (a <see cref="TimeWindow"/> with an empty id): point ids are
/// given once, after detection and pinning (<see cref="PointWindows.Plan"/>). A window whose steady stretch a pinned
/// window overlaps is not gathered (the pinned window replaces it). Rows are kept from the earliest moment a window
/// not yet final may start (the start of the plateau under way, or of a window the next plateau may still extend);
/// a window whose rows were no longer kept is left to the next source, a seeking second read. That happens when the
/// rows since that moment exceed what the store keeps (<see cref="IRowBlockStore.MaxKeptValues"/>: 96 MB in memory,
/// 2 GB in temporary files; a long plateau at a high rate) or <see cref="ProcessOptions.KeptRowsS"/>.
/// </para>
/// <para>
/// A gathered window is handed over one channel at a time (<see cref="GatheredChannel"/>): each channel's samples are
/// loaded from the store when its statistics start, so the whole window is never in memory at once.
/// </para>
/// </summary>
internal sealed class LiveDetection : IBlockSink, IWindowSource, IDisposable
{
    private readonly IBlockSink _detectionFeed;
    private readonly BlockMeanSink _blocks;
    private readonly DayStart _dayStart;
    private readonly IReadOnlyList<TimeWindow> _pinned;
    private readonly IReadOnlyList<string> _channels;
    private readonly PlateauScan _scan;
    private readonly double[] _means;
    private readonly Action<TimeWindow, IReadOnlyList<GatheredChannel>> _onWindow;
    private readonly RecentRows _rows;
    private readonly double _keptSpanS;
    private readonly HashSet<TimeWindow> _gathered = [];
    private int _fedBlocks;
    private int _judgedCount;
    private int _finalCount;

    /// <param name="rig">The rig: key channels and detection settings.</param>
    /// <param name="dayStart">The day's first sample: the scan counts from it, the rows are on the log clock.</param>
    /// <param name="detectionFeed">The block sink the block means come from (directly or through conditioning).</param>
    /// <param name="blocks">The block means that sink fills.</param>
    /// <param name="pinned">Windows pinned in the rig file, which replace the detected windows whose stretch they overlap.</param>
    /// <param name="onWindow">Receives (window interval, its channels to load and reduce) of each gathered window, all its channels at once.</param>
    /// <param name="keptSpanS">At most how far back from the latest block rows are kept (s); null for no limit but the kept values' budget.</param>
    /// <param name="store">Where the rows are kept (owned from here on); in memory when null.</param>
    public LiveDetection(RigDescription rig, DayStart dayStart, IBlockSink detectionFeed, BlockMeanSink blocks, IReadOnlyList<TimeWindow> pinned,
        Action<TimeWindow, IReadOnlyList<GatheredChannel>> onWindow, double? keptSpanS = null, IRowBlockStore? store = null)
    {
        _detectionFeed = detectionFeed;
        _blocks = blocks;
        _dayStart = dayStart;
        _pinned = pinned;
        _onWindow = onWindow;
        var channels = DetectionKeys.For(rig, _ => []);
        _channels = [.. channels.Select(k => k.Name)];
        _means = new double[_channels.Count];
        _scan = new PlateauScan(channels, WindowFinder.Settings(rig.Steady), rig.Steady.BlockS);
        _keptSpanS = keptSpanS ?? double.PositiveInfinity;
        _rows = new RecentRows(store);
    }

    public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        _detectionFeed.AcceptBlock(channels, timeS, valuesSi, count);
        _rows.Add(channels, timeS, valuesSi, count);
        FeedBlocks(_blocks.FinalBlocks);
        GatherFinal();
        if (_fedBlocks > 0)
        {
            _rows.DropBefore(Math.Max(_dayStart.OnClock(new DaySeconds(_scan.OpenSinceS)).Value, _blocks.TimeAt(_fedBlocks - 1) - _keptSpanS));
        }
    }

    /// <summary>
    /// Call when the read is over and the block means are complete (after the detection feed's own completion): feeds
    /// the blocks not yet final during the read, judges the rest of the day, gathers its last windows and returns the
    /// day's detection (times since the day's first sample).
    /// </summary>
    public SteadyDetectionResult Finish()
    {
        _rows.Complete();
        FeedBlocks(_blocks.Length);
        var detection = _scan.Finish();
        GatherFinal();
        // The day's last windows are gathered: the kept rows (up to 96 MB in memory) must not live on through the
        // second read and the propagation that follow; the gathered windows hold what they still have to load.
        _rows.Release();
        return detection;
    }

    /// <summary>Window channels loaded from the kept rows and not yet reduced (now and at most).</summary>
    public LoadedChannels Loaded => _rows.Loaded;

    /// <summary>Lets go of the kept rows and their store, also when the read failed before <see cref="Finish"/>.</summary>
    public void Dispose() => _rows.Release();

    /// <summary>True when <paramref name="window"/>'s interval was gathered from the kept rows; false when it must be read again.</summary>
    public bool TryGather(TimeWindow window) => _gathered.Contains(Interval(window.StartS, window.EndS));

    /// <summary>The key under which a window's samples are gathered: its interval on the log clock, no id.</summary>
    public static TimeWindow Interval(double startS, double endS) => new("", startS, endS);

    private void FeedBlocks(int count)
    {
        for (; _fedBlocks < count; _fedBlocks++)
        {
            for (var k = 0; k < _channels.Count; k++)
            {
                _means[k] = _blocks.MeanAt(_channels[k], _fedBlocks);
            }
            // The same expression as the day's detection over the whole series (WindowFinder.Detect).
            _scan.Add(_dayStart.Since(new LoggerSeconds(_blocks.TimeAt(_fedBlocks))).Value, _means);
        }
    }

    /// <summary>
    /// Gathers each window as soon as its plateau is judged, and a final window that differs from what was judged
    /// (one extended by a merge) if its rows are still kept.
    /// </summary>
    private void GatherFinal()
    {
        for (; _judgedCount < _scan.Judged.Count; _judgedCount++)
        {
            Gather(_scan.Judged[_judgedCount]);
        }
        for (; _finalCount < _scan.Final.Count; _finalCount++)
        {
            Gather(_scan.Final[_finalCount]);
        }
    }

    private void Gather(SteadyWindow window)
    {
        var stretch = Interval(_dayStart.OnClock(window.StretchStart).Value, _dayStart.OnClock(window.StretchEnd).Value);
        if (_pinned.Any(p => PointWindows.Overlap(p, stretch) > 0))
        {
            return;
        }
        // The same expression as the day's plan (PointWindows.Plan), so the interval is the point's bit for bit.
        var interval = Interval(_dayStart.OnClock(window.Start).Value, _dayStart.OnClock(window.End).Value);
        if (!_gathered.Contains(interval) && _rows.Covers(interval))
        {
            _onWindow(interval, _rows.Gather(interval).Channels);
            _gathered.Add(interval);
        }
    }
}
