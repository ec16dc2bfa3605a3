using System.Numerics;
using static System.FormattableString;

namespace BcPrep.Calibration;

/// <summary>
/// y = Σ c_k·(x − ReferenceRaw)^k, coefficients ascending (c0 first), evaluated by Horner.
/// <see cref="Inverse"/> is closed-form for degree 1; for higher degree it needs a <see cref="ValidRawRange"/> over
/// which the polynomial is strictly monotonic (checked once, from the real roots of dy/dx) and solves by safeguarded
/// Newton/bisection to 1e-12 of the range width. Otherwise it throws <see cref="BcPrepDataException"/>.
/// </summary>
public sealed record PolynomialCalibration : ISignalCalibration
{
    private readonly double[] _coefficients;

    public PolynomialCalibration(IReadOnlyList<double> coefficients, CalibrationRange? validRawRange = null, double referenceRaw = 0.0)
    {
        ArgumentNullException.ThrowIfNull(coefficients);
        if (coefficients.Count == 0 || coefficients.Any(c => !double.IsFinite(c)) || !double.IsFinite(referenceRaw))
        {
            throw new BcPrepDataException("Polynomial calibration needs at least one coefficient, all finite, and a finite reference raw value.");
        }

        _coefficients = [.. coefficients];
        ValidRawRange = validRawRange;
        ReferenceRaw = referenceRaw;
        IsMonotonicOverRange = validRawRange is { } range && IsStrictlyMonotonic(_coefficients, range.Min - referenceRaw, range.Max - referenceRaw);
    }

    /// <summary>c0 … cn in powers of (x − ReferenceRaw).</summary>
    public IReadOnlyList<double> Coefficients => _coefficients;

    public double ReferenceRaw { get; }

    public CalibrationRange? ValidRawRange { get; }

    /// <summary>True when a range is declared and dy/dx has no zero inside it (so <see cref="Inverse"/> is unique).</summary>
    public bool IsMonotonicOverRange { get; }

    public int Degree => _coefficients.Length - 1;

    public double Apply(double raw)
    {
        ValidRawRange?.Require(raw, "Raw signal");
        return Polynomial.Evaluate(_coefficients, raw - ReferenceRaw);
    }

    public double Derivative(double raw)
    {
        ValidRawRange?.Require(raw, "Raw signal");
        return Polynomial.Derivative(_coefficients, raw - ReferenceRaw);
    }

    public double Inverse(double engineering)
    {
        if (double.IsNaN(engineering))
        {
            return double.NaN;
        }

        if (Degree == 1 && _coefficients[1] != 0.0)
        {
            return LinearInverse(engineering);
        }

        if (ValidRawRange is not { } range || !IsMonotonicOverRange)
        {
            throw new BcPrepDataException(Invariant(
                $"Polynomial calibration of degree {Degree} can be inverted only over a declared raw range where it is strictly monotonic (range {ValidRawRange?.ToString() ?? "none"})."));
        }

        double lo = range.Min - ReferenceRaw;
        double hi = range.Max - ReferenceRaw;
        double yLo = Polynomial.Evaluate(_coefficients, lo);
        double yHi = Polynomial.Evaluate(_coefficients, hi);
        if (!(engineering >= Math.Min(yLo, yHi) && engineering <= Math.Max(yLo, yHi)))
        {
            throw new BcPrepDataException(Invariant(
                $"Engineering value {engineering:R} is outside the calibrated span [{Math.Min(yLo, yHi):R}, {Math.Max(yLo, yHi):R}] (raw range {range}); refusing to extrapolate."));
        }

        double seed = lo + ((engineering - yLo) / (yHi - yLo) * (hi - lo));
        double tolerance = 1e-12 * Math.Max(hi - lo, Math.Abs(hi) + Math.Abs(lo));
        return MonotoneSolver.Solve(new Function(_coefficients), engineering, lo, hi, seed, tolerance) + ReferenceRaw;
    }

    private double LinearInverse(double engineering)
    {
        double raw = ((engineering - _coefficients[0]) / _coefficients[1]) + ReferenceRaw;
        if (ValidRawRange is not { } range)
        {
            return raw;
        }

        raw = range.ClampRounding(raw);
        if (!range.Contains(raw))
        {
            throw new BcPrepDataException(Invariant(
                $"Engineering value {engineering:R} maps to raw {raw:R}, outside the valid raw range {range}; refusing to extrapolate."));
        }

        return raw;
    }

    private static bool IsStrictlyMonotonic(double[] coefficients, double lo, double hi)
    {
        if (coefficients.Length < 2)
        {
            return false;
        }

        var derivative = new double[coefficients.Length - 1];
        for (int k = 1; k < coefficients.Length; k++)
        {
            derivative[k - 1] = k * coefficients[k];
        }

        if (derivative.All(d => d == 0.0))
        {
            return false;
        }

        // Zero slope at an end is acceptable; a real root of dy/dx strictly inside, or a sign change, is not.
        double slopeLo = Polynomial.Evaluate(derivative, lo);
        double slopeHi = Polynomial.Evaluate(derivative, hi);
        if (slopeLo * slopeHi < 0.0)
        {
            return false;
        }

        if (derivative.Length == 1)
        {
            return true;
        }

        var roots = new MathNet.Numerics.Polynomial(derivative).Roots();
        double scale = Math.Max(1.0, Math.Max(Math.Abs(lo), Math.Abs(hi)));
        return !roots.Any(r => Math.Abs(r.Imaginary) <= 1e-9 * scale && r.Real > lo && r.Real < hi && !IsEvenOrderTouch(derivative, r));
    }

    // A double root of dy/dx (slope touches zero without changing sign) still leaves y strictly monotonic.
    private static bool IsEvenOrderTouch(double[] derivative, Complex root)
    {
        double h = 1e-6 * Math.Max(1.0, Math.Abs(root.Real));
        return Polynomial.Evaluate(derivative, root.Real - h) * Polynomial.Evaluate(derivative, root.Real + h) > 0.0;
    }

    private readonly struct Function(double[] coefficients) : IDifferentiableFunction
    {
        public double Value(double x) => Polynomial.Evaluate(coefficients, x);

        public double Slope(double x) => Polynomial.Derivative(coefficients, x);
    }
}
