using BcPrep.Calibration;
using BcPrep.Values;

namespace BcPrep.Tests.Calibration;

public class SignalCalibrationTests
{
    [Fact]
    public void Linear_4_to_20_mA_transmitter()
    {
        // 4–20 mA over 0–2500 Pa (common practice): gain 156 250 Pa/A, offset −625 Pa.
        var cal = new LinearCalibration(2500.0 / 0.016, -625.0, new CalibrationRange(0.0035, 0.0205));
        Assert.Equal(0.0, cal.Apply(0.004), 9);
        Assert.Equal(2500.0, cal.Apply(0.020), 9);
        Assert.Equal(156250.0, cal.Derivative(0.012), 9);
        Assert.Equal(0.012, cal.Inverse(1250.0), 12);
        Assert.Throws<BcPrepDataException>(() => cal.Apply(0.0));
        Assert.Throws<BcPrepDataException>(() => cal.Inverse(5000.0));
        Assert.Throws<BcPrepDataException>(() => new LinearCalibration(0.0, 1.0));
        Assert.True(double.IsNaN(cal.Apply(double.NaN)));
    }

    [Fact]
    public void Polynomial_evaluates_ascending_coefficients_and_inverts()
    {
        // y = 2 − x + 3x² on [1, 4] (monotonic there); y(2) = 12, dy/dx(2) = 11.
        var cal = new PolynomialCalibration([2.0, -1.0, 3.0], new CalibrationRange(1.0, 4.0));
        Assert.Equal(12.0, cal.Apply(2.0), 12);
        Assert.Equal(11.0, cal.Derivative(2.0), 12);
        Assert.True(cal.IsMonotonicOverRange);
        Assert.Equal(2.0, cal.Inverse(12.0), 12);
        var ex = Assert.Throws<BcPrepDataException>(() => cal.Inverse(100.0));
        Assert.Contains("100", ex.Message, StringComparison.Ordinal);
        Assert.Throws<BcPrepDataException>(() => cal.Apply(4.5));
    }

    [Fact]
    public void Polynomial_inverse_refuses_non_monotonic_range_or_missing_range()
    {
        // y = x² on [−1, 2] has its minimum inside the range: two raw values give y = 0.25.
        var folded = new PolynomialCalibration([0.0, 0.0, 1.0], new CalibrationRange(-1.0, 2.0));
        Assert.False(folded.IsMonotonicOverRange);
        Assert.Throws<BcPrepDataException>(() => folded.Inverse(0.25));

        var unbounded = new PolynomialCalibration([0.0, 1.0, 1.0]);
        Assert.Throws<BcPrepDataException>(() => unbounded.Inverse(2.0));

        // y = x³ has a double root of dy/dx at 0 but stays strictly increasing.
        var cubic = new PolynomialCalibration([0.0, 0.0, 0.0, 1.0], new CalibrationRange(-2.0, 2.0));
        Assert.True(cubic.IsMonotonicOverRange);
        Assert.Equal(-1.5, cubic.Inverse(-3.375), 10);
    }

    [Fact]
    public void Thermocouple_and_RTD_reference_functions_at_100_C()
    {
        // NIST type K: 4.09623 mV ↔ 100 °C, inverse polynomial within its −0.05 … +0.04 °C band;
        // IEC 60751 Pt100: 138.5055 Ω ↔ 100 °C.
        Assert.InRange(Its90Thermocouple.TemperatureK(ThermocoupleType.K, 4.09623e-3, ThermocoupleInverseMethod.NistPolynomial), 373.15 - 0.05, 373.15 + 0.04);
        Assert.Equal(373.15, Its90Thermocouple.TemperatureK(ThermocoupleType.K, 4.09623e-3, ThermocoupleInverseMethod.ExactNewton), 4);
        Assert.Equal(1.0 / 0.04137e-3, 1.0 / Its90Thermocouple.SeebeckVPerK(ThermocoupleType.K, 373.15), 3.0);
        Assert.Equal(373.15, CallendarVanDusen.TemperatureK(RtdNominal.Pt100, 138.5055), 3);
        Assert.Equal(138.5055, CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, 373.15), 4);
    }
}
