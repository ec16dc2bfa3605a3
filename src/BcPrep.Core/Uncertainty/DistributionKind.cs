namespace BcPrep.Uncertainty;

/// <summary>
/// Shape of the probability distribution assigned to an input quantity (JCGM 101 6.4). It matters only
/// for Monte Carlo propagation and Latin hypercube sampling; the GUM law of propagation uses the standard
/// uncertainty alone. All kinds are symmetric about the estimate and are scaled so that their standard
/// deviation equals the input's standard uncertainty.
/// </summary>
public enum DistributionKind
{
    /// <summary>Gaussian.</summary>
    Normal,

    /// <summary>Uniform on [x − a, x + a], a = √3·u (GUM 4.3.7).</summary>
    Rectangular,

    /// <summary>Symmetric triangular on [x − a, x + a], a = √6·u (GUM 4.3.9).</summary>
    Triangular,

    /// <summary>U-shaped (arcsine) on [x − a, x + a], a = √2·u (GUM H.1.3.4; sinusoidal cycling).</summary>
    ArcSine,
}
