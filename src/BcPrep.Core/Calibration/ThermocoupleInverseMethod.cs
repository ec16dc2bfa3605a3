namespace BcPrep.Calibration;

/// <summary>How emf is converted to temperature.</summary>
public enum ThermocoupleInverseMethod
{
    /// <summary>
    /// The NIST ITS-90 inverse polynomial t(E) (the default: it is what the standard publishes). It departs from the
    /// direct function by up to its published error band (e.g. −0.05 … +0.06 °C for type K).
    /// </summary>
    NistPolynomial,

    /// <summary>
    /// The exact inverse of the direct function E(t), found by safeguarded Newton iteration seeded by the NIST inverse
    /// polynomial (to 1e-9 °C). Use where the inverse polynomial's error band matters. The NIST type K pieces meet
    /// at 0 °C with a 1.97e-12 V step; emf inside that step returns 0 °C.
    /// </summary>
    ExactNewton,
}
