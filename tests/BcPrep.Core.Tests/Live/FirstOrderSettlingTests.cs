using BcPrep.Live;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Live;

/// <summary>
/// The follower's states and predicted settle times against the sample day's generator truth
/// (tools/SampleDay/Program.cs): after the step at 3600 s the wall temperatures approach their new level with a
/// first-order time constant of 480 s and the outlet temperature with 420 s. The wall's change Δ is measured from the
/// data (10 s means just before the steps at 3600 s and 6600 s), so it settles within the key's 0.4 K tolerance
/// at 3600 s + 480 s · ln(|Δ|/0.4 K).
/// </summary>
public class FirstOrderSettlingTests
{
    private static RigDescription Rig => RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), "marten-rig.toml");

    private static LiveMonitor FedUntil(double endS)
    {
        var monitor = new LiveMonitor(Rig, new FirstOrderSettling());
        foreach (var file in new[] { "marten-2026-11-24-am.csv", "marten-2026-11-24-pm.csv" })
        {
            var lines = File.ReadAllLines(Path.Combine(RepoRoot.Path, "sample-logs", file));
            for (var i = 0; i < lines.Length; i++)
            {
                if (!double.IsNaN(monitor.NowS) && monitor.NowS >= endS)
                {
                    return monitor;
                }
                monitor.Feed(new FollowedLine(file, i + 1, lines[i]));
            }
        }
        return monitor;
    }

    private static ChannelReport Wall(LiveMonitor m) => m.Report(m.NowS).Channels.Single(c => c.Channel == "t_w3");

    [Fact]
    public void Fifteen_minutes_after_a_step_the_wall_approaches_with_the_generators_time_constant_and_settles_when_predicted()
    {
        var before = Wall(FedUntil(3595)).MeanSi;
        var after = Wall(FedUntil(6595)).MeanSi;
        var truthSettledS = 3600 + (480 * Math.Log(Math.Abs(after - before) / 0.4));
        Assert.InRange(truthSettledS, 3600 + 480, 6000); // the generator's wall moves by several tolerances

        var monitor = FedUntil(4500);
        var wall = Wall(monitor);
        Assert.Equal(ChannelState.Approaching, wall.State);
        // Tolerances (common practice, from 900 s of a 480 s approach with logger noise): τ within 20 % of the
        // generator's, the predicted settled moment within 20 % of the truth's time since the step.
        Assert.InRange(wall.TauS, 0.8 * 480, 1.2 * 480);
        Assert.InRange(wall.SettledSinceS - 3600, 0.8 * (truthSettledS - 3600), 1.2 * (truthSettledS - 3600));
        Assert.Equal(wall.SettledSinceS - monitor.NowS, wall.TimeToSettleS, 9);
    }

    [Fact]
    public void Late_in_a_held_point_every_key_channel_is_settled_and_the_point_is_finished_by_the_next_step()
    {
        var monitor = FedUntil(6500);
        var report = monitor.Report(monitor.NowS);
        Assert.All(report.Channels, c => Assert.Equal(ChannelState.Settled, c.State));
        // The mass flow (τ = 15 s) settles within a minute or two of the step; the wall last.
        Assert.InRange(report.Channels.Single(c => c.Channel == "mdot").SettledSinceS, 3600, 3800);
        Assert.True(report.SettledFromS > 4500 && report.SettledFromS < 6000, $"settled from {report.SettledFromS} s");
    }
}
