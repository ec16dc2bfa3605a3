namespace BcPrep.Benchmarks;

/// <summary>
/// Deterministic synthetic data of a 1 h test day with 32 channels: one set-point change at 30 min, each channel a
/// first-order response (time constants from 15 s, like a flow meter, to 480 s, like a duct wall) plus AR(1) noise.
/// </summary>
public static class SyntheticDay
{
    public const int Channels = 32;
    public const double DurationS = 3600.0;
    public const double ChangeS = 1800.0;

    public static double TimeConstantS(int channel) => 15.0 + (465.0 * channel / (Channels - 1));

    /// <summary>The noise-free response of a channel at time t (s): level 100 + 10·channel, step of 5.</summary>
    public static double Level(int channel, double timeS) =>
        100.0 + (10.0 * channel) + (timeS < ChangeS ? 0.0 : 5.0 * (1.0 - Math.Exp(-(timeS - ChangeS) / TimeConstantS(channel))));

    /// <summary>AR(1) noise (φ = 0.7, marginal standard deviation sd) from a seeded generator.</summary>
    public static double[] Ar1(int n, double sd, int seed)
    {
        var random = new Random(seed);
        var innovation = sd * Math.Sqrt(1 - (0.7 * 0.7));
        var e = new double[n];
        var state = 0.0;
        for (var i = 0; i < n; i++)
        {
            var u1 = 1.0 - random.NextDouble();
            var u2 = random.NextDouble();
            state = (0.7 * state) + (innovation * Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2));
            e[i] = state;
        }
        return e;
    }
}
