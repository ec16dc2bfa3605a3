using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class VectorSortedWindowTests
{
    // Reference: the definition, the window's values sorted afresh after every slide. Sizes from 1 to 25 put the
    // last value in every lane of a vector; values from a set of 4 make ties, and the leaving and entering values
    // often equal each other or the median.
    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(8)]
    [InlineData(11)]
    [InlineData(21)]
    [InlineData(25)]
    public void Stays_sorted_through_every_slide_of_tied_and_continuous_values(int size)
    {
        foreach (var tied in new[] { true, false })
        {
            var random = new Random(size);
            var x = Enumerable.Range(0, 600).Select(_ => tied ? random.Next(4) - 1.5 : (random.NextDouble() - 0.5) * 1e3).ToArray();
            var window = new VectorSortedWindow(x.AsSpan(0, size));
            for (var start = 0; start + size <= x.Length; start++)
            {
                if (start > 0)
                {
                    window.Slide(x[start - 1], x[start + size - 1]);
                }
                var expected = x.Skip(start).Take(size).Order().ToArray();

                Assert.Equal(expected, window.Sorted.ToArray());
                Assert.Equal(expected[size / 2], window.Median);
            }
        }
    }

    // Reference: counting by definition, strictly inside the open interval; the ends themselves are not counted.
    [Fact]
    public void Counts_the_values_strictly_inside_an_interval()
    {
        double[] values = [-2.0, 0.5, 1.0, 1.0, 1.5, 3.0, 7.0, 7.0, 9.5];
        var window = new VectorSortedWindow(values);

        Assert.Equal(4, window.CountInside(0.5, 3.0 + 1e-12));
        Assert.Equal(1, window.CountInside(1.0, 3.0));
        Assert.Equal(values.Length, window.CountInside(double.NegativeInfinity, double.PositiveInfinity));
        Assert.Equal(0, window.CountInside(7.0, 7.0));
    }
}
