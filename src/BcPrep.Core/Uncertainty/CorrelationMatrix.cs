using System.Globalization;
using MathNet.Numerics.LinearAlgebra;

namespace BcPrep.Uncertainty;

/// <summary>
/// Correlation coefficients r(xᵢ, xⱼ) between the inputs of a model (GUM 5.2.2): a symmetric matrix with unit
/// diagonal, |r| ≤ 1, positive semi-definite. Immutable; every factory validates and throws
/// <see cref="BcPrepDataException"/> naming the offending entry.
/// </summary>
public sealed class CorrelationMatrix
{
    /// <summary>Entries may deviate from symmetry / the unit bound by this much (round-off in typed-in tables).</summary>
    public const double Tolerance = 1e-9;

    private readonly double[,] _r;

    private CorrelationMatrix(double[,] r)
    {
        _r = r;
    }

    /// <summary>Number of inputs.</summary>
    public int Size => _r.GetLength(0);

    /// <summary>r(xᵢ, xⱼ).</summary>
    public double this[int i, int j] => _r[i, j];

    /// <summary>True when some off-diagonal entry is non-zero.</summary>
    public bool HasCorrelations
    {
        get
        {
            for (var i = 0; i < Size; i++)
            {
                for (var j = i + 1; j < Size; j++)
                {
                    if (_r[i, j] != 0.0)
                    {
                        return true;
                    }
                }
            }

            return false;
        }
    }

    /// <summary>Uncorrelated inputs: the n × n identity.</summary>
    public static CorrelationMatrix Identity(int size)
    {
        if (size < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(size), size, "A correlation matrix has at least one row.");
        }

        var r = new double[size, size];
        for (var i = 0; i < size; i++)
        {
            r[i, i] = 1.0;
        }

        return new CorrelationMatrix(r);
    }

    /// <summary>
    /// From a full square matrix. The matrix must be symmetric within <see cref="Tolerance"/>, have ones on the
    /// diagonal, |r| ≤ 1 and be positive semi-definite (smallest eigenvalue ≥ −1e-10·n); it is copied and
    /// symmetrised as (R + Rᵀ)/2.
    /// </summary>
    public static CorrelationMatrix FromMatrix(double[,] matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        var n = matrix.GetLength(0);
        if (n < 1 || matrix.GetLength(1) != n)
        {
            throw new BcPrepDataException(
                $"Correlation matrix must be square and non-empty, got {matrix.GetLength(0)} × {matrix.GetLength(1)}.");
        }

        var r = new double[n, n];
        for (var i = 0; i < n; i++)
        {
            for (var j = 0; j < n; j++)
            {
                var rij = matrix[i, j];
                var rji = matrix[j, i];
                if (!double.IsFinite(rij))
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                        $"Correlation r[{i},{j}] = {rij} is not finite."));
                }

                if (Math.Abs(rij - rji) > Tolerance)
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                        $"Correlation matrix is not symmetric: r[{i},{j}] = {rij} but r[{j},{i}] = {rji}."));
                }

                if (i == j && Math.Abs(rij - 1.0) > Tolerance)
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                        $"Correlation r[{i},{i}] = {rij} must be 1."));
                }

                if (Math.Abs(rij) > 1.0 + Tolerance)
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                        $"Correlation r[{i},{j}] = {rij} lies outside [−1, 1]."));
                }

                r[i, j] = i == j ? 1.0 : Math.Clamp(0.5 * (rij + rji), -1.0, 1.0);
            }
        }

        EnsurePositiveSemiDefinite(r);
        return new CorrelationMatrix(r);
    }

    /// <summary>
    /// From a list of (i, j, r) pairs (zero-based input indices, i ≠ j); unlisted pairs are uncorrelated. Each
    /// pair sets both r[i,j] and r[j,i]; listing the same pair twice with different values is an error.
    /// </summary>
    public static CorrelationMatrix FromPairs(int size, IEnumerable<(int I, int J, double R)> pairs)
    {
        ArgumentNullException.ThrowIfNull(pairs);
        var r = Identity(size)._r;
        var seen = new bool[size, size];
        foreach (var (i, j, value) in pairs)
        {
            if (i < 0 || j < 0 || i >= size || j >= size || i == j)
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Correlation pair ({i}, {j}) is invalid: indices must differ and lie in [0, {size - 1}]."));
            }

            if (seen[i, j] && r[i, j] != value)
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Correlation pair ({i}, {j}) is given twice with different values {r[i, j]} and {value}."));
            }

            seen[i, j] = seen[j, i] = true;
            r[i, j] = r[j, i] = value;
        }

        return FromMatrix(r);
    }

    /// <summary>A copy of the coefficients.</summary>
    public double[,] ToArray() => (double[,])_r.Clone();

    /// <summary>Covariance matrix U_x[i,j] = r[i,j]·u[i]·u[j] for the given standard uncertainties.</summary>
    public double[,] ToCovariance(IReadOnlyList<double> standardUncertainties)
    {
        ArgumentNullException.ThrowIfNull(standardUncertainties);
        if (standardUncertainties.Count != Size)
        {
            throw new ArgumentException(
                $"Correlation matrix has size {Size} but {standardUncertainties.Count} uncertainties were given.", nameof(standardUncertainties));
        }

        var cov = new double[Size, Size];
        for (var i = 0; i < Size; i++)
        {
            for (var j = 0; j < Size; j++)
            {
                cov[i, j] = _r[i, j] * standardUncertainties[i] * standardUncertainties[j];
            }
        }

        return cov;
    }

    private static void EnsurePositiveSemiDefinite(double[,] r)
    {
        var n = r.GetLength(0);
        if (n == 1)
        {
            return;
        }

        var evd = Matrix<double>.Build.DenseOfArray(r).Evd(Symmetricity.Symmetric);
        var smallest = evd.EigenValues.Min(e => e.Real);
        if (smallest < -1e-10 * n)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Correlation matrix is not positive semi-definite (smallest eigenvalue {MeasurementText.Number(smallest, 6)}); the stated correlations are mutually inconsistent."));
        }
    }
}
