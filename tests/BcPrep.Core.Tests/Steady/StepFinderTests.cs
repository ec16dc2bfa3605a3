using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class StepFinderTests
{
    [Fact]
    public void A_sharp_step_is_found_at_its_first_block_and_noise_alone_gives_none()
    {
        // Known answer by construction: level 1.0, then 1.5 from block 500 on; white noise σ = 0.01.
        var noise = SteadyTestData.Ar1(1000, 0.0, 0.01, 3);
        var y = noise.Select((e, i) => (i >= 500 ? 1.5 : 1.0) + e).ToArray();
        var quiet = noise.Select(e => 1.0 + e).ToArray();
        var sigma = StepFinder.Noise(y);
        Assert.InRange(sigma, 0.008, 0.012); // robust σ from first differences, ±20 % (common practice for n = 1000)
        Assert.Equal([500], StepFinder.Find([y], [0.1], [sigma], 10));
        Assert.Empty(StepFinder.Find([quiet], [0.1], [sigma], 10));
    }

    [Fact]
    public void A_first_order_response_is_moved_back_to_its_onset()
    {
        // τ = 20 blocks: the mean difference peaks about 7 blocks late (τ·ln(2 − e^(−h/τ)) for h = 10); the onset
        // search moves it back to the first block beyond 4 σ of the level before: within 2 blocks of the step.
        var noise = SteadyTestData.Ar1(1000, 0.0, 0.001, 4);
        var y = noise.Select((e, i) => 1.0 + (i >= 500 ? 0.5 * (1 - Math.Exp(-(i - 499) / 20.0)) : 0.0) + e).ToArray();
        var step = Assert.Single(StepFinder.Find([y], [0.05], [0.001], 10));
        Assert.InRange(step, 500, 502);
    }

    [Fact]
    public void Block_despike_replaces_a_lone_outlier_and_keeps_gaps_and_steps()
    {
        var y = Enumerable.Range(0, 100).Select(i => (i >= 50 ? 2.0 : 1.0) + (0.01 * Math.Sin(i))).ToArray();
        y[20] = 50.0;
        y[70] = double.NaN;
        var clean = BlockDespike.Apply(y);
        Assert.InRange(clean[20], 0.98, 1.02);
        Assert.True(double.IsNaN(clean[70]));
        Assert.Equal(y[49], clean[49]);
        Assert.Equal(y[50], clean[50]);
    }
}
