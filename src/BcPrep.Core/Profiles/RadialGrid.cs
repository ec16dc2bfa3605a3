using System.Collections.Immutable;
using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>Radial grids from the axis to the wall of a round pipe.</summary>
public static class RadialGrid
{
    /// <summary>Largest number of points accepted (guards against configuration typos).</summary>
    public const int MaxPointCount = 100_000;

    /// <summary>Default tanh stretching δ = 2: the wall cell is about 1/cosh²δ = 0.071 times the axis cell.</summary>
    public const double DefaultStretching = 2.0;

    /// <summary>
    /// n points r_i = R tanh(δ ξ_i)/tanh(δ), ξ_i = i/(n − 1): r_0 = 0, r_{n−1} = R, spacing shrinking toward the
    /// wall; the wall-to-axis spacing ratio tends to 1/cosh²δ for large n. δ = 0 gives a uniform grid.
    /// n in [2, 100 000], δ in [0, 5], R &gt; 0; otherwise <see cref="BcPrepDataException"/>.
    /// </summary>
    public static ImmutableArray<double> WallClustered(double radiusM, int pointCount, double stretching = DefaultStretching)
    {
        Require.Positive(radiusM, "pipe radius", "m");
        Require.InRange(pointCount, 2, MaxPointCount, "radial point count", "", "the radial grid");
        Require.InRange(stretching, 0.0, 5.0, "tanh stretching", "", "the radial grid");
        var r = ImmutableArray.CreateBuilder<double>(pointCount);
        for (var i = 0; i < pointCount; i++)
        {
            var xi = (double)i / (pointCount - 1);
            r.Add(stretching == 0.0 ? radiusM * xi : radiusM * Math.Tanh(stretching * xi) / Math.Tanh(stretching));
        }

        r[pointCount - 1] = radiusM;
        return r.MoveToImmutable();
    }
}
