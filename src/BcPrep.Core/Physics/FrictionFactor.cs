using System.Globalization;

namespace BcPrep.Physics;

/// <summary>
/// Darcy (not Fanning) friction factor correlations for fully developed flow in round pipes.
/// All functions take the Reynolds number based on diameter and bulk velocity, and reject inputs outside
/// their stated ranges with <see cref="BcPrepDataException"/>.
/// </summary>
public static class FrictionFactor
{
    /// <summary>Upper Reynolds number treated as laminar (and lower bound of the turbulent correlations' use here).</summary>
    public const double LaminarLimitReynolds = 2300.0;

    /// <summary>Largest relative roughness ε/D accepted by the rough-pipe correlations.</summary>
    public const double MaxRelativeRoughness = 0.05;

    private const int ColebrookMaxIterations = 200;
    private const double ColebrookTolerance = 1e-12;

    /// <summary>Hagen–Poiseuille f = 64/Re; accepted 0 &lt; Re ≤ 2300.</summary>
    public static double Laminar(double reynolds)
    {
        Require.InRange(reynolds, double.Epsilon, LaminarLimitReynolds, "Reynolds number", "", "the laminar friction factor 64/Re");
        return 64.0 / reynolds;
    }

    /// <summary>Blasius f = 0.3164 Re^−0.25, smooth pipe; accepted 3000 ≤ Re ≤ 1e5.</summary>
    public static double Blasius(double reynolds)
    {
        Require.InRange(reynolds, 3000.0, 1.0e5, "Reynolds number", "", "the Blasius friction factor");
        return 0.3164 * Math.Pow(reynolds, -0.25);
    }

    /// <summary>Petukhov (1970) f = (0.790 ln Re − 1.64)^−2, smooth pipe; accepted 3000 ≤ Re ≤ 5e6.</summary>
    public static double Petukhov(double reynolds)
    {
        Require.InRange(reynolds, 3000.0, 5.0e6, "Reynolds number", "", "the Petukhov friction factor");
        var x = (0.790 * Math.Log(reynolds)) - 1.64;
        return 1.0 / (x * x);
    }

    /// <summary>
    /// Haaland (1983) explicit approximation 1/√f = −1.8 log10[(ε/D/3.7)^1.11 + 6.9/Re];
    /// accepted 4000 ≤ Re ≤ 1e8, 0 ≤ ε/D ≤ 0.05. Within about 2 % of Colebrook.
    /// </summary>
    public static double Haaland(double reynolds, double relativeRoughness = 0.0)
    {
        Require.InRange(reynolds, 4000.0, 1.0e8, "Reynolds number", "", "the Haaland friction factor");
        Require.InRange(relativeRoughness, 0.0, MaxRelativeRoughness, "relative roughness", "", "the Haaland friction factor");
        var x = -1.8 * Math.Log10(Math.Pow(relativeRoughness / 3.7, 1.11) + (6.9 / reynolds));
        return 1.0 / (x * x);
    }

    /// <summary>
    /// Colebrook (1939) 1/√f = −2 log10[ε/(3.7 D) + 2.51/(Re √f)], solved by fixed-point iteration on 1/√f
    /// until the relative change is ≤ 1e-12 (throws if not converged in 200 steps).
    /// Accepted 2300 &lt; Re ≤ 1e8 (turbulent branch only; 2300–4000 is transitional flow where the value is
    /// a continuation, not a prediction) and 0 ≤ ε/D ≤ 0.05.
    /// </summary>
    public static double Colebrook(double reynolds, double relativeRoughness = 0.0)
    {
        Require.InRange(reynolds, LaminarLimitReynolds, 1.0e8, "Reynolds number", "", "the Colebrook friction factor");
        Require.InRange(relativeRoughness, 0.0, MaxRelativeRoughness, "relative roughness", "", "the Colebrook friction factor");
        var x = 1.0 / Math.Sqrt(0.02);
        for (var i = 0; i < ColebrookMaxIterations; i++)
        {
            var next = -2.0 * Math.Log10((relativeRoughness / 3.7) + (2.51 * x / reynolds));
            var converged = Math.Abs(next - x) <= ColebrookTolerance * Math.Abs(next);
            x = next;
            if (converged)
            {
                return 1.0 / (x * x);
            }
        }

        throw new BcPrepDataException(string.Create(
            CultureInfo.InvariantCulture, $"Colebrook iteration did not converge for Re = {reynolds:R}, eps/D = {relativeRoughness:R}."));
    }
}
