namespace BcPrep.Cli;

internal static class Program
{
    private static int Main(string[] args)
    {
        var context = CliContext.FromConsole();
        var code = BcPrepApp.Run(args, context);
        try
        {
            context.Out.Flush();
        }
        catch (IOException)
        {
            // A closed downstream pipe (e.g. `| head`) is not an error of ours.
        }
        return code;
    }
}
