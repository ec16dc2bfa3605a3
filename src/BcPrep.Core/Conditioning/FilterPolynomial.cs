using System.Numerics;

namespace BcPrep.Conditioning;

/// <summary>Coefficient arithmetic for polynomials in z⁻¹ (index 0 = constant term).</summary>
internal static class FilterPolynomial
{
    public static double[] Multiply(double[] p, double[] q)
    {
        var r = new double[p.Length + q.Length - 1];
        for (int i = 0; i < p.Length; i++)
        {
            for (int j = 0; j < q.Length; j++)
            {
                r[i + j] += p[i] * q[j];
            }
        }

        return r;
    }

    /// <summary>Coefficients of Π(1 − r_k z⁻¹); the imaginary parts cancel for conjugate-closed root sets.</summary>
    public static double[] FromRoots(IReadOnlyList<Complex> roots)
    {
        var c = new Complex[roots.Count + 1];
        c[0] = Complex.One;
        for (int k = 0; k < roots.Count; k++)
        {
            for (int i = k + 1; i >= 1; i--)
            {
                c[i] -= roots[k] * c[i - 1];
            }
        }

        var real = new double[c.Length];
        for (int i = 0; i < c.Length; i++)
        {
            real[i] = c[i].Real;
        }

        return real;
    }
}
