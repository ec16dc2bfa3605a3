using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

/// <summary>
/// The window mean of a thermocouple moved from the NIST inverse polynomial onto the exact inverse of the ITS-90
/// reference function (NIST Monograph 175). Oracles: the NIST type K table (reference sheet 1.3, [CS], emf printed
/// to 1 µV, so the temperature is known to ±0.5 µV / S ≈ ±0.013 K) and full-precision direct values ([CC], 10 nV,
/// ±3e-4 K). The inverse polynomial alone misses 100 °C by 0.031 K and 1200 °C by 0.022 K (its published band for
/// type K is −0.05 … +0.06 °C), so these checks fail when the correction is left out.
/// </summary>
public class InversePolynomialCorrectionTests
{
    private const double Kelvin = 273.15;

    [Theory]
    [InlineData(4.096, 100.0, 0.013)]   // NIST table K(100 °C) [CS]
    [InlineData(8.138, 200.0, 0.013)]   // [CS]
    [InlineData(12.209, 300.0, 0.013)]  // [CS]
    [InlineData(16.397, 400.0, 0.013)]  // [CS]
    [InlineData(33.275, 800.0, 0.013)]  // [CS]
    [InlineData(48.838, 1200.0, 0.013)] // [CS]
    [InlineData(4.09623, 100.0, 3e-4)]  // K(100) = 4.09623 mV [CC]
    [InlineData(1.000242, 25.0, 3e-4)]  // K(25) = 1.000242 mV [CC]
    [InlineData(41.27561, 1000.0, 3e-4)] // K(1000) = 41.27561 mV [CC]
    public void Corrected_polynomial_mean_reproduces_the_NIST_type_K_table(double emfMv, double tableC, double toleranceK)
    {
        var polynomialK = Its90Thermocouple.TemperatureK(ThermocoupleType.K, emfMv / 1000.0);
        var fix = InversePolynomialCorrection.ForWindow(ThermocoupleType.K, polynomialK, 0.0);
        Assert.Equal(tableC + Kelvin, polynomialK + fix.CorrectionK, toleranceK);
        Assert.Equal(0.0, fix.RemainderHalfWidthK);
    }

    [Fact]
    public void Worked_cold_junction_case_gives_the_exact_root_not_the_polynomial()
    {
        // Reference sheet 1.4 [CC]: E_meas = 3.000 mV with T_cj = 25 °C → polynomial 97.649 °C, exact root 97.681 °C.
        var polynomialK = ColdJunction.HotJunctionTemperatureK(ThermocoupleType.K, 3.000e-3, 25.0 + Kelvin);
        Assert.Equal(97.649 + Kelvin, polynomialK, 0.0005);
        var fix = InversePolynomialCorrection.ForWindow(ThermocoupleType.K, polynomialK, 0.0);
        Assert.Equal(97.681 + Kelvin, polynomialK + fix.CorrectionK, 0.0005);
    }

    [Theory]
    [InlineData(ThermocoupleType.K, 100.0)]
    [InlineData(ThermocoupleType.T, 150.0)]
    [InlineData(ThermocoupleType.J, 700.0)]
    [InlineData(ThermocoupleType.E, -100.0)]
    [InlineData(ThermocoupleType.N, 900.0)]
    public void Window_with_spread_lands_on_the_mean_of_exact_inverses_within_the_stated_remainder(ThermocoupleType type, double centreC)
    {
        // Samples spread ±3 K around the centre: the exact-inverse mean (per sample, ExactNewton) against the
        // corrected polynomial mean; the difference must lie inside the remainder half-width (our bound, ½ h″ (2s)²).
        var rng = new Random(5);
        var emf = Enumerable.Range(0, 2000).Select(_ => Its90Thermocouple.EmfV(type, centreC + Kelvin + (3.0 * ((2.0 * rng.NextDouble()) - 1.0)))).ToArray();
        var polynomial = emf.Select(e => Its90Thermocouple.TemperatureK(type, e)).ToArray();
        var exactMean = emf.Select(e => Its90Thermocouple.TemperatureK(type, e, ThermocoupleInverseMethod.ExactNewton)).Average();
        var mean = polynomial.Average();
        var sd = Math.Sqrt(polynomial.Sum(t => (t - mean) * (t - mean)) / (polynomial.Length - 1));
        var fix = InversePolynomialCorrection.ForWindow(type, mean, sd);
        Assert.True(Math.Abs(mean + fix.CorrectionK - exactMean) <= fix.RemainderHalfWidthK + 1e-9,
            $"{type}: corrected {mean + fix.CorrectionK:R}, exact {exactMean:R}, remainder {fix.RemainderHalfWidthK:R}");
        Assert.True(fix.RemainderHalfWidthK < 1e-3, $"remainder {fix.RemainderHalfWidthK}");
    }
}
