using BcPrep.Pipeline;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Jobs;

namespace BcPrep.Benchmarks;

/// <summary>
/// Accumulation of 1 s block means from a 1 kHz × 32-channel × 1 h day: 3.6e6 rows × 32 channels handed over in
/// blocks of <see cref="DayScan.BlockRows"/> rows per channel, as the day scan does. Baseline: the same loop that
/// only sums the values, i.e. the cost of touching the data at all.
/// </summary>
[MemoryDiagnoser]
[ShortRunJob(RuntimeMoniker.Net10_0)]
public class BlockMeanBenchmarks
{
    private const int Rows = 3_600_000;
    private const double RateHz = 1000.0;
    private double[] _timesS = [];
    private double[][] _values = [];
    private readonly string[] _ids = [.. Enumerable.Range(0, SyntheticDay.Channels).Select(c => $"ch{c}")];

    [GlobalSetup]
    public void Setup()
    {
        _timesS = [.. Enumerable.Range(0, Rows).Select(i => i / RateHz)];
        // One block of noise per channel, reused for every block: the values do not change the cost.
        _values = [.. Enumerable.Range(0, SyntheticDay.Channels).Select(c => SyntheticDay.Ar1(DayScan.BlockRows, 0.02, c))];
    }

    [Benchmark(Baseline = true)]
    public double SumOnly()
    {
        var total = 0.0;
        for (var start = 0; start < Rows; start += DayScan.BlockRows)
        {
            var count = Math.Min(DayScan.BlockRows, Rows - start);
            for (var c = 0; c < _values.Length; c++)
            {
                var values = _values[c].AsSpan(0, count);
                var times = _timesS.AsSpan(start, count);
                for (var i = 0; i < count; i++)
                {
                    total += values[i] + times[i];
                }
            }
        }
        return total;
    }

    [Benchmark]
    public int BlockMeanSink()
    {
        var sink = new BlockMeanSink(0.0, 1.0);
        for (var start = 0; start < Rows; start += DayScan.BlockRows)
        {
            var count = Math.Min(DayScan.BlockRows, Rows - start);
            for (var c = 0; c < _values.Length; c++)
            {
                sink.Accept(_ids[c], _timesS.AsSpan(start, count), _values[c].AsSpan(0, count));
            }
        }
        return sink.Length;
    }
}
