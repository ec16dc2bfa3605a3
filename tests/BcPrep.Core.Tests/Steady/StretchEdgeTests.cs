using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

/// <summary>Where a plateau's window ends before a set-point change, and the operating minimum of a key channel (PlateauDetector).</summary>
public class StretchEdgeTests
{
    private const double NoiseSd = 0.01;

    /// <summary>
    /// Known answer: level 10.0 with white noise (sd 0.01) until 2400 s, then a first-order step of +0.5 (τ = 15 s)
    /// to 3000 s, 1 s samples. The step moves 0.032 after 1 s (3.2 sd: not separable from noise at 4 sd) and 0.062
    /// after 2 s, so the averaging window must close no later than 2401 s.
    /// </summary>
    [Fact]
    public void A_stretch_ends_before_a_set_point_change_that_starts_inside_its_last_test_window()
    {
        var t = Enumerable.Range(0, 3000).Select(i => (double)i).ToArray();
        var rng = new Random(5);
        var y = t.Select(ti => 10.0 + (ti >= 2400 ? 0.5 * (1 - Math.Exp(-(ti - 2400) / 15.0)) : 0.0) + (NoiseSd * SteadyTestData.Gaussian(rng))).ToArray();
        var channel = new KeyChannel("q", y, 0.05 / 300.0, 0.05, 0.2);

        var result = PlateauDetector.Detect(t, [channel], new SteadySettings());

        var first = result.Accepted[0];
        Assert.InRange(first.EndS, 2100.0, 2401.0);
        Assert.Equal(10.0, first.Channels[0].Mean, 0.005); // 300 samples: u(mean) ≈ 0.0006; 0.005 is 8 u
    }

    [Fact]
    public void A_steady_rig_at_rest_is_rejected_by_the_operating_minimum_with_value_and_limit()
    {
        var t = Enumerable.Range(0, 1800).Select(i => (double)i).ToArray();
        var rng = new Random(6);
        var flow = t.Select(_ => 0.0001 * SteadyTestData.Gaussian(rng)).ToArray();
        var channel = new KeyChannel("mdot", flow, 1e-6, 4e-4, 2e-3, MinimumValue: 0.005);

        var result = PlateauDetector.Detect(t, [channel], new SteadySettings());

        Assert.Empty(result.Accepted);
        var rejected = Assert.Single(result.Rejected);
        var failure = Assert.Single(rejected.Channels[0].Failures, f => f.Criterion == SteadyCriterion.Range);
        Assert.Equal(0.005, failure.Limit);
        Assert.InRange(failure.Value, -0.0001, 0.0001); // mean of ≥ 300 samples of sd 1e-4
        Assert.Contains("below the operating minimum", rejected.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void The_same_rig_without_a_minimum_is_accepted()
    {
        var t = Enumerable.Range(0, 1800).Select(i => (double)i).ToArray();
        var rng = new Random(6);
        var flow = t.Select(_ => 0.0001 * SteadyTestData.Gaussian(rng)).ToArray();

        var result = PlateauDetector.Detect(t, [new KeyChannel("mdot", flow, 1e-6, 4e-4, 2e-3)], new SteadySettings());

        Assert.Single(result.Accepted);
    }
}
