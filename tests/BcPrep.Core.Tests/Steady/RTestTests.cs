using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class RTestTests
{
    [Fact]
    public void R_averages_near_one_on_white_noise()
    {
        // Domain reference 5.1: simulated mean R = 1.036 for λ = 0.2/0.1/0.1 on white Gaussian noise (statistical, seed fixed).
        var rng = new Random(42);
        var x = Enumerable.Range(0, 100_000).Select(_ => 5.0 + SteadyTestData.Gaussian(rng)).ToArray();
        var r = RTest.Compute(x, new RTestSettings());
        double mean = r.Skip(500).Average();
        Assert.InRange(mean, 0.95, 1.05);
    }

    [Fact]
    public void R_is_far_above_critical_on_a_ramp()
    {
        var rng = new Random(7);
        var x = Enumerable.Range(0, 2000).Select(i => (0.5 * i) + (0.1 * SteadyTestData.Gaussian(rng))).ToArray();
        var r = RTest.Compute(x, new RTestSettings());
        Assert.True(r.Skip(200).Min() > 10.0, $"min R = {r.Skip(200).Min()}");
    }

    [Fact]
    public void Default_critical_value_is_the_simulated_95_percent_quantile()
    {
        Assert.Equal(1.43, new RTestSettings().RCritical);
    }

    [Fact]
    public void Invalid_lambda_is_refused()
    {
        Assert.Throws<BcPrepDataException>(() => RTest.Compute([1.0, 2.0], new RTestSettings(Lambda1: 0.0)));
    }
}
