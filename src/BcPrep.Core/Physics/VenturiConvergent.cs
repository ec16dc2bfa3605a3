namespace BcPrep.Physics;

/// <summary>The three convergent-section forms of the ISO 5167-4 classical Venturi tube.</summary>
public enum VenturiConvergent
{
    /// <summary>Machined convergent: C = 0.995, 1 % (95 %), 50–250 mm, β 0.4–0.75, Re_D 2·10⁵–1·10⁶.</summary>
    Machined,

    /// <summary>"As cast" convergent: C = 0.984, 0.7 % (95 %), 100–800 mm, β 0.3–0.75, Re_D 2·10⁵–2·10⁶.</summary>
    AsCast,

    /// <summary>Rough-welded sheet-iron convergent: C = 0.985, 1.5 % (95 %), 200–1200 mm, β 0.4–0.7, Re_D 2·10⁵–2·10⁶.</summary>
    RoughWelded,
}

/// <summary>
/// What ISO 5167-4 states for one convergent form: C, its 95 % relative uncertainty, and the pipe diameter, β and
/// Re_D over which that statement holds. Values from the reference sheet §11, marked there as from memory of
/// ISO 5167-4:2003: verify against the standard before relying on them.
/// </summary>
public sealed record VenturiForm(
    VenturiConvergent Convergent,
    string Name,
    double DischargeCoefficient,
    double ExpandedUncertaintyPercent,
    double MinPipeDiameterM,
    double MaxPipeDiameterM,
    double MinBeta,
    double MaxBeta,
    double MinReynolds,
    double MaxReynolds)
{
    public static VenturiForm Of(VenturiConvergent convergent) => convergent switch
    {
        VenturiConvergent.AsCast => new(convergent, "as-cast convergent", 0.984, 0.7, 0.100, 0.800, 0.3, 0.75, 2.0e5, 2.0e6),
        VenturiConvergent.RoughWelded => new(convergent, "rough-welded sheet-iron convergent", 0.985, 1.5, 0.200, 1.200, 0.4, 0.7, 2.0e5, 2.0e6),
        _ => new(VenturiConvergent.Machined, "machined convergent", 0.995, 1.0, 0.050, 0.250, 0.4, 0.75, 2.0e5, 1.0e6),
    };
}
