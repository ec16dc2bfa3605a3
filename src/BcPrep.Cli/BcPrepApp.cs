using System.CommandLine;
using System.Reflection;
using BcPrep.Cli.Commands;

namespace BcPrep.Cli;

/// <summary>
/// Builds the command tree, parses, runs, and maps every failure to one documented exit code. Usage errors are
/// reported on standard error (never help text on standard output), and no exception reaches the user as a
/// stack trace.
/// </summary>
public static class BcPrepApp
{
    public static string Version =>
        typeof(BcPrepApp).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "0.0.0";

    public static int Run(string[] args, CliContext context) => Run(args, context, CommandCatalog.Build);

    /// <summary>Runs with another set of commands: lets tests prove the failure mapping with a command that throws.</summary>
    internal static int Run(string[] args, CliContext context, Func<CommonOptions, CliContext, IEnumerable<Command>> commands)
    {
        var common = new CommonOptions();
        var root = new RootCommand("BcPrep turns a test day's raw logger files into boundary conditions with uncertainties.\n" +
                                   "Example: bcprep process sample-logs/marten-rig.toml sample-logs/*.csv --out out");
        common.AddTo(root);
        VersionAction.Install(root, context);
        HelpWording.Apply(root);
        foreach (var command in commands(common, context))
        {
            root.Subcommands.Add(command);
        }
        // '@file' expansion is switched off: a log file named '@x' must stay a file name.
        var parse = root.Parse(args, new ParserConfiguration { ResponseFileTokenReplacer = null });
        try
        {
            if (parse.Errors.Count > 0)
            {
                throw UsageErrors.From(parse, root);
            }
            return parse.Invoke(new InvocationConfiguration
            {
                Output = IsHelpOrVersion(args) ? context.Out : context.Error,
                Error = context.Error,
                EnableDefaultExceptionHandler = false,
            });
        }
        catch (BcPrepFailure failure)
        {
            foreach (var problem in failure.Problems)
            {
                context.Error.WriteLine("error: " + problem);
            }
            if (failure.Problems.Any(p => p.Location.File == UsageErrors.Location))
            {
                context.Error.WriteLine(UsageErrors.FollowUp(parse.CommandResult.Command, root));
            }
            return ExitCodes.For(failure.Kind);
        }
        catch (BcPrepDataException e)
        {
            context.Error.WriteLine("error: " + e.Message);
            return ExitCodes.BadInputData;
        }
        catch (IOException e) when (IsBrokenPipe(e))
        {
            return ExitCodes.Success;
        }
        catch (Exception e) when (OutOfMemory.Caused(e))
        {
            context.Error.WriteLine(OutOfMemory.Message);
            return ExitCodes.NotEnoughMemory;
        }
        catch (Exception e)
        {
            context.Error.WriteLine($"error: internal error ({e.GetType().Name}): {e.Message}");
            context.Error.WriteLine("This is a bug in bcprep; please report it with the command line that caused it.");
            return ExitCodes.InternalError;
        }
    }

    private static bool IsHelpOrVersion(string[] args) =>
        args.Any(a => a is "--help" or "-h" or "-?" or "--version");

    private static bool IsBrokenPipe(IOException e) =>
        e.HResult == 32 || e.Message.Contains("Broken pipe", StringComparison.OrdinalIgnoreCase);
}
