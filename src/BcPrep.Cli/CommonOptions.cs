using System.CommandLine;

namespace BcPrep.Cli;

/// <summary>Options every command takes.</summary>
public sealed class CommonOptions
{
    public Option<bool> Quiet { get; } = new("--quiet", "-q") { Description = "Print nothing on standard error but errors.", Recursive = true };

    public Option<bool> Verbose { get; } = new("--verbose", "-v") { Description = "Explain each step on standard error.", Recursive = true };

    public void AddTo(Command root)
    {
        root.Options.Add(Quiet);
        root.Options.Add(Verbose);
    }

    public Diagnostics DiagnosticsFor(ParseResult parse, CliContext context)
    {
        if (parse.GetValue(Quiet) && parse.GetValue(Verbose))
        {
            // Either choice would ignore half of what was asked for.
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--quiet"), "--quiet and --verbose contradict each other: give one of them");
        }
        return new(context, parse.GetValue(Quiet) ? Verbosity.Quiet : parse.GetValue(Verbose) ? Verbosity.Verbose : Verbosity.Normal);
    }
}
