using BcPrep.Cli;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>Runs bcprep in-process with captured standard output and error.</summary>
internal static class CliRun
{
    public static (int Exit, string Out, string Error) Run(params string[] args)
    {
        using var output = new StringWriter { NewLine = "\n" };
        using var error = new StringWriter { NewLine = "\n" };
        var context = new CliContext(output, error, () => Stream.Null, false, RepoRoot.Path);
        var exit = BcPrepApp.Run(args, context);
        return (exit, output.ToString(), error.ToString());
    }
}
