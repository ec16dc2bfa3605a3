using System.Collections.Immutable;
using BcPrep.Profiles;

namespace BcPrep.Tests.Profiles;

public class AxialWallProfileTests
{
    private static readonly ImmutableArray<double> Z = [0.3, 0.7];
    private static readonly ImmutableArray<double> T = [380.0, 400.0];

    [Fact]
    public void Linear_between_thermocouples()
    {
        Assert.Equal(385.0, AxialWallProfile.At(Z, T, 0.4, clampOutside: false), 1e-12);
        Assert.Equal(400.0, AxialWallProfile.At(Z, T, 0.7 + 1e-12, clampOutside: false), 1e-12); // rounding at the end
    }

    [Fact]
    public void Never_extrapolates_clamps_only_when_asked()
    {
        Assert.Throws<BcPrepDataException>(() => AxialWallProfile.At(Z, T, 0.8, clampOutside: false));
        Assert.Equal(400.0, AxialWallProfile.At(Z, T, 0.8, clampOutside: true));
        Assert.Equal(380.0, AxialWallProfile.At(Z, T, 0.0, clampOutside: true));
    }

    [Fact]
    public void Grid_within_thermocouples_drops_outer_points()
    {
        var grid = AxialWallProfile.UniformGrid(0.1, 1.1, 11);
        Assert.Equal(1.1, grid[^1]);
        Assert.Equal(5, AxialWallProfile.GridWithin(grid, Z, clampOutside: false).Length);
        Assert.Equal(11, AxialWallProfile.GridWithin(grid, Z, clampOutside: true).Length);
        Assert.Empty(AxialWallProfile.GridWithin(grid, [], clampOutside: true));
    }

    [Fact]
    public void Repeated_positions_are_rejected()
    {
        Assert.Throws<BcPrepDataException>(() => AxialWallProfile.At([0.3, 0.3], T, 0.3, clampOutside: false));
    }
}
