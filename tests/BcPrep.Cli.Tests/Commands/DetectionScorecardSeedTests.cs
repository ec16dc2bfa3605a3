using BcPrep.Tests.Cli.Support;
using BcPrep.Tools.Scorecard;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// A few fixed days of the detection scorecard (tools/DetectionScorecard, BENCHMARKS.md), run as ordinary tests:
/// `process` with default [steady] settings finds every point, no extra window, and averages no transient in.
/// The truth is the generator's own (the moment every key quantity stays within a fifth of its declared standard
/// uncertainty of its settled value); 5 s of transient is the scorecard's target.
/// </summary>
public class DetectionScorecardSeedTests
{
    [Theory]
    [InlineData(1)] // 10 Hz, 2 points, a 2.3 s gap in the barometer inside a window (the baseline refused this day); walls with a slow creep, flow overshoot
    [InlineData(3)] // 10 Hz, 4 points, a 3.8 s wall-thermocouple gap inside a window; first-order lags
    [InlineData(5)] // 10 Hz, 2 points, a day that starts already running; flow overshoot
    [InlineData(9)] // 10 Hz, 3 points; walls behind two lags in series
    public void Default_detection_finds_every_point_with_no_extra_window_and_no_transient(int seed)
    {
        using var temp = new TempFolder();
        var recipe = DayRecipe.Draw(seed);
        var truth = DayTruth.Of(recipe);
        var rig = temp.File("rig.toml");
        var log = temp.File("day.csv");
        File.WriteAllText(rig, RigText.Build(""));
        LogWriter.Write(recipe, log);

        var run = CliRunner.Run("process", rig, log, "--out", temp.File("out"), "--quiet");

        Assert.Equal(0, run.ExitCode);
        var score = Scoring.Score(recipe, truth, Scoring.FromManifest(Path.Combine(temp.File("out"), "manifest.json")), null);
        Assert.Equal(truth.Windows.Count, score.Found.Count);
        Assert.Equal(0, score.Extra);
        Assert.All(score.Found, p => Assert.True(p.TransientS <= 5.0, $"point {p.Index}: {p.TransientS:F1} s of transient averaged in"));
        Assert.All(score.Found, p => Assert.True(p.FractionUsed >= 0.8, $"point {p.Index}: {p.FractionUsed:P0} of the steady window used"));
    }
}
