using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>Nominal resistance R0 (Ω) of a platinum RTD at 0 °C, e.g. <see cref="Pt100"/>, <see cref="Pt1000"/>.</summary>
public readonly record struct RtdNominal
{
    /// <summary>Creates a nominal R0 (Ω); throws <see cref="BcPrepDataException"/> unless finite and positive.</summary>
    public RtdNominal(double r0Ohm)
    {
        if (!double.IsFinite(r0Ohm) || r0Ohm <= 0.0)
        {
            throw new BcPrepDataException(Invariant($"RTD nominal resistance R0 = {r0Ohm:R} ohm must be finite and positive."));
        }

        R0Ohm = r0Ohm;
    }

    public static RtdNominal Pt100 { get; } = new(100.0);

    public static RtdNominal Pt1000 { get; } = new(1000.0);

    public double R0Ohm { get; }
}
