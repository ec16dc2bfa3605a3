using System.Globalization;
using BcPrep.Physics;

namespace BcPrep.Profiles;

/// <summary>Universal near-wall velocity laws u⁺(y⁺), u⁺ = u/u_τ, y⁺ = y u_τ/ν.</summary>
public static class WallLaw
{
    /// <summary>κ = 0.41, B = 5.2: a classical log-law constant pair (from memory).</summary>
    public const double DefaultKappa = 0.41, DefaultB = 5.2;

    /// <summary>Largest y⁺ accepted (far beyond any pipe of this rig).</summary>
    public const double MaxYPlus = 1.0e7;

    /// <summary>
    /// Spalding (1961) law, valid from the wall through the log region:
    /// y⁺ = u⁺ + e^{−κB}[e^{κu⁺} − 1 − κu⁺ − (κu⁺)²/2 − (κu⁺)³/6], solved for u⁺ by Newton's method to a
    /// relative change ≤ 1e-13. y⁺ in [0, 1e7]; κ in (0.3, 0.5), B in [3, 7].
    /// </summary>
    public static double Spalding(double yPlus, double kappa = DefaultKappa, double b = DefaultB)
    {
        CheckInputs(yPlus, kappa);
        Require.InRange(b, 3.0, 7.0, "log-law intercept B", "", "the Spalding wall law");
        if (yPlus == 0.0)
        {
            return 0.0;
        }

        var c = Math.Exp(-kappa * b);
        // Starting from the smaller of the viscous and log-law estimates keeps Newton on the convex side.
        var u = Math.Min(yPlus, (Math.Log(Math.Max(yPlus, 1.0)) / kappa) + b);
        for (var i = 0; i < 100; i++)
        {
            var ku = kappa * u;
            var exp = Math.Exp(ku);
            var residual = u + (c * (exp - 1.0 - ku - (ku * ku / 2.0) - (ku * ku * ku / 6.0))) - yPlus;
            var slope = 1.0 + (c * kappa * (exp - 1.0 - ku - (ku * ku / 2.0)));
            var step = residual / slope;
            u -= step;
            if (Math.Abs(step) <= 1e-13 * Math.Max(u, 1e-300))
            {
                return u;
            }
        }

        throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"Spalding wall law did not converge at y+ = {yPlus:R}."));
    }

    /// <summary>
    /// Reichardt (1951) explicit law u⁺ = (1/κ) ln(1 + κ y⁺) + 7.8[1 − e^{−y⁺/11} − (y⁺/11) e^{−y⁺/3}],
    /// with the same κ in both places. y⁺ in [0, 1e7]; κ in (0.3, 0.5).
    /// </summary>
    public static double Reichardt(double yPlus, double kappa = DefaultKappa)
    {
        CheckInputs(yPlus, kappa);
        return (Math.Log(1.0 + (kappa * yPlus)) / kappa)
            + (7.8 * (1.0 - Math.Exp(-yPlus / 11.0) - (yPlus / 11.0 * Math.Exp(-yPlus / 3.0))));
    }

    private static void CheckInputs(double yPlus, double kappa)
    {
        Require.InRange(yPlus, 0.0, MaxYPlus, "y+", "", "the wall law");
        Require.InRange(kappa, 0.3, 0.5, "von Karman constant", "", "the wall law");
    }
}
