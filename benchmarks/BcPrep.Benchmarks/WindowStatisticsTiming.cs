using System.Diagnostics;
using System.Globalization;
using BcPrep.Conditioning;
using BcPrep.Pipeline;

namespace BcPrep.Benchmarks;

/// <summary>
/// A Stopwatch harness for <see cref="WindowStatistics.Evaluate"/> on one channel's 1 M-sample window (a 1000 s
/// window at 1 kHz), the size of the wide benchmark day's windows: time per call and bytes allocated per call on the
/// calling thread (<see cref="GC.GetAllocatedBytesForCurrentThread"/>), which is what BenchmarkDotNet's memory
/// diagnoser would report, in a few seconds instead of minutes. The process CPU time per call includes the
/// garbage collector's threads, which wall time on a loaded machine hides or inflates.
/// Run: <c>dotnet run -c Release --project benchmarks/BcPrep.Benchmarks -- window-stats [repeats]</c>.
/// Three windows: clean (evenly spaced, all finite), dropouts (NaN cells and one dropped block, bridged, plus a
/// missing edge), and a long open gap. Each is AR(1) noise with 50 Hz hum and a few spikes.
/// </summary>
internal static class WindowStatisticsTiming
{
    private const int Samples = 1_000_000;
    private const double RateHz = 1000.0;

    public static void Run(int repeats)
    {
        // The rig file's defaults (ConditioningSpec.Default): bridge 2 s, Hampel k = 10, 6 σ.
        var settings = new ConditioningSettings(MaxBridgeS: 2.0, HampelHalfWindow: 10, HampelSigmas: 6.0);
        var limits = new SensorFaultLimits(RailTolerance: 0.001, Resolution: 0.002, PlausibleMin: 0, PlausibleMax: 1000);
        var cases = new (string Name, double[] T, double[] X)[] { Clean(), Dropouts(), LongGap() };
        Console.WriteLine("case       ms/call (min)  ms/call (median)  process CPU ms/call  bytes allocated/call");
        foreach (var (name, t, x) in cases)
        {
            var window = new TimeWindow("OP1", t[0], t[^1]);
            WindowStatistics.Evaluate("x", window, t, x, settings, limits); // JIT and scratch warm-up
            var ms = new List<double>();
            long bytes = 0;
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            for (var r = 0; r < repeats; r++)
            {
                var before = GC.GetAllocatedBytesForCurrentThread();
                var watch = Stopwatch.StartNew();
                WindowStatistics.Evaluate("x", window, t, x, settings, limits);
                watch.Stop();
                bytes = GC.GetAllocatedBytesForCurrentThread() - before;
                ms.Add(watch.Elapsed.TotalMilliseconds);
            }
            var cpuMs = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalMilliseconds / repeats;
            ms.Sort();
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{name,-10} {ms[0],13:F2}  {ms[ms.Count / 2],16:F2}  {cpuMs,19:F2}  {bytes,20:N0}"));
        }
    }

    private static double[] Times(double startS) =>
        [.. Enumerable.Range(0, Samples).Select(i => startS + (i / RateHz))];

    private static double[] Signal(int seed)
    {
        var noise = SyntheticDay.Ar1(Samples, 0.05, seed);
        var x = new double[Samples];
        for (var i = 0; i < Samples; i++)
        {
            x[i] = 101.325 + noise[i] + (0.02 * Math.Sin(2 * Math.PI * 50.0 * i / RateHz));
            if (i % 97_331 == 5_000)
            {
                x[i] += 3.0; // a spike
            }
        }
        return x;
    }

    private static (string, double[], double[]) Clean() => ("clean", Times(30_000.0), Signal(1));

    private static (string, double[], double[]) Dropouts()
    {
        var t = Times(30_000.0).ToList();
        var x = Signal(2).ToList();
        for (var i = 0; i < 3; i++)
        {
            x[i] = double.NaN; // missing at the start edge
        }
        for (var start = 50_000; start < Samples - 1000; start += 100_000)
        {
            for (var j = start; j < start + 40; j++)
            {
                x[j] = double.NaN; // 40 ms dropouts, bridged
            }
        }
        t.RemoveRange(500_000, 200); // a 0.2 s jump in time, bridged
        x.RemoveRange(500_000, 200);
        return ("dropouts", [.. t], [.. x]);
    }

    private static (string, double[], double[]) LongGap()
    {
        var t = Times(30_000.0).ToList();
        var x = Signal(3).ToList();
        t.RemoveRange(300_000, 20_000); // 20 s without samples: too long to bridge, left open
        x.RemoveRange(300_000, 20_000);
        return ("long gap", [.. t], [.. x]);
    }
}
