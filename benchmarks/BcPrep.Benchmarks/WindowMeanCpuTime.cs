using System.Diagnostics;
using BcPrep.Uncertainty;

namespace BcPrep.Benchmarks;

/// <summary>
/// CPU time (not wall time) of WindowMean.Evaluate per series, for a machine shared with other work: the process's
/// processor time over repeated calls after a warm-up, the median of several rounds.
/// </summary>
public static class WindowMeanCpuTime
{
    public static void Run(int rounds, int calls)
    {
        foreach (var series in new[] { "ar1-tau1", "ar1-tau30", "ar1-tau300", "hum", "drift" })
        {
            var x = WindowMeanBenchmarks.Make(series, 1_000_000);
            var r = WindowMean.Evaluate(x);
            var times = new List<double>();
            for (var round = 0; round < rounds; round++)
            {
                var start = Process.GetCurrentProcess().TotalProcessorTime;
                for (var c = 0; c < calls; c++)
                {
                    r = WindowMean.Evaluate(x);
                }
                times.Add((Process.GetCurrentProcess().TotalProcessorTime - start).TotalMilliseconds / calls);
            }
            times.Sort();
            Console.WriteLine($"{series,-11} cut-off {r.CutoffLag,7}  CPU {times[times.Count / 2],8:F2} ms/call (min {times[0]:F2}, max {times[^1]:F2})");
        }
    }
}
