using BcPrep.Cli;
using BcPrep.Cli.Commands;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>`bcprep --version` and every command's help (an example for each).</summary>
public sealed class HelpAndVersionTests
{
    public static TheoryData<string> CommandNames()
    {
        var context = new CliContext(TextWriter.Null, TextWriter.Null, () => Stream.Null, false, ".");
        var data = new TheoryData<string>();
        foreach (var command in CommandCatalog.Build(new CommonOptions(), context))
        {
            data.Add(command.Name);
        }
        return data;
    }

    [Fact]
    public void Version_is_printed_on_stdout()
    {
        var run = CliRunner.Run("--version");

        Assert.Equal(0, run.ExitCode);
        Assert.Equal("0.1.0\n", run.Out.Replace("\r\n", "\n", StringComparison.Ordinal));
        Assert.Equal(BcPrepApp.Version + "\n", run.Out.Replace("\r\n", "\n", StringComparison.Ordinal));
        Assert.Equal("", run.Error);
    }

    [Theory]
    [MemberData(nameof(CommandNames))]
    public void Every_command_help_opens_with_a_sentence_and_gives_an_example(string name)
    {
        var run = CliRunner.Run(name, "--help");

        Assert.Equal(0, run.ExitCode);
        Assert.Equal("", run.Error);
        Assert.Contains("Example: bcprep " + name + " ", run.Out, StringComparison.Ordinal);
        Assert.Contains("--quiet", run.Out, StringComparison.Ordinal);
        var description = run.Out.TrimStart().Split('\n')[1].Trim();
        Assert.Matches(@"^[A-Z].*\.$", description);
    }

    [Fact]
    public void Root_help_gives_an_example_and_lists_every_command()
    {
        var run = CliRunner.Run("--help");

        Assert.Equal(0, run.ExitCode);
        Assert.Contains("Example: bcprep process", run.Out, StringComparison.Ordinal);
        foreach (var name in new[] { "check", "process", "calibrate" })
        {
            Assert.Contains("  " + name + " ", run.Out, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Data_printing_commands_offer_json()
    {
        Assert.Contains("--json", CliRunner.Run("calibrate", "--help").Out, StringComparison.Ordinal);
    }
}
