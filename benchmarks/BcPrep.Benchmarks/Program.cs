using BenchmarkDotNet.Running;

namespace BcPrep.Benchmarks;

/// <summary>
/// Runs the benchmarks: <c>dotnet run -c Release --project benchmarks/BcPrep.Benchmarks -- --filter '*'</c>
/// (or a class name, e.g. <c>--filter '*SteadyDetection*'</c>). Results go to BENCHMARKS.md by hand, with the machine.
/// <c>-- window-mean-cpu [ROUNDS] [CALLS]</c> prints the CPU time of one window mean per series instead (for a shared machine).
/// <c>-- window-stats</c> runs <see cref="WindowStatisticsTiming"/>.
/// </summary>
internal static class Program
{
    private static void Main(string[] args)
    {
        if (args.Length > 0 && args[0] == "window-stats")
        {
            WindowStatisticsTiming.Run(args.Length > 1 ? int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture) : 9);
            return;
        }
        if (args.Length > 0 && args[0] == "window-mean-cpu")
        {
            WindowMeanCpuTime.Run(args.Length > 1 ? int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture) : 7,
                args.Length > 2 ? int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture) : 5);
            return;
        }
        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}
