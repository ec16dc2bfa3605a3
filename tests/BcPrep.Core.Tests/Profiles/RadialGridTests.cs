using BcPrep.Profiles;

namespace BcPrep.Tests.Profiles;

public class RadialGridTests
{
    [Fact]
    public void Grid_runs_from_axis_to_wall_and_clusters_toward_the_wall()
    {
        var r = RadialGrid.WallClustered(0.025, 1001);
        Assert.Equal(0.0, r[0]);
        Assert.Equal(0.025, r[^1]);
        for (var i = 1; i < r.Length; i++)
        {
            Assert.True(r[i] > r[i - 1]);
        }

        // Spacing ratio wall/axis → 1/cosh²(δ) for δ = 2 (from dr/dξ of tanh), 1 % tolerance at n = 1001.
        var ratio = (r[^1] - r[^2]) / (r[1] - r[0]);
        Assert.InRange(ratio / (1.0 / Math.Pow(Math.Cosh(2.0), 2)) - 1.0, -0.01, 0.01);
    }

    [Fact]
    public void Zero_stretching_is_uniform()
    {
        var r = RadialGrid.WallClustered(1.0, 5, 0.0);
        Assert.Equal([0.0, 0.25, 0.5, 0.75, 1.0], r.ToArray());
    }

    [Theory]
    [InlineData(1)]
    [InlineData(100_001)]
    public void Point_count_outside_2_to_100000_throws(int n)
    {
        Assert.Throws<BcPrepDataException>(() => RadialGrid.WallClustered(0.025, n));
    }
}
