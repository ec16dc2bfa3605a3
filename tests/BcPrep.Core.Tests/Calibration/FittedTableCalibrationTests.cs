using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class FittedTableCalibrationTests
{
    // JCGM 100:2008 (GUM) H.3, Table H.6: thermometer readings t_k (°C) and corrections b_k (°C); fit b = y1 + y2 (t − 20 °C).
    private static readonly double[] ThermometerC =
        [21.521, 22.012, 22.512, 23.003, 23.507, 23.999, 24.513, 25.002, 25.503, 26.010, 26.511];

    private static readonly double[] CorrectionC =
        [-0.171, -0.169, -0.166, -0.159, -0.164, -0.165, -0.156, -0.157, -0.159, -0.161, -0.160];

    private static FittedTableCalibration GumH3() =>
        FittedTableCalibration.Fit(ThermometerC, CorrectionC, degree: 1, referenceRaw: 20.0, validRawRange: new CalibrationRange(20.0, 30.0));

    [Fact]
    public void GUM_H3_parameters_to_published_digits()
    {
        // GUM H.3 (via the GTC GUM_H3 example): y1 = −0.1712(29) °C, y2 = 0.00218(67), r = −0.930, s = 0.0035 °C, ν = 9.
        var fit = GumH3();
        Assert.Equal(-0.1712, fit.Coefficients[0], 4);
        Assert.Equal(0.0029, fit.ParameterStandardUncertainty(0), 4);
        Assert.Equal(0.00218, fit.Coefficients[1], 5);
        Assert.Equal(0.00067, fit.ParameterStandardUncertainty(1), 5);
        Assert.Equal(-0.930, fit.ParameterCorrelation(0, 1), 3);
        Assert.Equal(0.0035, fit.ResidualStandardDeviation, 4);
        Assert.Equal(9, fit.DegreesOfFreedom);
        Assert.Equal(0.000110096583109, fit.SumOfSquaredResiduals, 12);
    }

    [Fact]
    public void GUM_H3_parameters_full_precision()
    {
        // Full-precision values recomputed from the GUM H.3 data (domain-reference §3.2(b) [CC]), to 5e-8.
        var fit = GumH3();
        Assert.Equal(-0.17120379, fit.Coefficients[0], 7);
        Assert.Equal(0.00218270, fit.Coefficients[1], 7);
        Assert.Equal(0.0034976, fit.ResidualStandardDeviation, 7);
        Assert.Equal(0.0028776, fit.ParameterStandardUncertainty(0), 7);
        Assert.Equal(0.00066794, fit.ParameterStandardUncertainty(1), 8);
        Assert.Equal(-0.93043, fit.ParameterCorrelation(0, 1), 5);
    }

    [Fact]
    public void GUM_H3_predicted_correction_at_30_C()
    {
        // GUM H.3.5: b(30 °C) = −0.1494(41) °C; full precision −0.1493768, u = 0.0041386 (domain-reference [CC]).
        var fit = GumH3();
        Assert.Equal(-0.1494, fit.Apply(30.0), 4);
        Assert.Equal(0.0041, fit.CurveStandardUncertainty(30.0), 4);
        Assert.Equal(-0.1493768, fit.Apply(30.0), 7);
        Assert.Equal(0.0041386, fit.CurveStandardUncertainty(30.0), 7);

        // A single new reading adds the residual scatter in quadrature (common practice).
        Assert.Equal(Math.Sqrt((0.0041386 * 0.0041386) + (0.0034976 * 0.0034976)), fit.PredictionStandardUncertainty(30.0), 6);
        Assert.Equal(0.00218270, fit.Derivative(25.0), 7);
    }

    [Fact]
    public void Default_valid_range_is_the_span_of_the_calibration_points()
    {
        var fit = FittedTableCalibration.Fit(ThermometerC, CorrectionC, degree: 1, referenceRaw: 20.0);
        Assert.Equal(new CalibrationRange(21.521, 26.511), fit.ValidRawRange);
        var ex = Assert.Throws<BcPrepDataException>(() => fit.Apply(30.0));
        Assert.Contains("30", ex.Message, StringComparison.Ordinal);
        Assert.Contains("21.521", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Exact_quadratic_is_recovered_with_zero_residual()
    {
        // y = 1 + 2x + 0.5x², exact data: coefficients reproduced, s = 0 (algebraic check).
        double[] x = [0, 1, 2, 3, 4, 5];
        double[] y = [.. x.Select(v => 1 + (2 * v) + (0.5 * v * v))];
        var fit = FittedTableCalibration.Fit(x, y, degree: 2);
        Assert.Equal(1.0, fit.Coefficients[0], 10);
        Assert.Equal(2.0, fit.Coefficients[1], 10);
        Assert.Equal(0.5, fit.Coefficients[2], 10);
        Assert.Equal(0.0, fit.ResidualStandardDeviation, 10);
        Assert.Equal(3.0, fit.Inverse(1 + (2 * 3.0) + (0.5 * 9.0)), 10);
    }

    [Fact]
    public void Too_few_points_or_mismatched_lists_throw()
    {
        Assert.Throws<BcPrepDataException>(() => FittedTableCalibration.Fit([1.0, 2.0], [1.0, 2.0], degree: 1));
        Assert.Throws<BcPrepDataException>(() => FittedTableCalibration.Fit([1.0, 1.0, 1.0], [1.0, 2.0, 3.0], degree: 1));
        Assert.Throws<BcPrepDataException>(() => FittedTableCalibration.Fit([1.0, 2.0, 3.0], [1.0, 2.0], degree: 1));
        Assert.Throws<BcPrepDataException>(() => FittedTableCalibration.Fit([1.0, 2.0, double.NaN], [1.0, 2.0, 3.0], degree: 1));
    }
}
