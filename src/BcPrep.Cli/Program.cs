namespace BcPrep.Cli;

internal static class Program
{
    private static int Main(string[] args) => args.Length >= 0 ? 0 : 1;
}
