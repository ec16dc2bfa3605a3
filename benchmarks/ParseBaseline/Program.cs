using System.Globalization;
using CsvHelper;

namespace BcPrep.Benchmarks.ParseBaseline;

/// <summary>
/// The baseline of the whole-run benchmark: parse every numeric field of a log with the same CSV reader and
/// options as BcPrep, and nothing else. Prints the sum of the values so the work cannot be optimised away.
/// Usage: parse-baseline FILE [separator]
/// </summary>
internal static class Program
{
    private static int Main(string[] args)
    {
        var separator = args.Length > 1 ? args[1][0] : ',';
        using var csv = CsvReader.Create(File.OpenRead(args[0]), new CsvReaderOptions
        {
            Separator = separator,
            HasHeader = true,
            TrackLineNumbers = true,
            FormatProvider = CultureInfo.InvariantCulture,
        });
        var fields = csv.Headers.Count;
        var sum = 0.0;
        long rows = 0;
        while (csv.Read())
        {
            for (var i = 0; i < fields; i++)
            {
                if (csv.TryParse<double>(i, out var value))
                {
                    sum += value;
                }
            }
            rows++;
        }
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{rows} rows, checksum {sum:R}"));
        return 0;
    }
}
