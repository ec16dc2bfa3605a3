using BcPrep.Uncertainty;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Jobs;

namespace BcPrep.Benchmarks;

/// <summary>
/// The Type A evaluation of one 1 M-sample window (about 17 min at 1 kHz), whose cost is the autocorrelation up to the
/// Sokal cut-off: AR(1) noise of correlation time 1, 30 and 300 samples (cut-offs near 11, 300 and 3000 lags), a
/// 50 Hz hum at 1 kHz over white noise (an oscillating ACF), and a drifting channel (a slow ramp under the noise,
/// whose cut-off needs a large part of the window, as the slow channels of a real day do).
/// </summary>
[MemoryDiagnoser]
[ShortRunJob(RuntimeMoniker.Net10_0)]
public class WindowMeanBenchmarks
{
    private const int Samples = 1_000_000;
    private double[] _x = [];

    [Params("ar1-tau1", "ar1-tau30", "ar1-tau300", "hum", "drift")]
    public string Series { get; set; } = "ar1-tau1";

    [GlobalSetup]
    public void Setup() => _x = Make(Series, Samples);

    [Benchmark]
    public double Evaluate() => WindowMean.Evaluate(_x).StandardUncertainty;

    /// <summary>The benchmark's series, deterministic (fixed seeds).</summary>
    public static double[] Make(string series, int n)
    {
        var random = new Random(19);
        double Gaussian() => Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());
        var x = new double[n];
        switch (series)
        {
            case "hum":
                for (var i = 0; i < n; i++)
                {
                    x[i] = 20.0 + (0.8 * Math.Sin(2.0 * Math.PI * 50.0 * i / 1000.0)) + Gaussian();
                }
                break;
            case "drift":
                var noise = Ar1(n, Math.Exp(-1.0 / 5.0), Gaussian);
                for (var i = 0; i < n; i++)
                {
                    x[i] = 300.0 + (3.0 * i / n) + noise[i];
                }
                break;
            default:
                var tau = double.Parse(series["ar1-tau".Length..], System.Globalization.CultureInfo.InvariantCulture);
                x = Ar1(n, Math.Exp(-1.0 / tau), Gaussian);
                break;
        }
        return x;
    }

    private static double[] Ar1(int n, double phi, Func<double> gaussian)
    {
        var x = new double[n];
        var state = gaussian() / Math.Sqrt(1.0 - (phi * phi));
        for (var i = 0; i < n; i++)
        {
            x[i] = state;
            state = (phi * state) + gaussian();
        }
        return x;
    }
}
