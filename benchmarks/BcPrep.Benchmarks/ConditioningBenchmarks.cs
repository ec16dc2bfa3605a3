using BcPrep.Conditioning;
using BenchmarkDotNet.Attributes;

namespace BcPrep.Benchmarks;

/// <summary>
/// Conditioning of a 1 kHz, 32-channel stream (gap bridging, Hampel 10 / 4σ, 50 Hz notch with 2 harmonics, 4th-order
/// 20 Hz low-pass, zero phase) fed in logger blocks of 8192 rows through <see cref="StreamingConditioner"/>, output
/// taken after every block as a writer would. Samples are synthesised on the fly, so the benchmark measures the
/// conditioning, not the disk. The two durations show time and allocation growing in proportion to length;
/// allocation is per chunk and short-lived (chunk-sized arrays on the large-object heap, hence the Gen2 counts),
/// while the memory held stays at one chunk plus overlap per channel. BENCHMARKS.md records the end-to-end check
/// of that: the same heap limit suffices for a 10 min and a 60 min day.
/// </summary>
[MemoryDiagnoser]
public class ConditioningBenchmarks
{
    private const double RateHz = 1000.0;
    private const int Block = 8192;
    private readonly double[] _t = new double[Block];
    private readonly double[] _x = new double[Block];

    [Params(32)]
    public int Channels { get; set; }

    [Params(15, 60)]
    public int Minutes { get; set; }

    [Benchmark]
    public long ConditionDay()
    {
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 4.0, LowPassCutoffHz: 20.0, MainsHz: 50.0, NotchHarmonics: 3);
        var conditioners = Enumerable.Range(0, Channels).Select(_ => new StreamingConditioner(settings)).ToArray();
        var total = (long)(Minutes * 60 * RateHz);
        long emitted = 0;
        ulong state = 88172645463325252UL;
        for (long start = 0; start < total; start += Block)
        {
            var n = (int)Math.Min(Block, total - start);
            for (var c = 0; c < conditioners.Length; c++)
            {
                for (var i = 0; i < n; i++)
                {
                    var t = (start + i) / RateHz;
                    state ^= state << 13;
                    state ^= state >> 7;
                    state ^= state << 17;
                    _t[i] = t;
                    _x[i] = 100.0 + c + (0.5 * Math.Sin(2 * Math.PI * 50.0 * t)) + ((state >> 11) * (1.0 / (1UL << 53)));
                }
                var s = conditioners[c];
                s.Push(_t.AsSpan(0, n), _x.AsSpan(0, n));
                emitted += s.OutputValues.Count;
                s.OutputTimesS.Clear();
                s.OutputValues.Clear();
            }
        }
        foreach (var s in conditioners)
        {
            s.Complete();
            emitted += s.OutputValues.Count;
        }
        return emitted;
    }
}
