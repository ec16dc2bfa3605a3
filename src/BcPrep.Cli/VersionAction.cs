using System.CommandLine;
using System.CommandLine.Invocation;

namespace BcPrep.Cli;

/// <summary>
/// <c>bcprep --version</c>: the tool version on standard output, the same string the manifest records (without the
/// build's source-revision suffix, which would make scripts that compare versions see a change on every commit).
/// </summary>
internal sealed class VersionAction(CliContext context) : SynchronousCommandLineAction
{
    public override int Invoke(ParseResult parseResult)
    {
        context.Out.Write(BcPrepApp.Version + "\n");
        return ExitCodes.Success;
    }

    /// <summary>Replaces the default version action of <paramref name="root"/>.</summary>
    public static void Install(RootCommand root, CliContext context)
    {
        foreach (var option in root.Options.OfType<VersionOption>())
        {
            option.Action = new VersionAction(context);
        }
    }
}
