using BcPrep.Physics;

namespace BcPrep.Tests.Physics;

public class FrictionFactorTests
{
    private static void AssertRelative(double expected, double actual, double relativeTolerance) =>
        Assert.InRange(actual / expected - 1.0, -relativeTolerance, relativeTolerance);

    [Fact]
    public void Colebrook_matches_the_fluids_library_value()
    {
        // [CS] fluids library: Colebrook(Re = 1e5, eD = 1e-4) = 0.018513866077471648; relative 1e-9.
        AssertRelative(0.018513866077471648, FrictionFactor.Colebrook(1e5, 1e-4), 1e-9);
    }

    [Fact]
    public void Haaland_matches_the_fluids_library_value()
    {
        // [CS] fluids library: Haaland(1e5, 1e-4) = 0.018265053014793857; relative 1e-9.
        AssertRelative(0.018265053014793857, FrictionFactor.Haaland(1e5, 1e-4), 1e-9);
    }

    [Fact]
    public void Blasius_matches_the_fluids_library_test_value()
    {
        // [CS] fluids library test: Blasius(10000) = 0.03164.
        AssertRelative(0.03164, FrictionFactor.Blasius(1e4), 1e-9);
    }

    // [CC] smooth-pipe table, domain reference sheet §8.2, printed to 6 decimals: tolerance 6e-6 absolute (half a printed digit plus rounding).
    [Theory]
    [InlineData(4e3, 0.039907, 0.040423, 0.039785, 0.041441)]
    [InlineData(1e4, 0.030883, 0.030886, 0.031640, 0.031480)]
    [InlineData(5e4, 0.020891, 0.020713, 0.021159, 0.020958)]
    [InlineData(1e5, 0.017990, 0.017825, 0.017792, 0.017992)]
    public void Smooth_pipe_correlations_match_the_reference_table(double reynolds, double colebrook, double haaland, double blasius, double petukhov)
    {
        Assert.Equal(colebrook, FrictionFactor.Colebrook(reynolds), 6e-6);
        Assert.Equal(haaland, FrictionFactor.Haaland(reynolds), 6e-6);
        Assert.Equal(blasius, FrictionFactor.Blasius(reynolds), 6e-6);
        Assert.Equal(petukhov, FrictionFactor.Petukhov(reynolds), 6e-6);
    }

    [Fact]
    public void At_Re_1e6_Colebrook_Haaland_Petukhov_match_the_table_and_Blasius_refuses()
    {
        // [CC] §8.2 row Re = 1e6; Blasius there (0.010005) is 14 % low — outside its range, so it must throw.
        Assert.Equal(0.011645, FrictionFactor.Colebrook(1e6), 6e-6);
        Assert.Equal(0.011587, FrictionFactor.Haaland(1e6), 6e-6);
        Assert.Equal(0.011626, FrictionFactor.Petukhov(1e6), 6e-6);
        Assert.Throws<BcPrepDataException>(() => FrictionFactor.Blasius(1e6));
    }

    [Fact]
    public void Colebrook_satisfies_its_own_equation_to_1e_12()
    {
        var f = FrictionFactor.Colebrook(2.7e4, 2e-3);
        var rhs = -2.0 * Math.Log10((2e-3 / 3.7) + (2.51 / (2.7e4 * Math.Sqrt(f))));
        Assert.InRange((1.0 / Math.Sqrt(f)) / rhs - 1.0, -1e-12, 1e-12);
    }

    [Fact]
    public void Laminar_is_64_over_Re_and_refuses_turbulent_Re()
    {
        Assert.Equal(0.032, FrictionFactor.Laminar(2000.0), 15);
        Assert.Throws<BcPrepDataException>(() => FrictionFactor.Laminar(5000.0));
        Assert.Throws<BcPrepDataException>(() => FrictionFactor.Colebrook(1e5, 0.1));
        Assert.Throws<BcPrepDataException>(() => FrictionFactor.Haaland(double.NaN));
    }
}
