namespace BcPrep.Physics;

/// <summary>Pressure tapping arrangement of an ISO 5167-2 orifice plate.</summary>
public enum OrificeTapping
{
    /// <summary>Corner tappings: L1 = L2′ = 0.</summary>
    Corner,

    /// <summary>D and D/2 tappings: L1 = 1, L2′ = 0.47.</summary>
    DAndDOver2,

    /// <summary>Flange tappings: L1 = L2′ = 25.4 mm / D.</summary>
    Flange,
}
