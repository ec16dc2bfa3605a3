using BcPrep.Calibration;
using CsCheck;

namespace BcPrep.Tests.Calibration;

/// <summary>Invariant: Inverse(Apply(x)) ≈ x over each calibration's valid range; out-of-range input throws.</summary>
public class CalibrationPropertyTests
{
    private const long Iterations = 2000;

    [Theory]
    [InlineData(ThermocoupleType.K)]
    [InlineData(ThermocoupleType.T)]
    [InlineData(ThermocoupleType.J)]
    [InlineData(ThermocoupleType.E)]
    [InlineData(ThermocoupleType.N)]
    public void Thermocouple_exact_inverse_round_trips(ThermocoupleType type)
    {
        var range = Its90Thermocouple.InverseRangeV(type);
        // 2.5e-12 V: the NIST type K pieces meet at 0 °C with a 1.97e-12 V step (c0 + exponential term of the
        // upper piece at t = 0), so emf inside that step has no exact preimage and returns 0 °C.
        Gen.Double[range.Min, range.Max].Sample(
            emfV => Assert.Equal(emfV, Its90Thermocouple.EmfV(type, Its90Thermocouple.TemperatureK(type, emfV, ThermocoupleInverseMethod.ExactNewton)), 2.5e-12),
            iter: Iterations, threads: 1);
    }

    [Fact]
    public void Rtd_round_trips()
    {
        var range = CallendarVanDusen.ResistanceRangeOhm(RtdNominal.Pt1000);
        Gen.Double[range.Min, range.Max].Sample(
            ohm => Assert.Equal(ohm, CallendarVanDusen.ResistanceOhm(RtdNominal.Pt1000, CallendarVanDusen.TemperatureK(RtdNominal.Pt1000, ohm)), 1e-8),
            iter: Iterations, threads: 1);
    }

    [Fact]
    public void Linear_round_trips()
    {
        var gen = Gen.Select(Gen.Double[-1e3, 1e3].Where(g => Math.Abs(g) > 1e-3), Gen.Double[-1e3, 1e3], Gen.Double[-10.0, 10.0]);
        gen.Sample(
            (gain, offset, x) =>
            {
                var cal = new LinearCalibration(gain, offset, new CalibrationRange(-10.0, 10.0));
                Assert.Equal(x, cal.Inverse(cal.Apply(x)), 1e-9);
                Assert.Equal(10.0, cal.Inverse(cal.Apply(10.0)), 1e-9);
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void Monotonic_cubic_round_trips()
    {
        // y = c0 + c1 x + c2 x² + c3 x³ with c1 > 0, c3 ≥ 0 and c2 = f·√(3 c1 c3), |f| ≤ 0.9: the minimum slope
        // c1(1 − f²) ≥ 0.19 c1 keeps x well conditioned (as |f| → 1 the curve flattens and x is lost in y's rounding).
        var gen = Gen.Select(Gen.Double[-5.0, 5.0], Gen.Double[0.5, 5.0], Gen.Double[0.0, 1.0], Gen.Double[-0.9, 0.9]);
        gen.Sample(
            (c0, c1, c3, frac) =>
            {
                double c2 = frac * Math.Sqrt(3.0 * c1 * c3);
                var cal = new PolynomialCalibration([c0, c1, c2, c3], new CalibrationRange(-3.0, 3.0));
                Assert.True(cal.IsMonotonicOverRange);
                foreach (double x in new[] { -3.0, -1.7, -0.2, 0.0, 0.9, 2.4, 3.0 })
                {
                    Assert.Equal(x, cal.Inverse(cal.Apply(x)), 1e-9);
                }
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void Out_of_range_raw_values_throw()
    {
        var cal = new PolynomialCalibration([0.0, 2.0, 0.1], new CalibrationRange(0.0, 5.0));
        Gen.Double[5.0 + 1e-9, 1e6].Sample(x => Assert.Throws<BcPrepDataException>(() => cal.Apply(x)), iter: 200, threads: 1);
        Gen.Double[-1e6, -1e-9].Sample(x => Assert.Throws<BcPrepDataException>(() => cal.Apply(x)), iter: 200, threads: 1);
    }
}
