using BcPrep.Calibration;
using BcPrep.Values;
using CsCheck;

namespace BcPrep.Tests.Calibration;

/// <summary>
/// Inverse(Apply(x)) ≈ x over the valid range for the calibrations not covered by CalibrationPropertyTests:
/// least-squares fitted tables and tared calibrations (over linear, fitted and thermocouple curves). Property
/// (no external source): a calibration and its inverse must agree wherever the calibration may be used.
/// </summary>
public class FittedAndTaredPropertyTests
{
    private const long Iterations = 300;

    [Fact]
    public void Fitted_straight_line_and_quadratic_tables_round_trip_over_their_point_span()
    {
        // Noisy points of a monotone quadratic y = a + b x + c x² on [0, 10] with b > 0 and |c| small enough that
        // the slope b + 2 c x stays above b/2: the fitted curve is monotone and its inverse well conditioned.
        var gen = Gen.Select(Gen.Double[-100.0, 100.0], Gen.Double[0.5, 50.0], Gen.Double[-1.0, 1.0], Gen.Int[1, 2], Gen.Int[0, int.MaxValue]);
        gen.Sample(
            (a, b, f, degree, seed) =>
            {
                var c = f * b / 40.0;
                var random = new Random(seed);
                var raw = Enumerable.Range(0, 11).Select(i => (double)i).ToArray();
                var values = raw.Select(x => a + (b * x) + (c * x * x) + (0.001 * b * (random.NextDouble() - 0.5))).ToArray();
                var fit = FittedTableCalibration.Fit(raw, values, degree, referenceRaw: 5.0);
                foreach (var x in new[] { 0.0, 0.37, 2.5, 5.0, 7.77, 9.99, 10.0 })
                {
                    Assert.Equal(x, fit.Inverse(fit.Apply(x)), 1e-9);
                }
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void Tared_linear_calibration_round_trips_and_reads_zero_at_the_tare()
    {
        var gen = Gen.Select(Gen.Double[0.1, 1000.0], Gen.Double[-100.0, 100.0], Gen.Double[-1.0, 1.0], Gen.Double[-10.0, 10.0]);
        gen.Sample(
            (gain, offset, zeroRaw, x) =>
            {
                var inner = new LinearCalibration(gain, offset, new CalibrationRange(-10.0, 10.0));
                var tared = TaredCalibration.FromZeroReading(inner, new MeasuredValue(zeroRaw, 1e-4, 50));
                Assert.Equal(x, tared.Inverse(tared.Apply(x)), 1e-9);
                Assert.Equal(0.0, tared.Apply(zeroRaw), 1e-9 * Math.Max(1.0, Math.Abs(offset)));
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void Tared_thermocouple_round_trips_over_the_ITS90_range()
    {
        // Type K, NIST ITS-90 reference function (Monograph 175); the tare shifts the output, not the valid emf range.
        var inner = new ThermocoupleCalibration(ThermocoupleType.K, ThermocoupleInverseMethod.ExactNewton);
        var range = Its90Thermocouple.InverseRangeV(ThermocoupleType.K);
        var gen = Gen.Select(Gen.Double[range.Min, range.Max], Gen.Double[-0.001, 0.001]);
        gen.Sample(
            (emfV, zeroEmfV) =>
            {
                var tared = TaredCalibration.FromZeroReading(inner, new MeasuredValue(zeroEmfV, 1e-6, 30));
                Assert.Equal(emfV, tared.Inverse(tared.Apply(emfV)), 2.5e-12);
            },
            iter: Iterations,
            threads: 1);
    }
}
