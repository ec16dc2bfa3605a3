using System.Globalization;
using MathNet.Numerics.LinearAlgebra;

namespace BcPrep.Conditioning;

/// <summary>
/// Forward–backward filtering with the initial states of Gustafsson, "Determining the initial states in
/// forward-backward filtering", IEEE Trans. Signal Processing 44(4), 1996:
/// the states at both ends are chosen so that forward–backward and backward–forward filtering give the same result,
/// which removes the edge transients of zero or padded initial states without inventing samples beyond the record.
/// </summary>
public static class ForwardBackwardGustafsson
{
    /// <summary>
    /// Zero-phase filtering of <paramref name="x"/> by b, a (normalised by a[0]; order m = max(len a, len b) − 1).
    /// Method: O = n×m response of the filter to each unit initial state with zero input; S = the filter applied to
    /// the row-reversed O; the 2m end conditions ("forward–backward = backward–forward" at the first and last m
    /// samples) give M·[x₀; x_N] = Δ with M = [[Sᴿ−O, Oᴿ−S] first m rows; same, last m rows] and Δ the difference of
    /// the zero-state backward–forward and forward–backward results there; the output is y_fb + [Sᴿ, Oᴿ]·[x₀; x_N].
    /// Cost O(n·m²) time and O(n·m) memory: meant for records or chunks, not for a whole day at once.
    /// </summary>
    /// <exception cref="BcPrepDataException">Invalid coefficients, a NaN/∞ sample, or n ≤ 2m (too short to pin 2m end states).</exception>
    public static double[] Apply(IReadOnlyList<double> b, IReadOnlyList<double> a, ReadOnlySpan<double> x)
    {
        var (y, _, _) = Solve(b, a, x);
        return y;
    }

    /// <summary>
    /// The initial states that <see cref="Apply"/> chooses: the forward pass's transposed-direct-form-II state before
    /// the first sample and the backward pass's before the last. A long record's forward state depends only on its
    /// first samples and its backward state on its last ones (each end's influence on the other decays like the
    /// slowest pole), so a stream can take them from a head and a tail and filter in between with carried states.
    /// </summary>
    /// <exception cref="BcPrepDataException">As <see cref="Apply"/>; also for a filter of order 0 (no state).</exception>
    public static (double[] Forward, double[] Backward) InitialStates(IReadOnlyList<double> b, IReadOnlyList<double> a, ReadOnlySpan<double> x)
    {
        var (_, forward, backward) = Solve(b, a, x);
        if (forward.Length == 0)
        {
            throw new BcPrepDataException("A filter of order 0 has no initial state.");
        }
        return (forward, backward);
    }

    private static (double[] Y, double[] Forward, double[] Backward) Solve(IReadOnlyList<double> b, IReadOnlyList<double> a, ReadOnlySpan<double> x)
    {
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(a);
        if (b.Count == 0 || a.Count == 0 || a[0] == 0.0)
        {
            throw new ArgumentException("Filter coefficients must be non-empty with a[0] ≠ 0.");
        }
        int m = Math.Max(a.Count, b.Count) - 1;
        var bn = new double[m + 1];
        var an = new double[m + 1];
        for (int i = 0; i <= m; i++)
        {
            bn[i] = i < b.Count ? b[i] / a[0] : 0.0;
            an[i] = i < a.Count ? a[i] / a[0] : 0.0;
        }
        int n = x.Length;
        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(x[i]))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"Sample {i} is {x[i]}; bridge or split gaps before filtering."));
            }
        }
        if (m == 0)
        {
            return (x.ToArray().Select(v => bn[0] * bn[0] * v).ToArray(), [], []);
        }
        if (n <= 2 * m)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Series of {n} samples is too short for Gustafsson's initial states of an order-{m} filter: it needs more than {2 * m}."));
        }

        // O: column k is the zero-input response to the unit state e_k, i.e. column 0 delayed by k (transposed direct
        // form II), so only column 0 is stored: O[i, k] = o0[i − k] for i ≥ k, else 0. S: column k is the filter applied
        // to O's column k reversed. Plain arrays, not matrices: the n×m matrices cost more than the filtering itself.
        var unitState = new double[m];
        unitState[0] = 1.0;
        var o0 = Filter(bn, an, new double[n], unitState);
        var s = new double[m][];
        var reversed = new double[n];
        for (int k = 0; k < m; k++)
        {
            for (int i = 0; i < n; i++)
            {
                reversed[i] = O(o0, n - 1 - i, k);
            }
            s[k] = Filter(bn, an, reversed, new double[m]);
        }

        var xs = x.ToArray();
        var yFb = Reverse(Filter(bn, an, Reverse(Filter(bn, an, xs, new double[m])), new double[m]));
        var yBf = Filter(bn, an, Reverse(Filter(bn, an, Reverse(xs), new double[m])), new double[m]);

        var matrix = Matrix<double>.Build.Dense(2 * m, 2 * m);
        var delta = Vector<double>.Build.Dense(2 * m);
        for (int r = 0; r < 2 * m; r++)
        {
            int row = r < m ? r : n - (2 * m) + r;
            for (int k = 0; k < m; k++)
            {
                matrix[r, k] = s[k][n - 1 - row] - O(o0, row, k);
                matrix[r, m + k] = O(o0, n - 1 - row, k) - s[k][row];
            }
            delta[r] = yBf[row] - yFb[row];
        }
        var ic = matrix.QR().Solve(delta);

        var y = yFb;
        for (int i = 0; i < n; i++)
        {
            double w = 0.0;
            for (int k = 0; k < m; k++)
            {
                w += (s[k][n - 1 - i] * ic[k]) + (O(o0, n - 1 - i, k) * ic[m + k]);
            }
            y[i] = yFb[i] + w;
        }
        var states = ic.ToArray();
        return (y, states[..m], states[m..]);
    }

    /// <summary>Row i, column k of the zero-input response matrix O: column 0 delayed by k.</summary>
    private static double O(double[] o0, int i, int k) => i >= k ? o0[i - k] : 0.0;

    /// <summary>Transposed-direct-form-II filtering of x from the state z (copied), like scipy lfilter with zi.</summary>
    private static double[] Filter(double[] b, double[] a, double[] x, double[] initialState)
    {
        int m = initialState.Length;
        var z = (double[])initialState.Clone();
        var y = new double[x.Length];
        for (int i = 0; i < x.Length; i++)
        {
            double xi = x[i];
            double yi = (b[0] * xi) + z[0];
            for (int j = 0; j < m - 1; j++)
            {
                z[j] = (b[j + 1] * xi) - (a[j + 1] * yi) + z[j + 1];
            }
            z[m - 1] = (b[m] * xi) - (a[m] * yi);
            y[i] = yi;
        }
        return y;
    }

    /// <summary>Reverses in place (every caller passes a temporary) and returns the same array.</summary>
    private static double[] Reverse(double[] x)
    {
        Array.Reverse(x);
        return x;
    }
}
