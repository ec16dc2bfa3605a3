using System.Diagnostics;
using BcPrep.Tests.Cli.Support;
using Xunit.Abstractions;

namespace BcPrep.Tests.Cli;

/// <summary>
/// A logger clock glitch (one row dated far ahead) must not make memory grow with the time it spans: the run is
/// refused naming the line (LogFileReader.MaxDaySpanS, 48 h), and it is run as a real process under a GC heap cap
/// so that unbounded growth fails the test instead of filling the machine.
/// </summary>
public sealed class ClockGlitchTests(ITestOutputHelper output)
{
    /// <summary>256 MB: the sample day runs in well under that; a century of 1 s block means would not fit.</summary>
    private const string HeapCap = "0x10000000";

    [Fact]
    public void A_last_row_dated_a_century_ahead_is_refused_naming_its_line_within_a_256_MB_heap()
    {
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Afternoon);
        lines[^1] = "2126" + lines[^1][4..];
        var pm = temp.File("pm.csv");
        File.WriteAllText(pm, string.Join("\n", lines) + "\n");

        var (code, error) = RunCapped("process", SampleDay.Rig, SampleDay.Morning, pm, "--out", temp.File("out"));

        Assert.True(code == 3, $"exit {code}:\n{error}");
        Assert.Contains($"pm.csv:{lines.Length}:1: timestamp: the time '2126-11-24T11:44:59.500' lies", error, StringComparison.Ordinal);
        Assert.Contains("a log may span at most 48 h", error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(temp.File("out")));
    }

    [Fact]
    public void A_second_log_dated_a_century_ahead_is_refused_naming_its_first_row()
    {
        using var temp = new TempFolder();
        var lines = File.ReadAllLines(SampleDay.Afternoon);
        for (var i = 1; i < lines.Length; i++)
        {
            lines[i] = "2126" + lines[i][4..];
        }
        var pm = temp.File("pm.csv");
        File.WriteAllText(pm, string.Join("\n", lines) + "\n");

        var (code, error) = RunCapped("process", SampleDay.Rig, SampleDay.Morning, pm, "--out", temp.File("out"));

        Assert.True(code == 3, $"exit {code}:\n{error}");
        Assert.Contains("pm.csv:2: timestamp: the file's first row lies", error, StringComparison.Ordinal);
    }

    private (int Code, string Error) RunCapped(params string[] args)
    {
        var info = BuiltBinary.StartInfo(args);
        info.Environment["DOTNET_GCHeapHardLimit"] = HeapCap;
        using var process = Process.Start(info)!;
        process.StandardInput.Close();
        var error = process.StandardError.ReadToEndAsync();
        var stdout = process.StandardOutput.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(3)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail("bcprep did not finish within 3 minutes");
        }
        output.WriteLine($"exit {process.ExitCode}\n{error.Result}");
        Assert.Equal("", stdout.Result);
        return (process.ExitCode, error.Result);
    }
}
