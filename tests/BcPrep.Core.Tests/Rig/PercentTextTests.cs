using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

public class PercentTextTests
{
    [Theory]
    [InlineData("0.25 %FS", 0.0025, PercentBasis.FullScale)]
    [InlineData("0.25%fs", 0.0025, PercentBasis.FullScale)]
    [InlineData("1 %rdg", 0.01, PercentBasis.Reading)]
    [InlineData("1 % of reading", 0.01, PercentBasis.Reading)]
    [InlineData("0.5 %", 0.005, PercentBasis.Unstated)]
    [InlineData("0.003", 0.003, PercentBasis.Unstated)]
    public void Reads_the_fraction_and_its_basis(string text, double fraction, PercentBasis basis)
    {
        Assert.True(PercentText.TryParse(text, out var f, out var b, out var error), error);
        Assert.Equal(fraction, f, 1e-15);
        Assert.Equal(basis, b);
    }

    [Theory]
    [InlineData("%FS")]
    [InlineData("0.25 kPa")]
    [InlineData("x %rdg")]
    public void Rejects_what_is_not_a_percentage(string text)
    {
        Assert.False(PercentText.TryParse(text, out _, out _, out var error));
        Assert.Contains("not a percentage", error, StringComparison.Ordinal);
    }
}
