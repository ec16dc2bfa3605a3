using BcPrep.Conditioning;
using MathNet.Numerics.Statistics;

namespace BcPrep.Tests.Conditioning;

public class OrderStatisticsTests
{
    // Reference: MathNet.Numerics 5.0 ArrayStatistics.MedianInplace, the general library's median (mean of the two
    // middle order statistics for an even count). Duplicates and sorted runs are the cases that break a selection.
    [Theory]
    [InlineData(1, 0)]
    [InlineData(2, 0)]
    [InlineData(7, 0)]
    [InlineData(10, 0)]
    [InlineData(1001, 0)]
    [InlineData(1000, 3)]
    [InlineData(5000, 1)]
    public void Median_equals_the_general_library_median(int n, int distinctValues)
    {
        var random = new Random(n + distinctValues);
        var values = Enumerable.Range(0, n).Select(_ => distinctValues > 0 ? random.Next(distinctValues) : random.NextDouble()).ToArray();
        var expected = ArrayStatistics.MedianInplace((double[])values.Clone());

        Assert.Equal(expected, OrderStatistics.MedianInPlace(values));
    }

    [Fact]
    public void Median_of_a_sorted_run_with_a_tail_of_equal_steps()
    {
        // A logger's time steps: nearly all equal, a few jitters and one jump.
        var steps = Enumerable.Repeat(0.002, 999).Append(0.0021).Append(0.0019).Append(1.5).ToArray();

        Assert.Equal(0.002, OrderStatistics.MedianInPlace(steps));
    }
}
