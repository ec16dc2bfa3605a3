using System.Globalization;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>The same inputs give byte-identical outputs, whatever the folder, the time of day or the current culture.</summary>
[Collection(EnvironmentCollection.Name)]
public sealed class DeterminismTests
{
    [Fact]
    public void Processing_the_sample_day_twice_gives_byte_identical_files_also_under_a_decimal_comma_culture()
    {
        using var temp = new TempFolder();
        var first = CliRunner.Run(SampleDay.ProcessArgs(temp.File("first")));
        var previous = CultureInfo.CurrentCulture;
        CliRun second;
        try
        {
            // The build runs with invariant globalization, so de-DE itself cannot be created; this culture has its
            // number format (decimal comma, '.' grouping) and is what any culture-sensitive formatting would pick up.
            var germanNumbers = (CultureInfo)CultureInfo.InvariantCulture.Clone();
            germanNumbers.NumberFormat.NumberDecimalSeparator = ",";
            germanNumbers.NumberFormat.NumberGroupSeparator = ".";
            CultureInfo.CurrentCulture = germanNumbers;
            CultureInfo.CurrentUICulture = germanNumbers;
            Assert.Equal("0,5", 0.5.ToString(CultureInfo.CurrentCulture));
            second = CliRunner.Run(SampleDay.ProcessArgs(temp.File("second")));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
            CultureInfo.CurrentUICulture = previous;
        }

        Assert.Equal(0, first.ExitCode);
        Assert.Equal(0, second.ExitCode);
        var a = SampleDay.Snapshot(temp.File("first"));
        var b = SampleDay.Snapshot(temp.File("second"));
        Assert.Equal(17, a.Count);
        Assert.Equal(a.Keys, b.Keys);
        foreach (var (path, bytes) in a)
        {
            Assert.True(bytes.AsSpan().SequenceEqual(b[path]), $"{path} differs between the two runs: {FirstDifference(bytes, b[path])}");
        }
        Assert.DoesNotContain(a.Keys, k => k.Contains(".partial-", StringComparison.Ordinal));
    }

    private static string FirstDifference(byte[] a, byte[] b)
    {
        var left = System.Text.Encoding.UTF8.GetString(a).Split('\n');
        var right = System.Text.Encoding.UTF8.GetString(b).Split('\n');
        var line = Enumerable.Range(0, Math.Min(left.Length, right.Length)).FirstOrDefault(i => left[i] != right[i], -1);
        return line < 0 ? "lengths differ" : $"line {line + 1}: '{left[line].Trim()}' vs '{right[line].Trim()}'";
    }
}
