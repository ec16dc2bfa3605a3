using MathNet.Numerics.LinearAlgebra;
using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// A polynomial y = Σ c_k (x − ReferenceRaw)^k fitted by ordinary least squares (Householder QR) to calibration
/// points (x_i, y_i), keeping what the uncertainty stage needs (GUM H.3 pattern): residual standard deviation
/// s = √(SSR/(n − p)), p = degree + 1, and the parameter covariance V = s²(XᵀX)⁻¹.
/// Evaluation, derivative and inverse behave as <see cref="PolynomialCalibration"/>. The valid raw range defaults to
/// the span of the calibration points; a wider range is the caller's explicit decision.
/// </summary>
public sealed record FittedTableCalibration : ISignalCalibration
{
    private readonly double[] _covariance;

    private FittedTableCalibration(PolynomialCalibration curve, double[] covariance, double sumOfSquaredResiduals, int pointCount)
    {
        Curve = curve;
        _covariance = covariance;
        SumOfSquaredResiduals = sumOfSquaredResiduals;
        PointCount = pointCount;
    }

    /// <summary>The fitted polynomial (coefficients in powers of x − ReferenceRaw, and the valid raw range).</summary>
    public PolynomialCalibration Curve { get; }

    public IReadOnlyList<double> Coefficients => Curve.Coefficients;

    public double ReferenceRaw => Curve.ReferenceRaw;

    public CalibrationRange? ValidRawRange => Curve.ValidRawRange;

    public int PointCount { get; }

    public int ParameterCount => Curve.Coefficients.Count;

    /// <summary>ν = n − p, the degrees of freedom of <see cref="ResidualStandardDeviation"/>.</summary>
    public int DegreesOfFreedom => PointCount - ParameterCount;

    public double SumOfSquaredResiduals { get; }

    /// <summary>s = √(SSR/(n − p)) in engineering units.</summary>
    public double ResidualStandardDeviation => Math.Sqrt(SumOfSquaredResiduals / DegreesOfFreedom);

    /// <summary>
    /// Fits a polynomial of <paramref name="degree"/> to the points. Throws <see cref="BcPrepDataException"/> when
    /// the lists differ in length, a value is not finite, degree &lt; 0, or there are not more points than parameters
    /// (n > p) with at least p distinct raw values.
    /// </summary>
    /// <param name="raw">Calibration raw readings x_i.</param>
    /// <param name="engineering">Reference values y_i (SI).</param>
    /// <param name="degree">Polynomial degree (1 = straight line).</param>
    /// <param name="referenceRaw">x0 the powers are taken about; centring near the data improves conditioning and
    /// gives parameters with a physical meaning (GUM H.3 uses t0 = 20 °C).</param>
    /// <param name="validRawRange">Range over which the curve may be used; defaults to [min x_i, max x_i].</param>
    public static FittedTableCalibration Fit(
        IReadOnlyList<double> raw, IReadOnlyList<double> engineering, int degree, double referenceRaw = 0.0, CalibrationRange? validRawRange = null)
    {
        ArgumentNullException.ThrowIfNull(raw);
        ArgumentNullException.ThrowIfNull(engineering);
        int n = raw.Count;
        int p = degree + 1;
        Validate(raw, engineering, degree, n, p);

        var design = Matrix<double>.Build.Dense(n, p, (i, k) => Math.Pow(raw[i] - referenceRaw, k));
        var observed = Vector<double>.Build.Dense(n, i => engineering[i]);
        var qr = design.QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Thin);
        var beta = qr.Solve(observed);
        var residuals = observed - (design * beta);
        double ssr = residuals.DotProduct(residuals);

        // (XᵀX)⁻¹ = R⁻¹R⁻ᵀ with R the p×p triangular factor: avoids forming the ill-conditioned normal matrix.
        var rInverse = qr.R.Inverse();
        var unscaled = rInverse * rInverse.Transpose();
        double variance = ssr / (n - p);
        var covariance = new double[p * p];
        for (int i = 0; i < p; i++)
        {
            for (int j = 0; j < p; j++)
            {
                covariance[(i * p) + j] = variance * unscaled[i, j];
            }
        }

        var range = validRawRange ?? new CalibrationRange(raw.Min(), raw.Max());
        var curve = new PolynomialCalibration(beta.ToArray(), range, referenceRaw);
        return new FittedTableCalibration(curve, covariance, ssr, n);
    }

    public double Apply(double raw) => Curve.Apply(raw);

    public double Derivative(double raw) => Curve.Derivative(raw);

    public double Inverse(double engineering) => Curve.Inverse(engineering);

    /// <summary>Covariance of fitted parameters c_i and c_j (engineering unit² per raw unit^(i+j)).</summary>
    public double Covariance(int i, int j) => _covariance[(CheckIndex(i) * ParameterCount) + CheckIndex(j)];

    /// <summary>u(c_i) = √V_ii.</summary>
    public double ParameterStandardUncertainty(int i) => Math.Sqrt(Covariance(i, i));

    /// <summary>r(c_i, c_j) = V_ij / (u_i u_j).</summary>
    public double ParameterCorrelation(int i, int j) =>
        Covariance(i, j) / (ParameterStandardUncertainty(i) * ParameterStandardUncertainty(j));

    /// <summary>
    /// Standard uncertainty of the calibration curve's value at <paramref name="raw"/> (GUM H.3.5):
    /// u² = gᵀVg with g_k = (x − x0)^k. Excludes the scatter of a new single reading — see
    /// <see cref="PredictionStandardUncertainty"/>. Throws outside the valid raw range; NaN → NaN.
    /// </summary>
    public double CurveStandardUncertainty(double raw)
    {
        ValidRawRange?.Require(raw, "Raw signal");
        double dx = raw - ReferenceRaw;
        int p = ParameterCount;
        double sum = 0.0;
        double gi = 1.0;
        for (int i = 0; i < p; i++)
        {
            double gj = 1.0;
            for (int j = 0; j < p; j++)
            {
                sum += gi * gj * _covariance[(i * p) + j];
                gj *= dx;
            }

            gi *= dx;
        }

        return Math.Sqrt(Math.Max(sum, 0.0));
    }

    /// <summary>
    /// Standard uncertainty of a single new reading converted at <paramref name="raw"/>, assuming it scatters like
    /// the calibration points: √(gᵀVg + s²).
    /// </summary>
    public double PredictionStandardUncertainty(double raw)
    {
        double curve = CurveStandardUncertainty(raw);
        double s = ResidualStandardDeviation;
        return Math.Sqrt((curve * curve) + (s * s));
    }

    private int CheckIndex(int i) => i >= 0 && i < ParameterCount
        ? i
        : throw new ArgumentOutOfRangeException(nameof(i), i, "Parameter index outside 0 … degree.");

    private static void Validate(IReadOnlyList<double> raw, IReadOnlyList<double> engineering, int degree, int n, int p)
    {
        if (raw.Count != engineering.Count)
        {
            throw new BcPrepDataException(Invariant($"Calibration table has {raw.Count} raw values but {engineering.Count} engineering values."));
        }

        if (degree < 0)
        {
            throw new BcPrepDataException(Invariant($"Polynomial degree {degree} must be >= 0."));
        }

        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(raw[i]) || !double.IsFinite(engineering[i]))
            {
                throw new BcPrepDataException(Invariant($"Calibration point {i} ({raw[i]:R}, {engineering[i]:R}) is not finite."));
            }
        }

        int distinct = raw.Distinct().Count();
        if (n <= p || distinct < p)
        {
            throw new BcPrepDataException(Invariant(
                $"A degree-{degree} fit needs more than {p} points with at least {p} distinct raw values (got {n} points, {distinct} distinct) to estimate its residual scatter."));
        }
    }
}
