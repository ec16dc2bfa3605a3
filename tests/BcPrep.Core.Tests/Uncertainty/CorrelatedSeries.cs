namespace BcPrep.Tests.Uncertainty;

/// <summary>
/// Seeded series whose autocorrelations reach different distances: AR(1) noise of correlation time τ samples
/// (φ = e^(−1/τ)), a 50 Hz hum sampled at 1 kHz whose phase wanders slowly (an oscillating ACF that decays over
/// hundreds of lags) over AR(1) noise, and a slow ramp under AR(1) noise (a drifting channel; a "ramp" rises so far that the cut-off needs most of the window).
/// </summary>
internal static class CorrelatedSeries
{
    public static double[] Ar1(int n, double tau, int seed) =>
        Uncertainty.Ar1.Series(n, Math.Exp(-1.0 / tau), new Random(seed), 20.0);

    public static double[] Hum(int n, int seed)
    {
        var random = new Random(seed);
        var noise = Uncertainty.Ar1.Series(n, Math.Exp(-1.0 / 3.0), random);
        var x = new double[n];
        var phase = 0.0;
        for (var i = 0; i < n; i++)
        {
            // A random walk of the phase, 0.05 rad per √sample: the ACF is cos(2π·50k/1000)·e^(−k·0.05²/2).
            phase += 0.05 * Gaussian(random);
            x[i] = 1.5 + (2.0 * Math.Sin((2.0 * Math.PI * 50.0 * i / 1000.0) + phase)) + noise[i];
        }
        return x;
    }

    public static double[] Drift(int n, int seed, double rise = 1.5)
    {
        var noise = Uncertainty.Ar1.Series(n, Math.Exp(-1.0 / 5.0), new Random(seed));
        var x = new double[n];
        for (var i = 0; i < n; i++)
        {
            x[i] = 300.0 + (rise * i / n) + noise[i];
        }
        return x;
    }

    public static double[] Named(string name, int n, int seed) => name switch
    {
        "hum" => Hum(n, seed),
        "drift" => Drift(n, seed),
        "ramp" => Drift(n, seed, 20.0),
        _ => Ar1(n, double.Parse(name["ar1-tau".Length..], System.Globalization.CultureInfo.InvariantCulture), seed),
    };

    /// <summary>r(k) = Σᵢ dᵢ dᵢ₊ₖ by its definition, summed in order (d = x − mean).</summary>
    public static double LaggedProduct(double[] x, double mean, int lag)
    {
        var sum = 0.0;
        for (var i = 0; i + lag < x.Length; i++)
        {
            sum += (x[i] - mean) * (x[i + lag] - mean);
        }
        return sum;
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());
}
