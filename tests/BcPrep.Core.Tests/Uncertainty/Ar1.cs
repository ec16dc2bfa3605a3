namespace BcPrep.Tests.Uncertainty;

/// <summary>Seeded AR(1) series x_t = φ x_{t−1} + e_t, e ~ N(0, 1), started from the stationary distribution.</summary>
internal static class Ar1
{
    public static double[] Series(int n, double phi, Random random, double mean = 0.0)
    {
        var x = new double[n];
        var state = Gaussian(random) / Math.Sqrt(1.0 - phi * phi);
        for (var t = 0; t < n; t++)
        {
            x[t] = mean + state;
            state = phi * state + Gaussian(random);
        }

        return x;
    }

    /// <summary>Exact γ_n = (1+φ)/(1−φ) − 2φ(1 − φⁿ)/[n(1−φ)²] (reference sheet 4.1).</summary>
    public static double ExactGamma(int n, double phi) =>
        (1 + phi) / (1 - phi) - 2 * phi * (1 - Math.Pow(phi, n)) / (n * (1 - phi) * (1 - phi));

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());
}
