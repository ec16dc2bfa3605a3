using BcPrep.Profiles;

namespace BcPrep.Tests.Profiles;

public class WallLawTests
{
    // [CC] domain reference sheet §8.1 wall-law table (Spalding 1961 implicit law; Reichardt 1951), tolerance 1e-4
    // (values printed to 4 decimals; half a unit plus rounding → 6e-5 would do, 1e-4 as the brief asks).
    [Theory]
    [InlineData(1.0, 0.9998, 0.9999)]
    [InlineData(5.0, 4.8751, 4.8938)]
    [InlineData(10.0, 8.3623, 8.5179)]
    [InlineData(30.0, 12.7865, 13.2000)]
    [InlineData(100.0, 16.2588, 16.8089)]
    [InlineData(1000.0, 22.0447, 22.7616)]
    public void Spalding_matches_the_check_values(double yPlus, double kappa041B52, double kappa04B55)
    {
        Assert.Equal(kappa041B52, WallLaw.Spalding(yPlus, 0.41, 5.2), 1e-4);
        Assert.Equal(kappa04B55, WallLaw.Spalding(yPlus, 0.4, 5.5), 1e-4);
    }

    [Theory]
    [InlineData(1.0, 1.0078, 1.0109)]
    [InlineData(5.0, 4.8993, 4.9259)]
    [InlineData(10.0, 8.3783, 8.4281)]
    [InlineData(30.0, 13.6006, 13.7013)]
    [InlineData(100.0, 16.9154, 17.0831)]
    [InlineData(1000.0, 22.4795, 22.7849)]
    public void Reichardt_matches_the_check_values(double yPlus, double kappa041, double kappa04)
    {
        Assert.Equal(kappa041, WallLaw.Reichardt(yPlus, 0.41), 1e-4);
        Assert.Equal(kappa04, WallLaw.Reichardt(yPlus, 0.4), 1e-4);
    }

    [Fact]
    public void Spalding_tends_to_the_log_law_far_from_the_wall()
    {
        // [CC] §8.1 log law κ = 0.41, B = 5.2 at y⁺ = 1000: 22.048; Spalding's series terms still leave 3.3e-3 there.
        Assert.Equal(22.048, WallLaw.Spalding(1000.0), 4e-3);
        Assert.Equal(0.0, WallLaw.Spalding(0.0));
        Assert.Throws<BcPrepDataException>(() => WallLaw.Spalding(-1.0));
    }
}
