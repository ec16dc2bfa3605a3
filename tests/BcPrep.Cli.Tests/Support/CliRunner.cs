using System.Text;
using BcPrep.Cli;

namespace BcPrep.Tests.Cli.Support;

/// <summary>What one in-process run of bcprep returned and printed.</summary>
internal sealed record CliRun(int ExitCode, string Out, string Error);

/// <summary>Runs <see cref="BcPrepApp"/> in-process with captured streams (standard error not a terminal).</summary>
internal static class CliRunner
{
    public static CliRun Run(params string[] args) => Run(args, stdin: null);

    public static CliRun Run(string[] args, byte[]? stdin, bool errorIsTerminal = false)
    {
        var output = new StringWriter { NewLine = "\n" };
        var error = new StringWriter { NewLine = "\n" };
        var context = new CliContext(output, error, () => new MemoryStream(stdin ?? []), errorIsTerminal, Directory.GetCurrentDirectory());
        var code = BcPrepApp.Run(args, context);
        return new CliRun(code, output.ToString(), error.ToString());
    }

    public static CliRun Run(string[] args, Func<BcPrep.Cli.CommonOptions, CliContext, IEnumerable<System.CommandLine.Command>> commands)
    {
        var output = new StringWriter { NewLine = "\n" };
        var error = new StringWriter { NewLine = "\n" };
        var context = new CliContext(output, error, () => new MemoryStream(), false, Directory.GetCurrentDirectory());
        var code = BcPrepApp.Run(args, context, commands);
        return new CliRun(code, output.ToString(), error.ToString());
    }

    public static byte[] Utf8(string text) => new UTF8Encoding(false).GetBytes(text);
}
