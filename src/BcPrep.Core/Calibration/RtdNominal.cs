using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// R0 (Ω) of a platinum RTD at 0 °C and its Callendar–Van Dusen coefficients: the IEC 60751 nominal A, B, C
/// (e.g. <see cref="Pt100"/>, <see cref="Pt1000"/>), or a calibrated sensor's own from its certificate.
/// </summary>
public readonly record struct RtdNominal
{
    /// <summary>Creates a nominal R0 (Ω) with the IEC 60751 coefficients; throws <see cref="BcPrepDataException"/> unless finite and positive.</summary>
    public RtdNominal(double r0Ohm)
        : this(r0Ohm, CallendarVanDusen.A, CallendarVanDusen.B, CallendarVanDusen.C)
    {
    }

    /// <summary>
    /// A calibrated sensor: its own R0 (Ω), A (°C⁻¹), B (°C⁻²) and C (°C⁻⁴, used below 0 °C). Throws
    /// <see cref="BcPrepDataException"/> unless R0 &gt; 0, and A and B keep R(t) rising over −200 … 850 °C.
    /// </summary>
    public RtdNominal(double r0Ohm, double a, double b, double c)
    {
        if (!double.IsFinite(r0Ohm) || r0Ohm <= 0.0)
        {
            throw new BcPrepDataException(Invariant($"RTD nominal resistance R0 = {r0Ohm:R} ohm must be finite and positive."));
        }

        // dR/dt = R0(A + 2Bt) above 0 °C must stay positive up to 850 °C; below 0 °C C is a small correction.
        if (!double.IsFinite(a) || !double.IsFinite(b) || !double.IsFinite(c) || !(a > 0.0) || !(a + (2.0 * b * 850.0) > 0.0) || !(a - (2.0 * b * 200.0) > 0.0))
        {
            throw new BcPrepDataException(Invariant($"RTD coefficients A = {a:R}, B = {b:R}, C = {c:R} do not give a resistance that rises with temperature over -200 ... 850 degC."));
        }

        R0Ohm = r0Ohm;
        A = a;
        B = b;
        C = c;
    }

    /// <summary>Callendar–Van Dusen A (°C⁻¹).</summary>
    public double A { get; }

    /// <summary>Callendar–Van Dusen B (°C⁻²).</summary>
    public double B { get; }

    /// <summary>Callendar–Van Dusen C (°C⁻⁴), below 0 °C only.</summary>
    public double C { get; }

    /// <summary>True when A, B and C are the IEC 60751 nominal values (an uncalibrated sensor, judged by its class).</summary>
    public bool IsIecNominal => A == CallendarVanDusen.A && B == CallendarVanDusen.B && C == CallendarVanDusen.C;

    public static RtdNominal Pt100 { get; } = new(100.0);

    public static RtdNominal Pt1000 { get; } = new(1000.0);

    public double R0Ohm { get; }
}
