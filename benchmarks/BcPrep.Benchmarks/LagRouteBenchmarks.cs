using System.Reflection;
using BcPrep.Uncertainty;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Jobs;

namespace BcPrep.Benchmarks;

/// <summary>
/// Where direct lag sums stop paying: the first L lags of a 1 M-sample window (AR(1), τ = 30 samples) summed directly
/// against sectioned correlation with sections of L, for the L around the limit (LazyAutocorrelation.DirectLagLimit).
/// The two are internal to Core, so they are reached through reflection, once, as delegates.
/// </summary>
[MemoryDiagnoser]
[ShortRunJob(RuntimeMoniker.Net10_0)]
public class LagRouteBenchmarks
{
    private delegate void DirectSums(ReadOnlySpan<double> samples, double mean, int firstLag, int endLag, Span<double> sums);
    private delegate void SectionSums(ReadOnlySpan<double> samples, double mean, int blockLength, int firstLag, Span<double> sums);

    private static readonly Assembly Core = typeof(WindowMean).Assembly;
    private static readonly DirectSums Direct = Method<DirectSums>("BcPrep.Uncertainty.DirectLagSums");
    private static readonly SectionSums Sectioned = Method<SectionSums>("BcPrep.Uncertainty.SectionedAutocorrelation");

    private double[] _x = [];
    private double _mean;
    private double[] _sums = [];

    [Params(16, 32, 64, 128, 256)]
    public int Lags { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _x = WindowMeanBenchmarks.Make("ar1-tau30", 1_000_000);
        _mean = _x.Average();
        _sums = new double[Lags];
    }

    [Benchmark(Baseline = true)]
    public double DirectLags()
    {
        Direct(_x, _mean, 1, Lags, _sums);
        return _sums[Lags - 1];
    }

    [Benchmark]
    public double SectionedLags()
    {
        Sectioned(_x, _mean, Lags, 1, _sums);
        return _sums[Lags - 1];
    }

    private static T Method<T>(string type) where T : Delegate =>
        Core.GetType(type, throwOnError: true)!.GetMethod("Compute", BindingFlags.Public | BindingFlags.Static, [.. typeof(T).GetMethod("Invoke")!.GetParameters().Select(p => p.ParameterType)])!.CreateDelegate<T>();
}
