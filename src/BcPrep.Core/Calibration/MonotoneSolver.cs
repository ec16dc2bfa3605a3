namespace BcPrep.Calibration;

/// <summary>A smooth function with its first derivative, evaluated without allocation.</summary>
internal interface IDifferentiableFunction
{
    double Value(double x);

    double Slope(double x);
}

/// <summary>
/// Solves f(x) = target for a function monotonic on a bracket [lo, hi] by Newton steps safeguarded with bisection:
/// a Newton step that leaves the current bracket (or has zero slope) is replaced by the bracket midpoint, so the
/// iteration always converges, quadratically near the root.
/// </summary>
internal static class MonotoneSolver
{
    private const int MaxIterations = 200;

    /// <summary>
    /// Returns x in [lo, hi] with f(x) = target to within <paramref name="xTolerance"/>. The caller guarantees that
    /// target lies between f(lo) and f(hi). <paramref name="seed"/> is clamped into the bracket.
    /// </summary>
    public static double Solve<TFunction>(in TFunction f, double target, double lo, double hi, double seed, double xTolerance)
        where TFunction : struct, IDifferentiableFunction
    {
        double fLo = f.Value(lo) - target;
        double fHi = f.Value(hi) - target;
        if (fLo == 0.0)
        {
            return lo;
        }

        if (fHi == 0.0)
        {
            return hi;
        }

        bool increasing = fHi > fLo;
        double x = double.IsFinite(seed) ? Math.Clamp(seed, lo, hi) : 0.5 * (lo + hi);
        for (int i = 0; i < MaxIterations; i++)
        {
            double residual = f.Value(x) - target;
            if (residual == 0.0)
            {
                return x;
            }

            // Shrink the bracket on the side the residual tells us the root is not.
            if ((residual > 0.0) == increasing)
            {
                hi = x;
            }
            else
            {
                lo = x;
            }

            double slope = f.Slope(x);
            double next = x - (residual / slope);
            if (!(next > lo && next < hi))
            {
                next = 0.5 * (lo + hi);
            }

            if (Math.Abs(next - x) <= xTolerance || hi - lo <= xTolerance)
            {
                return next;
            }

            x = next;
        }

        return x;
    }
}
