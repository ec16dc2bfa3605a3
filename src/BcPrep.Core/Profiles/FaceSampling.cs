using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>A point in 3-D space, m.</summary>
public readonly record struct Point3(double X, double Y, double Z);

/// <summary>Maps an axisymmetric radial profile onto the points of an inlet face.</summary>
public static class FaceSampling
{
    /// <summary>
    /// Value of <paramref name="profile"/> at each point, with the point's radius taken as its distance from the
    /// axis through <paramref name="centreM"/> along <paramref name="axis"/> (normalised here; must be non-zero).
    /// Points farther than R (relative excess above 1e-9) throw <see cref="BcPrepDataException"/>.
    /// </summary>
    public static ImmutableArray<double> Sample(RadialProfile profile, Point3 centreM, Point3 axis, IReadOnlyList<Point3> pointsM)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(pointsM);
        var length = Math.Sqrt((axis.X * axis.X) + (axis.Y * axis.Y) + (axis.Z * axis.Z));
        Require.Positive(length, "axis vector length", "");
        var (ax, ay, az) = (axis.X / length, axis.Y / length, axis.Z / length);
        var result = ImmutableArray.CreateBuilder<double>(pointsM.Count);
        for (var i = 0; i < pointsM.Count; i++)
        {
            var p = pointsM[i];
            double dx = p.X - centreM.X, dy = p.Y - centreM.Y, dz = p.Z - centreM.Z;
            var along = (dx * ax) + (dy * ay) + (dz * az);
            var (px, py, pz) = (dx - (along * ax), dy - (along * ay), dz - (along * az));
            var r = Math.Sqrt((px * px) + (py * py) + (pz * pz));
            if (!double.IsFinite(r) || r > profile.OuterRadiusM * (1.0 + 1e-9))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Face point {i} ({p.X:R}, {p.Y:R}, {p.Z:R}) m is {r:R} m from the axis, outside the pipe radius {profile.OuterRadiusM:R} m."));
            }

            result.Add(profile.ValueAt(r));
        }

        return result.MoveToImmutable();
    }
}
