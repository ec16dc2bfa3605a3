using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// Tolerance half-widths (K) of uncalibrated sensors, for Type B evaluation (the uncertainty stage decides the
/// distribution, commonly rectangular: u = a/√3). Temperatures in K; the half-width is a temperature difference.
/// A temperature outside the range a class is defined for throws <see cref="BcPrepDataException"/>; NaN → NaN.
/// </summary>
public static class ToleranceClasses
{
    /// <summary>
    /// IEC 60584-1:2013 tolerance: the larger of a fixed term and a fraction of |t| (t in °C).
    /// K, N: class 1 1.5 °C / 0.004|t| (−40 … 1000 °C); class 2 2.5 °C / 0.0075|t| (−40 … 1200 °C);
    /// class 3 2.5 °C / 0.015|t| (−200 … 40 °C).
    /// J: class 1 1.5 / 0.004|t| (−40 … 750); class 2 2.5 / 0.0075|t| (−40 … 750); no class 3.
    /// E: class 1 1.5 / 0.004|t| (−40 … 800); class 2 2.5 / 0.0075|t| (−40 … 900); class 3 2.5 / 0.015|t|
    /// (−200 … 40, from memory).
    /// T: class 1 0.5 / 0.004|t| (−40 … 350); class 2 1.0 / 0.0075|t| (−40 … 350); class 3 1.0 / 0.015|t| (−200 … 40).
    /// </summary>
    public static double ThermocoupleHalfWidthK(ThermocoupleType type, ThermocoupleToleranceClass toleranceClass, double temperatureK)
    {
        var spec = ThermocoupleSpec(type, toleranceClass);
        return HalfWidth(spec, temperatureK, Invariant($"Type {type} thermocouple {toleranceClass} temperature (K)"));
    }

    /// <summary>
    /// IEC 60751 tolerance ±(a + b|t|): AA 0.10 + 0.0017|t|, A 0.15 + 0.002|t|, B 0.30 + 0.005|t|, C 0.60 + 0.010|t|.
    /// Validity ranges of IEC 60751:2008 (from memory, partly confirmed): wire-wound AA −50 … 250, A −100 … 450,
    /// B and C −196 … 600 °C; thin-film AA 0 … 150, A −30 … 300, B −50 … 500, C −50 … 600 °C.
    /// </summary>
    public static double RtdHalfWidthK(RtdToleranceClass toleranceClass, RtdElementKind element, double temperatureK)
    {
        var spec = RtdSpec(toleranceClass, element);
        return HalfWidth(spec, temperatureK, Invariant($"RTD class {toleranceClass} ({element}) temperature (K)"));
    }

    /// <summary>The RTD tolerance expressed in resistance (Ω): half-width (K) × dR/dT of the CVD equation.</summary>
    public static double RtdHalfWidthOhm(RtdToleranceClass toleranceClass, RtdElementKind element, RtdNominal nominal, double temperatureK) =>
        RtdHalfWidthK(toleranceClass, element, temperatureK) * CallendarVanDusen.SlopeOhmPerK(nominal, temperatureK);

    private static double HalfWidth(ToleranceSpec spec, double temperatureK, string quantity)
    {
        double t = temperatureK - Its90Thermocouple.KelvinOffset;
        var rangeK = new CalibrationRange(spec.MinC + Its90Thermocouple.KelvinOffset, spec.MaxC + Its90Thermocouple.KelvinOffset);
        if (!(t >= spec.MinC - 1e-9 && t <= spec.MaxC + 1e-9) && !double.IsNaN(t))
        {
            throw rangeK.OutOfRange(temperatureK, quantity);
        }

        double absT = Math.Abs(t);
        return spec.IsSum
            ? spec.FixedC + (spec.Fraction * absT)
            : Math.Max(spec.FixedC, spec.Fraction * absT);
    }

    private static ToleranceSpec ThermocoupleSpec(ThermocoupleType type, ThermocoupleToleranceClass toleranceClass) =>
        (type, toleranceClass) switch
        {
            (ThermocoupleType.K or ThermocoupleType.N, ThermocoupleToleranceClass.Class1) => Larger(1.5, 0.004, -40, 1000),
            (ThermocoupleType.K or ThermocoupleType.N, ThermocoupleToleranceClass.Class2) => Larger(2.5, 0.0075, -40, 1200),
            (ThermocoupleType.K or ThermocoupleType.N, ThermocoupleToleranceClass.Class3) => Larger(2.5, 0.015, -200, 40),
            (ThermocoupleType.J, ThermocoupleToleranceClass.Class1) => Larger(1.5, 0.004, -40, 750),
            (ThermocoupleType.J, ThermocoupleToleranceClass.Class2) => Larger(2.5, 0.0075, -40, 750),
            (ThermocoupleType.E, ThermocoupleToleranceClass.Class1) => Larger(1.5, 0.004, -40, 800),
            (ThermocoupleType.E, ThermocoupleToleranceClass.Class2) => Larger(2.5, 0.0075, -40, 900),
            (ThermocoupleType.E, ThermocoupleToleranceClass.Class3) => Larger(2.5, 0.015, -200, 40),
            (ThermocoupleType.T, ThermocoupleToleranceClass.Class1) => Larger(0.5, 0.004, -40, 350),
            (ThermocoupleType.T, ThermocoupleToleranceClass.Class2) => Larger(1.0, 0.0075, -40, 350),
            (ThermocoupleType.T, ThermocoupleToleranceClass.Class3) => Larger(1.0, 0.015, -200, 40),
            _ => throw new BcPrepDataException(Invariant($"IEC 60584-1 defines no tolerance {toleranceClass} for type {type} thermocouples.")),
        };

    private static ToleranceSpec RtdSpec(RtdToleranceClass toleranceClass, RtdElementKind element) =>
        (toleranceClass, element) switch
        {
            (RtdToleranceClass.AA, RtdElementKind.WireWound) => Sum(0.10, 0.0017, -50, 250),
            (RtdToleranceClass.AA, RtdElementKind.ThinFilm) => Sum(0.10, 0.0017, 0, 150),
            (RtdToleranceClass.A, RtdElementKind.WireWound) => Sum(0.15, 0.002, -100, 450),
            (RtdToleranceClass.A, RtdElementKind.ThinFilm) => Sum(0.15, 0.002, -30, 300),
            (RtdToleranceClass.B, RtdElementKind.WireWound) => Sum(0.30, 0.005, -196, 600),
            (RtdToleranceClass.B, RtdElementKind.ThinFilm) => Sum(0.30, 0.005, -50, 500),
            (RtdToleranceClass.C, RtdElementKind.WireWound) => Sum(0.60, 0.010, -196, 600),
            (RtdToleranceClass.C, RtdElementKind.ThinFilm) => Sum(0.60, 0.010, -50, 600),
            _ => throw new BcPrepDataException(Invariant($"Unknown RTD tolerance class {toleranceClass} / element {element}.")),
        };

    private static ToleranceSpec Larger(double fixedC, double fraction, double minC, double maxC) => new(fixedC, fraction, minC, maxC, IsSum: false);

    private static ToleranceSpec Sum(double fixedC, double fraction, double minC, double maxC) => new(fixedC, fraction, minC, maxC, IsSum: true);

    private readonly record struct ToleranceSpec(double FixedC, double Fraction, double MinC, double MaxC, bool IsSum);
}
