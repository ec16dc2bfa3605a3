namespace BcPrep.Tests;

public class SortedSearchTests
{
    // Reference: the definitions, counting the values below (or at or below) the limit one by one; runs of equal
    // values and limits between, on and beyond the values are the cases a halving search gets wrong.
    [Fact]
    public void Both_searches_count_as_their_definitions_do()
    {
        var random = new Random(3);
        for (var length = 0; length <= 40; length++)
        {
            var values = Enumerable.Range(0, length).Select(_ => (double)random.Next(8)).Order().ToArray();
            for (var limit = -1.0; limit <= 9.0; limit += 0.5)
            {
                Assert.Equal(values.Count(v => v < limit), SortedSearch.FirstAtOrAfter(values, limit));
                Assert.Equal(values.Count(v => v <= limit), SortedSearch.FirstAfter(values, limit));
            }
        }
    }
}
