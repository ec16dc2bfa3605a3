using MathNet.Numerics.Distributions;

namespace BcPrep.Uncertainty;

/// <summary>
/// Zero-mean, unit-variance versions of the <see cref="DistributionKind"/> shapes: random draws for Monte Carlo
/// and inverse CDFs for stratified sampling. A value z becomes an input value as x + u·z.
/// </summary>
internal static class StandardizedDistributions
{
    private static readonly double RectangularHalfWidth = Math.Sqrt(3.0);
    private static readonly double TriangularHalfWidth = Math.Sqrt(6.0);
    private static readonly double ArcSineHalfWidth = Math.Sqrt(2.0);

    /// <summary>Inverse CDF at probability p ∈ (0, 1).</summary>
    public static double InverseCdf(DistributionKind kind, double p) => kind switch
    {
        DistributionKind.Normal => Normal.InvCDF(0.0, 1.0, p),
        DistributionKind.Rectangular => RectangularHalfWidth * (2.0 * p - 1.0),
        DistributionKind.Triangular => p < 0.5
            ? TriangularHalfWidth * (Math.Sqrt(2.0 * p) - 1.0)
            : TriangularHalfWidth * (1.0 - Math.Sqrt(2.0 * (1.0 - p))),
        DistributionKind.ArcSine => ArcSineHalfWidth * Math.Sin(Math.PI * (p - 0.5)),
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown distribution kind."),
    };

    /// <summary>One draw of a non-normal shape (normal draws come from <see cref="GaussianSource"/>).</summary>
    public static double Draw(DistributionKind kind, Random random) => kind switch
    {
        DistributionKind.Rectangular => RectangularHalfWidth * (2.0 * random.NextDouble() - 1.0),
        // The sum of two independent uniforms on [0, 1) is triangular on [0, 2).
        DistributionKind.Triangular => TriangularHalfWidth * (random.NextDouble() + random.NextDouble() - 1.0),
        DistributionKind.ArcSine => ArcSineHalfWidth * Math.Sin(Math.PI * (random.NextDouble() - 0.5)),
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "This distribution kind is not drawn here."),
    };
}
