using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>Quiet on success, --quiet/--verbose, progress only on a terminal, no colour off a terminal or with NO_COLOR.</summary>
[Collection(EnvironmentCollection.Name)]
public sealed class StreamsAndTerminalTests
{
    [Fact]
    public void Process_on_success_prints_nothing_at_normal_verbosity_and_steps_with_verbose()
    {
        using var temp = new TempFolder();

        var normal = CliRunner.Run(SampleDay.ProcessArgs(temp.File("a")));
        var verbose = CliRunner.Run(SampleDay.ProcessArgs(temp.File("b"), "--verbose"));
        var quietUpToDate = CliRunner.Run(SampleDay.ProcessArgs(temp.File("b"), "--quiet"));

        Assert.Equal((0, "", ""), (normal.ExitCode, normal.Out, normal.Error));
        Assert.Equal(0, verbose.ExitCode);
        Assert.Equal("", verbose.Out);
        Assert.Contains("reading 2 log file(s)", verbose.Error, StringComparison.Ordinal);
        Assert.Contains("wrote 3 operating point(s), 17 files", verbose.Error, StringComparison.Ordinal);
        Assert.Equal((0, "", ""), (quietUpToDate.ExitCode, quietUpToDate.Out, quietUpToDate.Error));
    }

    [Fact]
    public void Quiet_still_prints_errors()
    {
        using var temp = new TempFolder();

        var run = CliRunner.Run("process", "--quiet", SampleDay.Rig, temp.File("absent.csv"), "--out", temp.File("out"));

        Assert.Equal(3, run.ExitCode);
        Assert.StartsWith("error: ", run.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Warnings_are_coloured_only_on_a_terminal_without_NO_COLOR()
    {
        var previous = Environment.GetEnvironmentVariable("NO_COLOR");
        try
        {
            Environment.SetEnvironmentVariable("NO_COLOR", null);
            Assert.Equal("\u001b[33mwarning: \u001b[0mgap bridged\n", Warn(terminal: true));
            Assert.Equal("warning: gap bridged\n", Warn(terminal: false));
            Environment.SetEnvironmentVariable("NO_COLOR", "1");
            Assert.Equal("warning: gap bridged\n", Warn(terminal: true));
        }
        finally
        {
            Environment.SetEnvironmentVariable("NO_COLOR", previous);
        }
    }

    [Fact]
    public void Progress_line_is_drawn_and_erased_on_a_terminal_only()
    {
        var terminal = new StringWriter();
        var pipe = new StringWriter();
        var quiet = new StringWriter();

        RunLongWork(Context(terminal, terminal: true), Verbosity.Normal);
        RunLongWork(Context(pipe, terminal: false), Verbosity.Normal);
        RunLongWork(Context(quiet, terminal: true), Verbosity.Quiet);

        var drawn = terminal.ToString();
        Assert.StartsWith("\rworking: 0 s", drawn, StringComparison.Ordinal);
        Assert.EndsWith("\r" + new string(' ', "working: 0 s".Length) + "\r", drawn, StringComparison.Ordinal);
        Assert.Equal("", pipe.ToString());
        Assert.Equal("", quiet.ToString());
    }

    [Fact]
    public void Progress_line_shows_the_pass_and_share_of_the_logs_read()
    {
        var terminal = new StringWriter();
        var reading = new BcPrep.Reading.ReadProgress(2000);
        reading.StartPass();
        reading.Advance(500);

        using (new ProgressIndicator(Context(terminal, terminal: true), Verbosity.Normal, "working", 2000, TimeSpan.Zero, TimeSpan.FromSeconds(10), reading.Describe))
        {
        }

        Assert.StartsWith("\rworking: pass 1, 25 %, 0 s", terminal.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Short_work_on_a_terminal_shows_no_progress_line()
    {
        var terminal = new StringWriter();

        using (new ProgressIndicator(Context(terminal, terminal: true), Verbosity.Normal, "working", 1000, ProgressIndicator.LongWorkDelay, TimeSpan.FromMilliseconds(10)))
        {
            Thread.Sleep(50);
        }

        Assert.Equal("", terminal.ToString());
        Assert.True(ProgressIndicator.IsWanted(errorIsTerminal: true, Verbosity.Verbose));
        Assert.False(ProgressIndicator.IsWanted(errorIsTerminal: false, Verbosity.Verbose));
    }

    private static void RunLongWork(CliContext context, Verbosity verbosity)
    {
        // A zero delay stands for work already known to be long; 10 ms redraws give the timer a chance to draw.
        using var progress = new ProgressIndicator(context, verbosity, "working", 1000, TimeSpan.Zero, TimeSpan.FromMilliseconds(10));
        Thread.Sleep(200);
    }

    private static string Warn(bool terminal)
    {
        var error = new StringWriter { NewLine = "\n" };
        new Diagnostics(Context(error, terminal), Verbosity.Normal).Warning("gap bridged");
        return error.ToString();
    }

    private static CliContext Context(StringWriter error, bool terminal) =>
        new(new StringWriter(), error, () => new MemoryStream(), terminal, Directory.GetCurrentDirectory());
}
