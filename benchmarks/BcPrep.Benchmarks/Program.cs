using BenchmarkDotNet.Running;

namespace BcPrep.Benchmarks;

/// <summary>
/// Runs the benchmarks: <c>dotnet run -c Release --project benchmarks/BcPrep.Benchmarks -- --filter '*'</c>
/// (or a class name, e.g. <c>--filter '*SteadyDetection*'</c>). Results go to BENCHMARKS.md by hand, with the machine.
/// </summary>
internal static class Program
{
    private static void Main(string[] args) => BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
}
