using System.Globalization;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// The steady-window detection of a test day: block means of every channel, and the detector's accepted windows and
/// rejected stretches. All detection times are seconds since the first sample of the day.
/// </summary>
public sealed record DayWindows(DayStart Start, BlockSeries Blocks, SteadyDetectionResult Detection);

/// <summary>
/// Finds the operating-point windows of a day from the <c>[steady]</c> settings of the rig file: one streaming
/// block-mean pass, then <see cref="PlateauDetector"/> on the key channels (the same detection that runs during the read of <c>process</c>, <see cref="LiveDetection"/>). The same functions serve
/// <c>process</c> (through <see cref="DayProcessor"/>) and the <c>windows</c> command, so both see the same windows.
/// </summary>
public static class WindowFinder
{
    /// <summary>
    /// True when the rig file asks for detection (<c>[steady] detect</c>, default true) and has key channels, written
    /// or by default (<see cref="DetectionKeys.DefaultKeys"/>).
    /// </summary>
    public static bool IsEnabled(RigDescription rig) => rig.Steady.Detect && (rig.Steady.Keys.Count > 0 || DetectionKeys.DefaultKeys(rig).Count > 0);

    /// <summary>Reads the day once (block means only) and detects its steady windows.</summary>
    /// <exception cref="BcPrepFailure">Configuration when [steady] names no key channel; InputData for unreadable logs.</exception>
    public static DayWindows Find(RigDescription rig, IReadOnlyList<LogInput> logs)
    {
        ArgumentNullException.ThrowIfNull(rig);
        var plan = DayPlan.Create(rig, logs);
        var converters = rig.Channels.ToDictionary(c => c.Id, BlockConverter.For, StringComparer.Ordinal);
        var feed = DetectionFeed.For(rig, new BlockMeanSink(plan.Start.FirstSample.Value, rig.Steady.BlockS));
        DayScan.Run(rig, plan, converters, [], feed.BlockSink);
        feed.Complete();
        var series = Series(rig, feed.Blocks);
        return new DayWindows(plan.Start, series, Detect(rig, series, plan.Start));
    }

    /// <summary>Block means of every rig channel on the common block grid (NaN where a block has no sample).</summary>
    public static BlockSeries Series(RigDescription rig, BlockMeanSink blocks)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(blocks);
        var length = blocks.Length;
        return new BlockSeries(blocks.Times(length), rig.Channels.ToDictionary(c => c.Id, c => blocks.Means(c.Id, length), StringComparer.Ordinal));
    }

    /// <summary>
    /// Runs the detector on the key channels' block means. The drift limit per second is max_change / window; times
    /// are shifted to the day's first sample so that reports read "in [2820, 3120] s", not in seconds since 1970.
    /// </summary>
    /// <exception cref="BcPrepFailure">Configuration when [steady] names no key channel.</exception>
    public static SteadyDetectionResult Detect(RigDescription rig, BlockSeries series, DayStart dayStart)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(series);
        if (rig.Steady.Keys.Count == 0 && DetectionKeys.DefaultKeys(rig).Count == 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(rig.SourceFile, Key: "steady.key"),
                "no [[point]] windows are pinned, [steady] names no key channel, and the rig has no mass flow, outlet or wall temperature channel to detect them with by default");
        }
        RequireBlocks(rig, series);
        var times = series.TimesS.Select(t => dayStart.Since(new LoggerSeconds(t)).Value).ToArray();
        return PlateauDetector.Detect(times, DetectionKeys.For(rig, channel => series.Means[channel]), Settings(rig.Steady), rig.Steady.BlockS);
    }

    /// <summary>Refuses a day too short to look for a steady window in (fewer than three blocks).</summary>
    /// <exception cref="BcPrepFailure">NoSteadyPoint.</exception>
    public static void RequireBlocks(RigDescription rig, BlockSeries series)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(series);
        if (series.TimesS.Length < 3)
        {
            throw new BcPrepFailure(FailureKind.NoSteadyPoint, new SourceLocation("(logs)"),
                string.Create(CultureInfo.InvariantCulture, $"the day holds {series.TimesS.Length} block(s) of {rig.Steady.BlockS} s: too short to look for a steady window"));
        }
    }

    /// <summary>
    /// Detector settings from the rig file. The test window slides in steps of window/30 (at least one block): fine
    /// enough to place a stretch's edges within a few percent of the window, cheap enough for a long day.
    /// </summary>
    public static SteadySettings Settings(SteadySpec steady)
    {
        ArgumentNullException.ThrowIfNull(steady);
        return new SteadySettings(WindowS: steady.WindowS, MinStretchS: steady.MinDurationS, TailS: steady.SettledTailS,
            StepS: Math.Max(steady.BlockS, steady.WindowS / 30));
    }

    /// <summary>The no-steady-window report: one problem per rejected stretch, each naming channel, criterion, value, limit and time.</summary>
    public static IReadOnlyList<Problem> NoSteadyProblems(RigDescription rig, SteadyDetectionResult detection)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(detection);
        var problems = new List<Problem>
        {
            new(new SourceLocation(rig.SourceFile, Key: "steady"), "no steady operating point found; the stretches closest to steady were:"),
        };
        problems.AddRange(detection.Rejected.Select(r => new Problem(
            new SourceLocation("(logs)", Key: string.Create(CultureInfo.InvariantCulture, $"{r.StartS:F0}–{r.EndS:F0} s")),
            "rejected: " + r.Reason)));
        return problems;
    }
}
