using System.Runtime.Intrinsics;
using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class TwentyOnePointWindowTests
{
    // Reference: the zero-one principle (Knuth, TAOCP vol. 3, 5.3.4): a comparator network sorts every input when it
    // sorts all 2²¹ sequences of zeros and ones. Each lane gets its own sequence, so the four lanes are checked too.
    // Catches a comparator missing from, or wrong in, the generated network (the 112 lines are not read by a person).
    [Fact]
    public void Network_sorts_every_zero_one_sequence_in_every_lane()
    {
        const int size = 21;
        var lanes = Vector256<double>.Count;
        var v = new Vector256<double>[size];
        var lane = new double[lanes];
        for (var first = 0; first < 1 << size; first += lanes)
        {
            for (var j = 0; j < size; j++)
            {
                for (var l = 0; l < lanes; l++)
                {
                    lane[l] = ((first + l) >> j) & 1;
                }
                v[j] = Vector256.Create(lane);
            }

            TwentyOnePointWindow.Sort(ref v[0], ref v[1], ref v[2], ref v[3], ref v[4], ref v[5], ref v[6], ref v[7], ref v[8], ref v[9], ref v[10],
                ref v[11], ref v[12], ref v[13], ref v[14], ref v[15], ref v[16], ref v[17], ref v[18], ref v[19], ref v[20]);

            for (var j = 1; j < size; j++)
            {
                if (Vector256.GreaterThanAny(v[j - 1], v[j]))
                {
                    Assert.Fail($"inputs {first}…{first + lanes - 1}: wires {j - 1} and {j} out of order");
                }
            }
        }
    }

    // Reference: the definition (median and MAD of each 21-sample window by sorting, as HampelFilterTests.Definition),
    // for centres straddling every position of the last, moved-back group (4 … 33 centres), and for the four stretches
    // of a long series with every remainder of its length by 4 (256 … 259: the last stretch moved back over the
    // third): a lane decided twice, or skipped, shows up as a duplicate, a missing or an out-of-order index, a window
    // slid wrongly as a wrong median. A third of the samples are spikes, so every lane replaces many.
    [Theory]
    [InlineData(256)]
    [InlineData(257)]
    [InlineData(258)]
    [InlineData(259)]
    [InlineData(1001)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(7)]
    [InlineData(8)]
    [InlineData(9)]
    [InlineData(33)]
    public void Decides_each_centre_once_in_order_whatever_the_count(int centres)
    {
        var random = new Random(centres);
        var x = Enumerable.Range(0, centres + 20).Select(i => random.NextDouble() + (i % 3 == 1 ? 50.0 : 0.0)).ToArray();
        var output = (double[])x.Clone();
        var replaced = new List<int>();

        TwentyOnePointWindow.Apply(x, 10, 10 + centres, 2.0, 0.0, output, replaced);

        var (values, indices) = HampelFilterTests.Definition(x, 10, 2.0, 0.0);
        Assert.Equal(indices.Where(i => i >= 10 && i < 10 + centres), replaced);
        Assert.NotEmpty(replaced);
        for (var i = 10; i < 10 + centres; i++)
        {
            Assert.Equal(BitConverter.DoubleToInt64Bits(values[i]), BitConverter.DoubleToInt64Bits(output[i]));
        }
    }

    // Reference: the definition, as above. The long path first screens each step with a lower bound of the MAD and
    // forms the MAD only when a lane could pass the rule: on noise whose tails put many centres between the screen's
    // threshold and the rule's (heavy-tailed noise, n_σ from 1 to 3), on quantised samples (ties, a MAD of zero, the
    // floor deciding) and on a hum, every decision and every replaced value must still be the definition's. A screen
    // that dropped a spike shows up as a missing index; one that let a lane through wrongly cannot, as the MAD decides.
    [Theory]
    [InlineData("heavy tails", 1.0, 0.0)]
    [InlineData("heavy tails", 2.0, 0.0)]
    [InlineData("heavy tails", 3.0, 0.0)]
    [InlineData("quantised", 3.0, 0.0)]
    [InlineData("quantised", 2.0, 0.05)]
    [InlineData("hum", 3.0, 0.0)]
    public void Screened_steps_decide_as_the_definition(string kind, double nSigma, double floor)
    {
        const int centres = 4000;
        var random = new Random(kind.Length + (int)(10 * nSigma));
        var x = new double[centres + 20];
        for (var i = 0; i < x.Length; i++)
        {
            // Every 37th sample a step of 0 to 10 scales out: some pass the rule, some fall just short.
            var outlier = i % 37 == 0 ? 10.0 * random.NextDouble() : 0.0;
            x[i] = kind switch
            {
                // Student's t with 2 degrees of freedom: a normal over the root of a χ²₂/2 (an exponential).
                "heavy tails" => (Normal(random) / Math.Sqrt(-Math.Log(1.0 - random.NextDouble()))) + outlier,
                // + 0.0 turns a rounded −0 into +0: the vector form may give a zero median the other sign (its remarks).
                "quantised" => (Math.Round((Normal(random) * 0.6) + outlier) * 0.1) + 0.0,
                _ => Math.Sin(2 * Math.PI * i / 20.0) + (0.01 * Normal(random)) + (0.5 * outlier),
            };
        }
        var output = (double[])x.Clone();
        var replaced = new List<int>();

        TwentyOnePointWindow.Apply(x, 10, 10 + centres, nSigma, floor, output, replaced);

        var (values, indices) = HampelFilterTests.Definition(x, 10, nSigma, floor);
        Assert.Equal(indices.Where(i => i >= 10 && i < 10 + centres), replaced);
        Assert.NotEmpty(replaced);
        for (var i = 10; i < 10 + centres; i++)
        {
            Assert.Equal(BitConverter.DoubleToInt64Bits(values[i]), BitConverter.DoubleToInt64Bits(output[i]));
        }
    }

    // Reference: the definition of the MAD (median of |sᵢ − m| over the sorted window). The bound the long path screens
    // with is never above it, on random windows with ties and on windows of equal values.
    [Fact]
    public void Mad_lower_bound_never_exceeds_the_mad()
    {
        var random = new Random(21);
        for (var trial = 0; trial < 20000; trial++)
        {
            var window = Enumerable.Range(0, 21).Select(_ => trial % 3 == 0 ? Math.Round(random.NextDouble() * 4) : Normal(random) * Math.Exp(3 * random.NextDouble())).ToArray();
            Array.Sort(window);
            var m = window[10];
            var deviations = window.Select(s => Math.Abs(s - m)).OrderBy(d => d).ToArray();
            var mad = deviations[10];
            var bound = TwentyOnePointWindow.MadLowerBound(Vector256.Create(window[5]), Vector256.Create(m), Vector256.Create(window[15]));
            Assert.True(bound[0] <= mad, $"trial {trial}: bound {bound[0]:R} above the MAD {mad:R}");
        }
    }

    private static double Normal(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());

    // A caller's mistake: windows that would reach outside the samples are refused, not read past the end.
    [Fact]
    public void Refuses_centres_without_whole_windows()
    {
        var x = new double[40];
        Assert.Throws<ArgumentException>(() => TwentyOnePointWindow.Apply(x, 9, 20, 3.0, 0.0, new double[40], []));
        Assert.Throws<ArgumentException>(() => TwentyOnePointWindow.Apply(x, 10, 31, 3.0, 0.0, new double[40], []));
    }
}
