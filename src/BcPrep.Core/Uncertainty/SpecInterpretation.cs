namespace BcPrep.Uncertainty;

/// <summary>How the "±" figure of an instrument specification is read.</summary>
public enum SpecInterpretation
{
    /// <summary>
    /// The figure is a limit of error with no distribution stated: rectangular, u = a/√3 (GUM 4.3.7, which
    /// recommends the rectangular assumption when only bounds are known). Default.
    /// </summary>
    RectangularLimits,

    /// <summary>The figure is an expanded uncertainty with a stated coverage factor k: u = a/k (GUM 4.3.3).</summary>
    ExpandedUncertainty,
}
