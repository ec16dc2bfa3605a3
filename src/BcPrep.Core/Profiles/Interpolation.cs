using System.Collections.Immutable;

namespace BcPrep.Profiles;

/// <summary>Piecewise-linear interpolation and trapezoid quadrature on sorted abscissae.</summary>
internal static class Interpolation
{
    /// <summary>Linear interpolation; x must lie within [xs[0], xs[^1]] (caller checks).</summary>
    public static double Linear(ImmutableArray<double> xs, ImmutableArray<double> ys, double x)
    {
        var i = xs.BinarySearch(x);
        if (i >= 0)
        {
            return ys[i];
        }

        var upper = ~i;
        var lower = upper - 1;
        var w = (x - xs[lower]) / (xs[upper] - xs[lower]);
        return ys[lower] + (w * (ys[upper] - ys[lower]));
    }

    /// <summary>∫ f 2π r dr by the trapezoid rule on the grid (f given at the grid radii).</summary>
    public static double AreaIntegral(ImmutableArray<double> radiusM, Func<int, double> valueAt)
    {
        var sum = 0.0;
        for (var i = 1; i < radiusM.Length; i++)
        {
            var left = valueAt(i - 1) * radiusM[i - 1];
            var right = valueAt(i) * radiusM[i];
            sum += 0.5 * (left + right) * (radiusM[i] - radiusM[i - 1]);
        }

        return 2.0 * Math.PI * sum;
    }
}
