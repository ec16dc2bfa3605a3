namespace BcPrep.Steady;

/// <summary>
/// A first-order approach fitted after a step: y(t) = asymptote + amplitude·exp(−(t − stepTime)/τ). What a channel
/// still has to travel at time t is |amplitude|·exp(−(t − stepTime)/τ), which equals |dy/dt|·τ: a slope alone
/// cannot tell a settled channel from a slow one, the slope times the time constant can.
/// </summary>
/// <param name="StepTimeS">Time the approach is measured from (the step), s.</param>
/// <param name="Asymptote">Value approached (the settled value), channel unit.</param>
/// <param name="Amplitude">Departure from the asymptote at the step time, channel unit (signed).</param>
/// <param name="TauS">Time constant τ, s.</param>
/// <param name="ResidualStandardDeviation">Standard deviation of the data about the fitted curve, channel unit.</param>
/// <param name="Count">Finite samples fitted.</param>
/// <param name="TauAtBound">True when τ came out at the end of the searched range: the data do not pin it down.</param>
public sealed record SettlingFit(double StepTimeS, double Asymptote, double Amplitude, double TauS, double ResidualStandardDeviation, int Count, bool TauAtBound)
{
    /// <summary>
    /// A slow linear drift under the approach (ambient, unit/s), so that a few hundredths of a kelvin per hour of room
    /// temperature do not bend the time constant; the asymptote is then the drifting line's value at the step time.
    /// </summary>
    public double DriftPerS { get; init; }

    /// <summary>The fitted curve at time t.</summary>
    public double ValueAt(double timeS) => Asymptote + (DriftPerS * (timeS - StepTimeS)) + (Amplitude * Decay(timeS));

    /// <summary>
    /// The first moment from which the fitted curve stays within <paramref name="tolerance"/> of its value at
    /// <paramref name="endS"/> (the settled value of a plateau that ends there), searched on a grid of τ/200.
    /// </summary>
    public double SettledSinceS(double tolerance, double endS)
    {
        if (!(tolerance > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "tolerance must be positive");
        }
        var settled = ValueAt(endS);
        var step = Math.Max(Math.Min(TauS / 200.0, (endS - StepTimeS) / 2000.0), 1e-6);
        var t = endS;
        while (t - step >= StepTimeS && Math.Abs(ValueAt(t - step) - settled) <= tolerance)
        {
            t -= step;
        }
        return t - step < StepTimeS ? StepTimeS : t;
    }

    /// <summary>Slope of the fitted curve at time t, unit/s.</summary>
    public double SlopeAt(double timeS) => -Amplitude * Decay(timeS) / TauS;

    /// <summary>Predicted change still to come after time t: |slope|·τ, the distance to the asymptote.</summary>
    public double RemainingChangeAt(double timeS) => Math.Abs(Amplitude) * Decay(timeS);

    /// <summary>
    /// The first moment from which the predicted remaining change stays within <paramref name="tolerance"/>:
    /// stepTime + τ·ln(|amplitude|/tolerance), or the step time when the whole approach is within it.
    /// </summary>
    public double SettledSinceS(double tolerance)
    {
        if (!(tolerance > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "tolerance must be positive");
        }
        return Math.Abs(Amplitude) <= tolerance ? StepTimeS : StepTimeS + (TauS * Math.Log(Math.Abs(Amplitude) / tolerance));
    }

    private double Decay(double timeS) => Math.Exp(-Math.Max(0.0, timeS - StepTimeS) / TauS);
}

/// <summary>Fits the first-order approach of one channel after a step (<see cref="SettlingFit"/>).</summary>
public static class SettlingEstimate
{
    /// <summary>
    /// Least squares over τ: for each τ the asymptote and amplitude are linear and solved exactly, so only τ is
    /// searched, on a log grid over [<paramref name="minTauS"/>, <paramref name="maxTauS"/>] and then by golden
    /// section around the best grid point. NaN samples are skipped, so gaps neither help nor hurt the fit. Samples
    /// before <paramref name="stepTimeS"/> are ignored.
    /// </summary>
    /// <exception cref="BcPrepDataException">Fewer than 4 finite samples after the step, length mismatch, or an invalid τ range.</exception>
    /// <param name="timesS">Sample times, s.</param>
    /// <param name="values">Samples, channel unit; NaN = missing.</param>
    /// <param name="stepTimeS">The step the approach starts from.</param>
    /// <param name="minTauS">Shortest time constant searched.</param>
    /// <param name="maxTauS">Longest time constant searched.</param>
    /// <param name="withDrift">Also fit a linear drift under the approach (<see cref="SettlingFit.DriftPerS"/>).</param>
    public static SettlingFit Fit(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values, double stepTimeS, double minTauS, double maxTauS, bool withDrift = false)
    {
        if (timesS.Length != values.Length)
        {
            throw new BcPrepDataException("Times and values must have the same length.");
        }
        if (!(minTauS > 0) || !(maxTauS > minTauS))
        {
            throw new BcPrepDataException($"Time-constant range [{minTauS}, {maxTauS}] s is invalid.");
        }
        var t = new List<double>(timesS.Length);
        var y = new List<double>(timesS.Length);
        for (var i = 0; i < timesS.Length; i++)
        {
            if (timesS[i] >= stepTimeS && double.IsFinite(values[i]))
            {
                t.Add(timesS[i] - stepTimeS);
                y.Add(values[i]);
            }
        }
        if (t.Count < 4)
        {
            throw new BcPrepDataException($"A settling fit needs at least 4 finite samples after the step, got {t.Count}.");
        }
        var ts = t.ToArray();
        var ys = y.ToArray();
        const int grid = 48;
        var logMin = Math.Log(minTauS);
        var logMax = Math.Log(maxTauS);
        var bestK = 0;
        var bestSse = double.PositiveInfinity;
        for (var k = 0; k <= grid; k++)
        {
            var sse = Solve(ts, ys, Math.Exp(logMin + ((logMax - logMin) * k / grid)), withDrift).Sse;
            if (sse < bestSse)
            {
                bestSse = sse;
                bestK = k;
            }
        }
        var lo = logMin + ((logMax - logMin) * Math.Max(0, bestK - 1) / grid);
        var hi = logMin + ((logMax - logMin) * Math.Min(grid, bestK + 1) / grid);
        var golden = (Math.Sqrt(5) - 1) / 2;
        var a = hi - (golden * (hi - lo));
        var b = lo + (golden * (hi - lo));
        var fa = Solve(ts, ys, Math.Exp(a), withDrift).Sse;
        var fb = Solve(ts, ys, Math.Exp(b), withDrift).Sse;
        for (var iteration = 0; iteration < 40 && hi - lo > 1e-6; iteration++)
        {
            if (fa < fb)
            {
                hi = b;
                b = a;
                fb = fa;
                a = hi - (golden * (hi - lo));
                fa = Solve(ts, ys, Math.Exp(a), withDrift).Sse;
            }
            else
            {
                lo = a;
                a = b;
                fa = fb;
                b = lo + (golden * (hi - lo));
                fb = Solve(ts, ys, Math.Exp(b), withDrift).Sse;
            }
        }
        var tau = Math.Exp(0.5 * (lo + hi));
        var (asymptote, amplitude, drift, finalSse) = Solve(ts, ys, tau, withDrift);
        var atBound = bestK == 0 || bestK == grid;
        var residual = Math.Sqrt(finalSse / Math.Max(1, ts.Length - (withDrift ? 4 : 3)));
        return new SettlingFit(stepTimeS, asymptote, amplitude, tau, residual, ts.Length, atBound) { DriftPerS = drift };
    }

    /// <summary>
    /// Linear least squares of y = a + b·exp(−t/τ) (+ d·t) for a fixed τ, on centred values. A basis that cannot
    /// be told apart from the others (an exponential flat over the data, or straight) falls back to fewer terms.
    /// </summary>
    private static (double A, double B, double D, double Sse) Solve(double[] t, double[] y, double tauS, bool withDrift)
    {
        var n = t.Length;
        var e = new double[n];
        for (var i = 0; i < n; i++)
        {
            e[i] = Math.Exp(-t[i] / tauS);
        }
        var columns = withDrift ? new[] { e, t } : new[] { e };
        var (coefficients, sse) = LeastSquares(columns, y);
        if (coefficients is null && withDrift)
        {
            (coefficients, sse) = LeastSquares([t], y);
            if (coefficients is not null)
            {
                return (coefficients[0], 0.0, coefficients[1], sse);
            }
        }
        if (coefficients is null)
        {
            var mean = y.Average();
            return (mean, 0.0, 0.0, y.Sum(v => (v - mean) * (v - mean)));
        }
        return (coefficients[0], coefficients[1], withDrift ? coefficients[2] : 0.0, sse);
    }

    /// <summary>
    /// y = c0 + Σ c_j·x_j by normal equations on centred columns (Gaussian elimination with partial pivoting);
    /// null when a column is (nearly) a combination of the others.
    /// </summary>
    private static (double[]? Coefficients, double Sse) LeastSquares(double[][] columns, double[] y)
    {
        var n = y.Length;
        var m = columns.Length;
        var means = columns.Select(c => c.Average()).ToArray();
        var yMean = y.Average();
        var matrix = new double[m, m + 1];
        for (var j = 0; j < m; j++)
        {
            for (var k = 0; k < m; k++)
            {
                var sum = 0.0;
                for (var i = 0; i < n; i++)
                {
                    sum += (columns[j][i] - means[j]) * (columns[k][i] - means[k]);
                }
                matrix[j, k] = sum;
            }
            var rhs = 0.0;
            for (var i = 0; i < n; i++)
            {
                rhs += (columns[j][i] - means[j]) * (y[i] - yMean);
            }
            matrix[j, m] = rhs;
        }
        var diagonal = Enumerable.Range(0, m).Select(j => matrix[j, j]).ToArray();
        for (var col = 0; col < m; col++)
        {
            var pivot = col;
            for (var r = col + 1; r < m; r++)
            {
                if (Math.Abs(matrix[r, col]) > Math.Abs(matrix[pivot, col]))
                {
                    pivot = r;
                }
            }
            for (var k = 0; k <= m; k++)
            {
                (matrix[col, k], matrix[pivot, k]) = (matrix[pivot, k], matrix[col, k]);
            }
            if (!(Math.Abs(matrix[col, col]) > 1e-10 * Math.Max(diagonal[col], double.Epsilon)))
            {
                return (null, double.NaN);
            }
            for (var r = 0; r < m; r++)
            {
                if (r == col)
                {
                    continue;
                }
                var factor = matrix[r, col] / matrix[col, col];
                for (var k = col; k <= m; k++)
                {
                    matrix[r, k] -= factor * matrix[col, k];
                }
            }
        }
        var slopes = Enumerable.Range(0, m).Select(j => matrix[j, m] / matrix[j, j]).ToArray();
        var intercept = yMean - Enumerable.Range(0, m).Sum(j => slopes[j] * means[j]);
        var sse = 0.0;
        for (var i = 0; i < n; i++)
        {
            var fitted = intercept;
            for (var j = 0; j < m; j++)
            {
                fitted += slopes[j] * columns[j][i];
            }
            sse += (y[i] - fitted) * (y[i] - fitted);
        }
        return ([intercept, .. slopes], sse);
    }
}
