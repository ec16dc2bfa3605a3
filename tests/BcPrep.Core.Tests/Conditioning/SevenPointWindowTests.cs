using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class SevenPointWindowTests
{
    // Reference: the zero-one principle (Knuth, TAOCP vol. 3, 5.3.4): a comparator network sorts every input when it
    // sorts all 2⁷ sequences of zeros and ones. The median of a sorted 0/1 sequence is its middle element.
    [Fact]
    public void Network_finds_the_median_of_every_zero_one_sequence()
    {
        for (var bits = 0; bits < 128; bits++)
        {
            var values = Enumerable.Range(0, 7).Select(j => (double)((bits >> j) & 1)).ToArray();
            var expected = values.Order().ElementAt(3);

            Assert.Equal(expected, SevenPointWindow.MedianAndMad(values).Median);
        }
    }

    // Reference: the definitions, median of the values and median of the absolute deviations from it, by sorting.
    [Fact]
    public void Median_and_mad_equal_their_definitions_on_random_and_tied_windows()
    {
        var random = new Random(11);
        for (var trial = 0; trial < 2000; trial++)
        {
            var values = Enumerable.Range(0, 7).Select(_ => trial % 3 == 0 ? random.Next(3) : random.NextDouble()).ToArray();
            var median = values.Order().ElementAt(3);
            var mad = values.Select(v => Math.Abs(v - median)).Order().ElementAt(3);

            var (m, d) = SevenPointWindow.MedianAndMad(values);

            Assert.Equal(median, m);
            Assert.Equal(mad, d);
        }
    }
}
