namespace BcPrep.Uncertainty;

/// <summary>How a standard uncertainty was obtained (GUM 4.2 Type A, 4.3 Type B).</summary>
public enum EvaluationType
{
    /// <summary>Statistical analysis of a series of observations (GUM 4.2).</summary>
    TypeA,

    /// <summary>Any other means: certificates, specifications, bounds, experience (GUM 4.3).</summary>
    TypeB,
}
