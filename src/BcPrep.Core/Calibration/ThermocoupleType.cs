namespace BcPrep.Calibration;

/// <summary>Letter-designated base-metal thermocouple types covered by the NIST ITS-90 reference functions.</summary>
public enum ThermocoupleType
{
    /// <summary>Ni-Cr / Ni-Al.</summary>
    K,

    /// <summary>Cu / Cu-Ni.</summary>
    T,

    /// <summary>Fe / Cu-Ni.</summary>
    J,

    /// <summary>Ni-Cr / Cu-Ni.</summary>
    E,

    /// <summary>Nicrosil / Nisil.</summary>
    N,
}
