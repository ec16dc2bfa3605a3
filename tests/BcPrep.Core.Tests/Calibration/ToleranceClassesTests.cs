using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class ToleranceClassesTests
{
    private const double Kelvin = 273.15;

    // IEC 60751 (1995) tolerance table (domain-reference §2): °C and Ω columns, printed to 0.05 °C / 0.01 Ω.
    [Theory]
    [InlineData(RtdToleranceClass.A, -100.0, 0.35, 0.14)]
    [InlineData(RtdToleranceClass.A, 0.0, 0.15, 0.06)]
    [InlineData(RtdToleranceClass.A, 100.0, 0.35, 0.13)]
    [InlineData(RtdToleranceClass.A, 200.0, 0.55, 0.20)]
    [InlineData(RtdToleranceClass.B, -100.0, 0.8, 0.32)]
    [InlineData(RtdToleranceClass.B, 0.0, 0.3, 0.12)]
    [InlineData(RtdToleranceClass.B, 100.0, 0.8, 0.30)]
    [InlineData(RtdToleranceClass.B, 200.0, 1.3, 0.48)]
    public void IEC_60751_tolerance_table(RtdToleranceClass toleranceClass, double tC, double halfWidthC, double halfWidthOhm)
    {
        Assert.Equal(halfWidthC, ToleranceClasses.RtdHalfWidthK(toleranceClass, RtdElementKind.WireWound, tC + Kelvin), 9);
        double ohm = ToleranceClasses.RtdHalfWidthOhm(toleranceClass, RtdElementKind.WireWound, RtdNominal.Pt100, tC + Kelvin);
        Assert.InRange(ohm, halfWidthOhm - 0.005, halfWidthOhm + 0.005);
    }

    [Fact]
    public void IEC_60751_class_AA_and_C_formulas()
    {
        // IEC 60751:2008 AA ±(0.10 + 0.0017|t|), C ±(0.60 + 0.010|t|): at 100 °C 0.27 and 1.60 °C.
        Assert.Equal(0.27, ToleranceClasses.RtdHalfWidthK(RtdToleranceClass.AA, RtdElementKind.WireWound, 100.0 + Kelvin), 9);
        Assert.Equal(1.60, ToleranceClasses.RtdHalfWidthK(RtdToleranceClass.C, RtdElementKind.ThinFilm, 100.0 + Kelvin), 9);
    }

    [Fact]
    public void RTD_class_outside_its_2008_validity_range_throws()
    {
        // The 1995 table lists class B to 850 °C (±4.6 °C); IEC 60751:2008 limits wire-wound class B to 600 °C (from memory).
        Assert.Throws<BcPrepDataException>(() => ToleranceClasses.RtdHalfWidthK(RtdToleranceClass.B, RtdElementKind.WireWound, 850.0 + Kelvin));
        Assert.Throws<BcPrepDataException>(() => ToleranceClasses.RtdHalfWidthK(RtdToleranceClass.AA, RtdElementKind.ThinFilm, -10.0 + Kelvin));
    }

    // IEC 60584-1:2013 (domain-reference §1.5): larger of the fixed and proportional terms.
    [Theory]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class1, 200.0, 1.5)]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class1, 800.0, 3.2)]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class1, -40.0, 1.5)]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class2, 1000.0, 7.5)]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class3, -200.0, 3.0)]
    [InlineData(ThermocoupleType.N, ThermocoupleToleranceClass.Class2, 100.0, 2.5)]
    [InlineData(ThermocoupleType.J, ThermocoupleToleranceClass.Class1, 700.0, 2.8)]
    [InlineData(ThermocoupleType.E, ThermocoupleToleranceClass.Class2, 900.0, 6.75)]
    [InlineData(ThermocoupleType.T, ThermocoupleToleranceClass.Class1, 100.0, 0.5)]
    [InlineData(ThermocoupleType.T, ThermocoupleToleranceClass.Class1, 300.0, 1.2)]
    [InlineData(ThermocoupleType.T, ThermocoupleToleranceClass.Class2, 200.0, 1.5)]
    [InlineData(ThermocoupleType.T, ThermocoupleToleranceClass.Class3, -150.0, 2.25)]
    public void IEC_60584_1_tolerance(ThermocoupleType type, ThermocoupleToleranceClass toleranceClass, double tC, double halfWidthC)
    {
        Assert.Equal(halfWidthC, ToleranceClasses.ThermocoupleHalfWidthK(type, toleranceClass, tC + Kelvin), 9);
    }

    [Theory]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class1, 1100.0)]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class1, -50.0)]
    [InlineData(ThermocoupleType.J, ThermocoupleToleranceClass.Class3, 0.0)]
    [InlineData(ThermocoupleType.T, ThermocoupleToleranceClass.Class2, 360.0)]
    [InlineData(ThermocoupleType.K, ThermocoupleToleranceClass.Class3, 50.0)]
    public void IEC_60584_1_outside_class_range_throws(ThermocoupleType type, ThermocoupleToleranceClass toleranceClass, double tC)
    {
        Assert.Throws<BcPrepDataException>(() => ToleranceClasses.ThermocoupleHalfWidthK(type, toleranceClass, tC + Kelvin));
    }
}
