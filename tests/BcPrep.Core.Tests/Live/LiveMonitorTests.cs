using BcPrep.Live;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Live;

/// <summary>
/// The live monitor on the bundled sample day, whose generator (tools/SampleDay/DayScenario.cs) steps fan and heater
/// at 600 s, 3600 s and 6600 s. The settling estimate is replaced here by a stand-in that calls every key channel
/// settled 300 s after the stretch began, so that these tests check the monitor's own part: reading and calibrating
/// the rows, finding the steps, finishing the points, and the hold estimate.
/// </summary>
public class LiveMonitorTests
{
    private sealed class SettledAfter(double delayS) : ISettlingEstimator
    {
        public SettlingView? Estimate(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double stepTimeS, double nowS, double toleranceSi) =>
            new(60.0, 0.0, stepTimeS + delayS);
    }

    private static RigDescription SampleRig(double? tOutHoldTargetK = null)
    {
        var rig = RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), "marten-rig.toml");
        var keys = rig.Steady.Keys.Select(k => k.Channel == "t_out" ? k with { HoldTargetSi = tOutHoldTargetK } : k).ToList();
        return rig with { Steady = rig.Steady with { Keys = keys } };
    }

    private static IEnumerable<FollowedLine> SampleLines()
    {
        foreach (var file in new[] { "marten-2026-11-24-am.csv", "marten-2026-11-24-pm.csv" })
        {
            var lines = File.ReadAllLines(Path.Combine(RepoRoot.Path, "sample-logs", file));
            for (var i = 0; i < lines.Length; i++)
            {
                yield return new FollowedLine(file, i + 1, lines[i]);
            }
        }
    }

    [Fact]
    public void The_generator_steps_end_the_held_points_and_nothing_else_does()
    {
        var monitor = new LiveMonitor(SampleRig(), new SettledAfter(300));
        var finished = SampleLines().Select(monitor.Feed).OfType<FinishedStretch>().ToList();
        // Two points were held for the 8 min min_duration and then ended by a step (3600 s, 6600 s); the fan-off start
        // (0–600 s) ended after only 300 s settled, and the third point is still held when the day ends. A step is
        // placed at the start of the later of the two compared 10 s runs of blocks, so up to 10 s early.
        Assert.Equal(2, finished.Count);
        Assert.InRange(finished[0].EndS, 3590, 3601);
        Assert.InRange(finished[1].EndS, 6590, 6601);
        Assert.InRange(finished[1].StretchStartS, 3590, 3700);
        Assert.Equal(finished[1].StretchStartS + 300, finished[1].SettledFromS, 9);
    }

    [Fact]
    public void Live_steps_are_where_the_days_detection_begins_its_plateaus()
    {
        // Reference: the day's detection over the whole day (WindowFinder.Find, as process runs it). Its plateaus
        // begin at the steps of its step finder; the monitor feeds the same detection the blocks as they close.
        var rig = SampleRig();
        var monitor = new LiveMonitor(rig, new SettledAfter(300));
        foreach (var line in SampleLines())
        {
            monitor.Feed(line);
        }
        var logs = new[] { "marten-2026-11-24-am.csv", "marten-2026-11-24-pm.csv" }.Select(f => LogInput.FromPath(Path.Combine(RepoRoot.Path, "sample-logs", f))).ToList();
        var detection = WindowFinder.Find(rig, logs).Detection;
        var plateauStarts = detection.Accepted.Select(w => w.StretchStartS).Concat(detection.Rejected.Select(r => r.StartS))
            .Where(t => t > 1.0).Order().ToList();

        // The generator steps at 600, 3600 and 6600 s (tools/SampleDay/DayScenario.cs); live and the day's detection
        // run the same incremental detection, so they agree to the block.
        Assert.Equal(3, plateauStarts.Count);
        Assert.Equal(plateauStarts, monitor.StepsS);
    }

    [Fact]
    public void Each_key_channel_reads_its_calibrated_SI_value()
    {
        var monitor = new LiveMonitor(SampleRig(), new SettledAfter(300));
        foreach (var line in SampleLines().TakeWhile(l => !(l.FileName.EndsWith("pm.csv", StringComparison.Ordinal))))
        {
            monitor.Feed(line);
        }
        var report = monitor.Report(monitor.NowS);
        // Set point of the second operating point (DayScenario): 0.030 kg/s; the outlet is heated above the ~20 °C inlet.
        Assert.Equal(0.030, report.Channels.Single(c => c.Channel == "mdot").MeanSi, 3);
        Assert.InRange(report.Channels.Single(c => c.Channel == "t_out").MeanSi, 293.15, 373.15);
        Assert.All(report.Channels, c => Assert.Equal(ChannelState.Settled, c.State));
    }

    [Fact]
    public void The_hold_estimate_uses_the_channels_type_B_and_says_when_no_hold_reaches_the_target()
    {
        // t_out is a type K thermocouple of IEC 60584-1 class 1: ±1.5 K below 375 °C, rectangular, u_B = 0.866 K,
        // so U can never fall below 1.95996 × 0.86603 = 1.6974 K (JCGM 100 G.3); the Type A of a settled outlet adds little. A 1.6 K target is out of reach; 2.5 K is met.
        foreach (var (target, reachable) in new[] { (1.6, false), (2.5, true) })
        {
            // Held from 2900 s (the rig file's pinned window of this point starts at 2970 s) to 3575 s.
            var monitor = new LiveMonitor(SampleRig(target), new SettledAfter(2300));
            foreach (var line in SampleLines().Take(7151))
            {
                monitor.Feed(line);
            }
            var hold = monitor.Report(monitor.NowS).Channels.Single(c => c.Channel == "t_out").Hold;
            Assert.NotNull(hold);
            Assert.Equal(reachable, hold.Reachable);
            Assert.InRange(hold.ExpandedUncertaintyNow, 1.6974, 1.75);
        }
    }
}
