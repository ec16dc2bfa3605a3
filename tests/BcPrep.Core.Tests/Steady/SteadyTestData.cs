namespace BcPrep.Tests.Steady;

internal static class SteadyTestData
{
    public static double Gaussian(Random rng)
    {
        double u1 = 1.0 - rng.NextDouble();
        double u2 = rng.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>AR(1) noise with marginal standard deviation sd.</summary>
    public static double[] Ar1(int n, double phi, double sd, int seed)
    {
        var rng = new Random(seed);
        var e = new double[n];
        double innovation = sd * Math.Sqrt(1 - (phi * phi));
        e[0] = sd * Gaussian(rng);
        for (int i = 1; i < n; i++)
        {
            e[i] = (phi * e[i - 1]) + (innovation * Gaussian(rng));
        }

        return e;
    }
}
