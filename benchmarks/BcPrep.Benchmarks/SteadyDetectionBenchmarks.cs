using BcPrep.Steady;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Jobs;

namespace BcPrep.Benchmarks;

/// <summary>
/// Steady-state detection on the 1 s block means of a 1 kHz × 32-channel × 1 h day (3600 blocks per channel), with
/// the sample rig's settings (5 min test window in 10 s steps, 5 min settled tail). Baseline: three key channels, as
/// a rig file usually names; the other case makes all 32 channels key channels.
/// </summary>
[MemoryDiagnoser]
[ShortRunJob(RuntimeMoniker.Net10_0)]
public class SteadyDetectionBenchmarks
{
    private double[] _timesS = [];
    private KeyChannel[] _channels = [];
    private readonly SteadySettings _settings = new(WindowS: 300, StepS: 10, MinStretchS: 300, TailS: 300);

    [GlobalSetup]
    public void Setup()
    {
        var n = (int)SyntheticDay.DurationS;
        _timesS = [.. Enumerable.Range(0, n).Select(i => i + 0.5)];
        _channels = [.. Enumerable.Range(0, SyntheticDay.Channels).Select(c =>
        {
            var noise = SyntheticDay.Ar1(n, 0.02, 100 + c);
            var values = _timesS.Select((t, i) => SyntheticDay.Level(c, t) + noise[i]).ToArray();
            return new KeyChannel($"ch{c}", values, DriftLimitPerS: 0.3 / 300, ScatterLimit: 0.3, StepThreshold: 2.0);
        })];
    }

    [Benchmark(Baseline = true)]
    public int ThreeKeyChannels() => PlateauDetector.Detect(_timesS, _channels[..3], _settings).Accepted.Count;

    [Benchmark]
    public int ThirtyTwoKeyChannels() => PlateauDetector.Detect(_timesS, _channels, _settings).Accepted.Count;
}
