using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

/// <summary>
/// The detection's medians by selection (<see cref="BlockDespike.Median(List{double})"/>, <see cref="StepFinder.Noise(IReadOnlyList{double})"/>,
/// <see cref="PlateauDetector.MedianAbs(IReadOnlyList{double})"/>) give the very doubles that sorting gave: a copy of
/// the former sort-based code is the reference, compared to the bit (definition of the median: the middle order
/// statistic, the mean of the two middle ones for an even count; common practice).
/// </summary>
public class SelectionMedianTests
{
    // Counts odd and even, block-mean-like values with repeats (a coarse logger gives equal block means), and a
    // day's worth of blocks.
    [Theory]
    [InlineData(1, 0)]
    [InlineData(2, 0)]
    [InlineData(21, 0)]
    [InlineData(20, 4)]
    [InlineData(3600, 0)]
    [InlineData(3599, 7)]
    public void Median_equals_the_median_of_the_sorted_values(int n, int distinct)
    {
        var values = BlockMeans(n, distinct, seed: n + distinct);

        Assert.Equal(SortedMedian([.. values]), BlockDespike.Median(new List<double>(values)));
    }

    [Theory]
    [InlineData(3600, 0.0)]
    [InlineData(3600, 0.05)]
    [InlineData(1001, 0.3)]
    [InlineData(4, 0.0)]
    public void Noise_equals_the_sort_based_noise(int n, double gapFraction)
    {
        var random = new Random(n);
        // Two plateaus with a step, block noise, and gaps (NaN blocks) that the differences skip.
        var y = Enumerable.Range(0, n).Select(i => random.NextDouble() < gapFraction ? double.NaN : (i < n / 2 ? 300.0 : 312.5) + (0.01 * (random.NextDouble() - 0.5)))
            .ToArray();

        Assert.Equal(SortBasedNoise(y), StepFinder.Noise(y));
        Assert.Equal(SortBasedNoise(y), StepFinder.Noise((IReadOnlyList<double>)new ArraySegment<double>(y, 0, n)));
    }

    [Fact]
    public void Noise_of_fewer_than_three_differences_is_zero_as_before()
    {
        double[] y = [1.0, double.NaN, 2.0, 3.0];

        Assert.Equal(0.0, StepFinder.Noise(y));
        Assert.Equal(SortBasedNoise(y), StepFinder.Noise(y));
    }

    [Theory]
    [InlineData(3600)]
    [InlineData(3601)]
    public void Median_of_absolute_values_equals_the_sort_based_one(int n)
    {
        var random = new Random(n);
        var values = Enumerable.Range(0, n).Select(_ => random.NextDouble() < 0.02 ? double.NaN : (random.NextDouble() - 0.3) * 1e5).ToArray();

        Assert.Equal(SortBasedMedianAbs(values), PlateauDetector.MedianAbs(values));
        Assert.Equal(0.0, PlateauDetector.MedianAbs([double.NaN, double.PositiveInfinity]));
    }

    private static double[] BlockMeans(int n, int distinct, int seed)
    {
        var random = new Random(seed);
        return [.. Enumerable.Range(0, n).Select(_ => distinct > 0 ? 0.25 * random.Next(distinct) : 101325.0 + (random.NextDouble() - 0.5))];
    }

    // The former code, verbatim in effect: a list sorted, then the middle element(s).
    private static double SortedMedian(List<double> values)
    {
        values.Sort();
        var n = values.Count;
        return n % 2 == 1 ? values[n / 2] : 0.5 * (values[(n / 2) - 1] + values[n / 2]);
    }

    private static double SortBasedNoise(IReadOnlyList<double> y)
    {
        var differences = new List<double>();
        for (var i = 1; i < y.Count; i++)
        {
            if (double.IsFinite(y[i]) && double.IsFinite(y[i - 1]))
            {
                differences.Add(y[i] - y[i - 1]);
            }
        }
        if (differences.Count < 3)
        {
            return 0.0;
        }
        var median = SortedMedian(differences);
        var deviations = differences.Select(d => Math.Abs(d - median)).ToList();
        return 1.4826 * SortedMedian(deviations) / Math.Sqrt(2.0);
    }

    private static double SortBasedMedianAbs(IReadOnlyList<double> values)
    {
        var finite = values.Where(double.IsFinite).Select(Math.Abs).ToList();
        return finite.Count == 0 ? 0.0 : SortedMedian(finite);
    }
}
