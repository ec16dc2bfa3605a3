using BcPrep.Calibration;
using BcPrep.Values;
using CsCheck;

namespace BcPrep.Tests.Calibration;

/// <summary>
/// Inverse(Apply(x)) ≈ x over the valid range for the calibrations not covered by CalibrationPropertyTests:
/// least-squares fitted tables. Property
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
}
