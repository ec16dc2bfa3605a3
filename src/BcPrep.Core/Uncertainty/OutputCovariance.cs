using System.Globalization;

namespace BcPrep.Uncertainty;

/// <summary>
/// The GUM covariance U_y = J U_x Jᵀ of a chosen subset of a propagation's outputs (JCGM 100 5.2, JCGM 102 6.2),
/// with the matching correlation matrix r_ij = U_ij/(u_i u_j). Entries are in the product of the two outputs' units.
/// Symmetric and positive semi-definite by construction, because it is a principal sub-matrix of J U_x Jᵀ.
/// </summary>
public sealed record OutputCovariance(IReadOnlyList<string> Names, double[,] Covariance)
{
    /// <summary>Number of quantities.</summary>
    public int Size => Names.Count;

    /// <summary>u(y_i) = √U_ii (negative round-off clipped to 0).</summary>
    public double StandardUncertainty(int i) => Math.Sqrt(Math.Max(Covariance[i, i], 0.0));

    /// <summary>r(y_i, y_j); NaN when either standard uncertainty is zero (undefined), exactly 1 on the diagonal otherwise.</summary>
    public double Correlation(int i, int j)
    {
        var denominator = StandardUncertainty(i) * StandardUncertainty(j);
        if (!(denominator > 0.0))
        {
            return double.NaN;
        }

        return i == j ? 1.0 : Math.Clamp(Covariance[i, j] / denominator, -1.0, 1.0);
    }

    /// <summary>Index of a quantity by name, or −1.</summary>
    public int IndexOf(string name)
    {
        for (var i = 0; i < Names.Count; i++)
        {
            if (Names[i] == name)
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>
    /// Takes the rows and columns of the outputs whose name passes <paramref name="include"/>, in output order.
    /// An empty selection gives an empty matrix. Throws <see cref="ArgumentException"/> (a caller's mistake) when the result's
    /// covariance is not square in its output count.
    /// </summary>
    public static OutputCovariance Select(GumResult result, Func<string, bool> include)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(include);
        var m = result.Outputs.Count;
        if (result.OutputCovariance.GetLength(0) != m || result.OutputCovariance.GetLength(1) != m)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Output covariance is {result.OutputCovariance.GetLength(0)} × {result.OutputCovariance.GetLength(1)} but there are {m} outputs."));
        }

        var chosen = Enumerable.Range(0, m).Where(i => include(result.Outputs[i].Name)).ToArray();
        var covariance = new double[chosen.Length, chosen.Length];
        for (var a = 0; a < chosen.Length; a++)
        {
            for (var b = 0; b < chosen.Length; b++)
            {
                covariance[a, b] = result.OutputCovariance[chosen[a], chosen[b]];
            }
        }

        return new OutputCovariance(chosen.Select(i => result.Outputs[i].Name).ToArray(), covariance);
    }
}
