using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// Running out of memory is the machine's limit, not a bug: exit 71 with our own words, never the runtime's message
/// under "internal error" (which is how the 1 h 1 kHz benchmark day ended under a 64 MB heap limit before).
/// </summary>
public sealed class OutOfMemoryTests
{
    [Fact]
    public void Running_out_of_memory_during_process_exits_71_with_its_own_words_and_writes_nothing()
    {
        using var temp = new TempFolder();
        var outDir = temp.File("out");
        var output = new StringWriter { NewLine = "\n" };
        var error = new StringWriter { NewLine = "\n" };
        // The log comes from standard input, whose opening is where this run runs out of memory.
        var context = new CliContext(output, error, () => throw new OutOfMemoryException(), false, Directory.GetCurrentDirectory());

        var code = BcPrepApp.Run(["process", SampleDay.Rig, "-", "--out", outDir], context);

        Assert.Equal(ExitCodes.NotEnoughMemory, code);
        Assert.Equal(71, code);
        Assert.Equal("", output.ToString());
        var line = Assert.Single(error.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith("error: not enough memory:", line, StringComparison.Ordinal);
        Assert.Contains("Large days", line, StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", line, StringComparison.Ordinal);
        Assert.DoesNotContain("System.", line, StringComparison.Ordinal);
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void Out_of_memory_inside_parallel_work_is_recognised_and_other_failures_are_not()
    {
        Assert.True(OutOfMemory.Caused(new OutOfMemoryException()));
        Assert.True(OutOfMemory.Caused(new AggregateException(new InvalidOperationException(), new OutOfMemoryException())));
        Assert.True(OutOfMemory.Caused(new InvalidOperationException("wrapped", new AggregateException(new OutOfMemoryException()))));
        Assert.False(OutOfMemory.Caused(new InvalidOperationException("a bug")));
        Assert.False(OutOfMemory.Caused(new AggregateException(new ArgumentException())));
    }
}
