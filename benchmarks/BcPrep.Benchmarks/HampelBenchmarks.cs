using BcPrep.Conditioning;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Jobs;

namespace BcPrep.Benchmarks;

/// <summary>
/// The Hampel filter on one window's samples, as the window statistics run it: 1.03 M samples (17 min at 1 kHz), the
/// rig default k = 10 and 6 σ, no floor, and the general k = 25 for comparison. Series: AR(1) noise on a level with one
/// spike in 5000 samples ("noise"), or the same noise quantised to a step of one standard deviation ("ties", where
/// many windows have tied medians). Baseline: one pass that sums the samples, the cost of touching them at all.
/// <c>ApplyInto</c> is the window statistics' form, writing into a reused buffer.
/// </summary>
[MemoryDiagnoser]
[ShortRunJob(RuntimeMoniker.Net10_0)]
public class HampelBenchmarks
{
    private const int Samples = 1_030_000;
    private double[] _x = [];
    private double[] _output = [];

    [Params("noise", "ties")]
    public string Series { get; set; } = "noise";

    [Params(10, 25)]
    public int HalfWindow { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var noise = SyntheticDay.Ar1(Samples, 0.02, 7);
        _x = new double[Samples];
        _output = new double[Samples];
        for (var i = 0; i < Samples; i++)
        {
            var v = Series == "ties" ? 0.02 * Math.Round(noise[i] / 0.02) : noise[i];
            _x[i] = 300.0 + v + (i % 5000 == 1234 ? 1.0 : 0.0);
        }
    }

    [Benchmark(Baseline = true)]
    public double SumOnly()
    {
        var total = 0.0;
        foreach (var v in _x)
        {
            total += v;
        }
        return total;
    }

    [Benchmark]
    public int Apply() => HampelFilter.Apply(_x, HalfWindow, 6.0, 0.0).ReplacedIndices.Count;

    /// <summary>The window statistics' entry point: the same filter into a reused buffer.</summary>
    [Benchmark]
    public int ApplyInto() => HampelFilter.ApplyInto(_x, _output, HalfWindow, 6.0, 0.0).Count;
}
