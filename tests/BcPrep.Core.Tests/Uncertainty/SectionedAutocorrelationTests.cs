using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class SectionedAutocorrelationTests
{
    // Reference: the estimator's definition r(k) = Σᵢ dᵢ dᵢ₊ₖ summed directly; the transforms' rounding is held within
    // 1e-12 of r(0) at every lag below the section length. Window lengths that are and are not multiples of the section
    // (a last short section, a window shorter than one section) and series whose correlation reaches past one section.
    [Theory]
    [InlineData("ar1-tau1", 1000, 2)]
    [InlineData("ar1-tau1", 1024, 128)]
    [InlineData("ar1-tau30", 1025, 128)]
    [InlineData("ar1-tau30", 5000, 256)]
    [InlineData("ar1-tau300", 8192, 1024)]
    [InlineData("ar1-tau300", 8191, 1024)]
    [InlineData("ar1-tau300", 3000, 4096)]
    [InlineData("hum", 6001, 512)]
    [InlineData("drift", 4097, 2048)]
    [InlineData("ramp", 20_000, 64)]
    public void Equals_the_definition_at_every_lag_of_the_section(string series, int n, int sectionLength)
    {
        var x = CorrelatedSeries.Named(series, n, n + sectionLength);
        var mean = x.Average();
        var sums = new double[sectionLength];

        SectionedAutocorrelation.Compute(x, mean, sectionLength, 1, sums);

        var zeroLag = CorrelatedSeries.LaggedProduct(x, mean, 0);
        for (var k = 1; k < Math.Min(sectionLength, n); k++)
        {
            Assert.Equal(0.0, (sums[k] - CorrelatedSeries.LaggedProduct(x, mean, k)) / zeroLag, 1e-12);
        }
    }

    // Reference: a hand-checkable series, r(k) summed by hand from the definition (d = x − 2.5 for x = 1, 2, 3, 4:
    // d = −1.5, −0.5, 0.5, 1.5; r(1) = 0.75 − 0.25 + 0.75 = 1.25, r(2) = −0.75 − 0.75 = −1.5, r(3) = −2.25),
    // across sections of 2 samples (every product but r(1)'s middle one crosses a section boundary).
    [Fact]
    public void Counts_each_product_across_section_boundaries_once()
    {
        double[] x = [1, 2, 3, 4];
        var sums = new double[4];

        SectionedAutocorrelation.Compute(x, 2.5, 4, 0, sums);

        Assert.Equal(5.0, sums[0], 14);
        Assert.Equal(1.25, sums[1], 14);
        Assert.Equal(-1.5, sums[2], 14);
        Assert.Equal(-2.25, sums[3], 14);

        var twoLags = new double[2];
        SectionedAutocorrelation.Compute(x, 2.5, 2, 0, twoLags);
        Assert.Equal(5.0, twoLags[0], 14);
        Assert.Equal(1.25, twoLags[1], 14);
    }

    [Theory]
    [InlineData(3, 1)]
    [InlineData(1, 0)]
    [InlineData(8, 8)]
    public void Refuses_a_section_that_is_not_a_power_of_two_above_the_first_lag(int sectionLength, int firstLag)
    {
        Assert.Throws<ArgumentException>(() => SectionedAutocorrelation.Compute(new double[10], 0.0, sectionLength, firstLag, new double[16]));
    }
}
