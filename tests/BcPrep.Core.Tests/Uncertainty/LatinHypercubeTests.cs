using BcPrep.Uncertainty;
using MathNet.Numerics.Distributions;

namespace BcPrep.Tests.Uncertainty;

/// <summary>Latin hypercube property (McKay, Beckman &amp; Conover 1979): every stratum of every input hit exactly once.</summary>
public class LatinHypercubeTests
{
    [Fact]
    public void Each_input_hits_each_stratum_exactly_once_and_keeps_its_moments()
    {
        UncertaintyInput[] inputs =
        [
            new("T_in", 293.15, 0.1),
            new("p", 101_325.0, 20.0, distribution: DistributionKind.Rectangular),
            new("q", 5.0, 0.5, distribution: DistributionKind.Triangular),
            new("c", 0.0, 2.0, distribution: DistributionKind.ArcSine),
        ];
        const int count = 500;
        var rows = LatinHypercube.Sample(inputs, count, seed: 99);
        Assert.Equal(count, rows.Length);

        var normalStrata = rows.Select(r => (int)Math.Floor(Normal.CDF(293.15, 0.1, r[0]) * count)).ToHashSet();
        var a = 20.0 * Math.Sqrt(3.0);
        var rectangularStrata = rows.Select(r => (int)Math.Floor((r[1] - (101_325.0 - a)) / (2 * a) * count)).ToHashSet();
        Assert.Equal(count, normalStrata.Count);
        Assert.Equal(count, rectangularStrata.Count);

        for (var j = 0; j < inputs.Length; j++)
        {
            var column = rows.Select(r => r[j]).ToArray();
            var mean = column.Average();
            var sd = Math.Sqrt(column.Sum(v => (v - mean) * (v - mean)) / (count - 1));
            Assert.Equal(inputs[j].Estimate, mean, inputs[j].StandardUncertainty * 0.01);
            Assert.Equal(inputs[j].StandardUncertainty, sd, inputs[j].StandardUncertainty * 0.02);
        }
    }

    [Fact]
    public void Same_seed_reproduces_the_sample()
    {
        UncertaintyInput[] inputs = [new("x", 1.0, 0.1), new("y", 2.0, 0.2, distribution: DistributionKind.Rectangular)];
        Assert.Equal(LatinHypercube.Sample(inputs, 10, 1), LatinHypercube.Sample(inputs, 10, 1));
    }

    [Fact]
    public void Zero_count_throws()
    {
        Assert.Throws<BcPrepDataException>(() => LatinHypercube.Sample([new UncertaintyInput("x", 1.0, 0.1)], 0, 1));
    }
}
