using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// Logs that are not plain files: a pipe from process substitution and a named FIFO are read once into a temporary
/// copy, like standard input, and give the same tables as the files themselves; a log given twice is a usage error.
/// </summary>
public sealed class PipeLogTests
{
    private static readonly TimeSpan Timeout = TimeSpan.FromMinutes(4);

    [Fact]
    public void Process_substitution_and_a_named_fifo_are_read_like_the_files_themselves()
    {
        using var temp = new TempFolder();
        Assert.Equal(0, CliRunner.Run(SampleDay.ProcessArgs(temp.File("files"))).ExitCode);
        string Q(string s) => BuiltBinary.Quote(s);
        var script =
            $"cd {Q(temp.Path)}\n" +
            $"bcprep process {Q(SampleDay.Rig)} <(cat {Q(SampleDay.Morning)}) <(gzip -c {Q(SampleDay.Afternoon)}) --out substituted || exit 11\n" +
            $"mkfifo pm.fifo\n(cat {Q(SampleDay.Afternoon)} > pm.fifo &)\n" +
            $"timeout 120 bash -c 'bcprep process {SampleDay.Rig} {SampleDay.Morning} pm.fifo --out fifo' || exit 12\n";

        var (code, _, error) = BuiltBinary.Bash(script, Timeout);

        Assert.True(code == 0, $"exit {code}:\n{error}");
        var expected = Tables(temp.File("files"));
        Assert.Equal(expected, Tables(temp.File("substituted")));
        Assert.Equal(expected, Tables(temp.File("fifo")));
    }

    [Fact]
    public void One_log_given_20000_times_is_a_usage_error_naming_it()
    {
        using var temp = new TempFolder();

        var run = CliRunner.Run(["process", SampleDay.Rig, .. Enumerable.Repeat(SampleDay.Morning, 20000), "--out", temp.File("out")]);

        Assert.Equal(2, run.ExitCode);
        Assert.Contains($"error: (command line): {SampleDay.Morning}: the log '{SampleDay.Morning}' is given more than once (LOG arguments 1 and 2)", run.Error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(temp.File("out")));
    }

    private static string Tables(string outDir) =>
        string.Join("\n", Directory.GetFiles(outDir, "*.csv", SearchOption.AllDirectories).Order(StringComparer.Ordinal)
            .Select(f => Path.GetRelativePath(outDir, f) + "\n" + File.ReadAllText(f)));
}
