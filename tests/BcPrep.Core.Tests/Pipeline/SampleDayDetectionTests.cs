using System.Text.RegularExpressions;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// Detection on the bundled sample day with the [[point]] tables removed. Known answer from the generator
/// (tools/SampleDay): fan and heater off until 10 min, set-point changes at 10, 60 and 110 min, day ends at 165 min;
/// outlet bulk temperature lag τ = 420 s, wall lag τ = 480 s.
/// </summary>
public class SampleDayDetectionTests
{
    private const double WallTimeConstantS = 480.0;
    private static readonly double[] SetPointS = [10 * 60, 60 * 60, 110 * 60];
    private const double DayEndS = 165 * 60;

    internal static RigDescription SampleRigWithoutPoints()
    {
        var text = File.ReadAllText(Path.Combine(RepoRoot.Path, "sample-logs", "marten-rig.toml"));
        text = Regex.Replace(text, @"\[\[point\]\]\s*\nid = ""[^""]*""\s*\nstart = ""[^""]*""\s*\nend = ""[^""]*""\s*\n", "");
        var rig = RigLoader.Load(text, "marten-rig.toml");
        Assert.Empty(rig.Points);
        return rig;
    }

    internal static IReadOnlyList<LogInput> SampleLogs() =>
        Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).Select(LogInput.FromPath).ToList();

    [Fact]
    public void Finds_exactly_three_points_each_inside_its_settled_plateau_and_none_in_the_fan_off_start()
    {
        var day = WindowFinder.Find(SampleRigWithoutPoints(), SampleLogs());

        Assert.Equal(3, day.Detection.Accepted.Count);
        for (var k = 0; k < 3; k++)
        {
            var w = day.Detection.Accepted[k];
            var plateauEndS = k < 2 ? SetPointS[k + 1] : DayEndS;
            // The averaging window lies in the settled plateau: from at least two wall time constants after the
            // change (the steps of this day are several kelvin, the wall's tolerance 0.4 K: ln(8/0.4) ≈ 3) to the
            // next change, which it reaches within a few blocks (the block holding the step is left out), with
            // every key's predicted remaining change within its tolerance. The plateau (stretch) starts at the
            // change itself, found by the flow step within 2 blocks of 1 s. The window is the whole settled part,
            // at least one test window (5 min).
            Assert.InRange(w.StartS, SetPointS[k] + (2 * WallTimeConstantS), plateauEndS);
            Assert.All(w.Channels, c => Assert.True(c.RemainingChange <= c.Tolerance, $"{c.Channel}: {c.RemainingChange} > {c.Tolerance}"));
            Assert.InRange(w.EndS, plateauEndS - 5.0, plateauEndS);
            Assert.InRange(w.StretchStartS, SetPointS[k] - 2.0, SetPointS[k] + 2.0);
            Assert.True(w.EndS - w.StartS >= 300.0);
        }
    }

    [Fact]
    public void The_fan_off_start_is_rejected_for_being_below_the_operating_minimum_not_for_drift()
    {
        var rig = SampleRigWithoutPoints();
        var noMinimum = rig with { Steady = rig.Steady with { Keys = [.. rig.Steady.Keys.Select(k => k with { MinimumSi = null })] } };

        var with = WindowFinder.Find(rig, SampleLogs());
        var without = WindowFinder.Find(noMinimum, SampleLogs());

        // Without the minimum the fan-off start (0–10 min) is perfectly steady and would become a fourth point.
        Assert.Equal(4, without.Detection.Accepted.Count);
        Assert.True(without.Detection.Accepted[0].EndS <= SetPointS[0]);
        Assert.Equal(3, with.Detection.Accepted.Count);
        Assert.True(with.Detection.Accepted[0].StartS > SetPointS[0]);
    }
}
