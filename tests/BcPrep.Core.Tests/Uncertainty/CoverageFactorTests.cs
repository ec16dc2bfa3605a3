using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

/// <summary>Student-t coverage factors against GUM Table G.2 as given in the reference sheet 3.1 (printed precision).</summary>
public class CoverageFactorTests
{
    [Theory]
    [InlineData(1, 12.71)]
    [InlineData(2, 4.30)]
    [InlineData(3, 3.18)]
    [InlineData(4, 2.78)]
    [InlineData(5, 2.57)]
    [InlineData(8, 2.31)]
    [InlineData(10, 2.23)]
    [InlineData(16, 2.12)]
    [InlineData(20, 2.09)]
    [InlineData(30, 2.04)]
    [InlineData(50, 2.01)]
    public void P95_matches_GUM_table_G_2(double nu, double expected)
    {
        Assert.Equal(expected, CoverageFactor.ForStudentT(nu, 0.95), 0.005);
    }

    [Theory]
    [InlineData(1, 63.66)]
    [InlineData(2, 9.92)]
    [InlineData(5, 4.03)]
    [InlineData(16, 2.92)]
    [InlineData(100, 2.63)]
    public void P99_matches_GUM_table_G_2(double nu, double expected)
    {
        Assert.Equal(expected, CoverageFactor.ForStudentT(nu, 0.99), 0.005);
    }

    [Theory]
    [InlineData(1, 13.97)]
    [InlineData(10, 2.28)]
    [InlineData(100, 2.025)]
    public void P9545_matches_GUM_table_G_2(double nu, double expected)
    {
        Assert.Equal(expected, CoverageFactor.ForStudentT(nu, 0.9545), 0.005);
    }

    [Fact]
    public void Infinite_dof_is_the_normal_quantile_GUM_table_G_2()
    {
        Assert.Equal(1.960, CoverageFactor.ForStudentT(double.PositiveInfinity, 0.95), 0.0005);
        Assert.Equal(2.576, CoverageFactor.ForStudentT(double.PositiveInfinity, 0.99), 0.0005);
        Assert.Equal(1.984, CoverageFactor.ForStudentT(100, 0.95), 0.0005);
    }

    [Fact]
    public void Invalid_arguments_throw()
    {
        Assert.Throws<BcPrepDataException>(() => CoverageFactor.ForStudentT(0.0));
        Assert.Throws<BcPrepDataException>(() => CoverageFactor.ForStudentT(5.0, 1.0));
    }
}
