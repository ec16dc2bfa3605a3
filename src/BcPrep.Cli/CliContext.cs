namespace BcPrep.Cli;

/// <summary>
/// The process's streams, injected so that tests run commands in-process. Standard output carries data only;
/// everything meant for a person goes to <see cref="Error"/>.
/// </summary>
public sealed record CliContext(TextWriter Out, TextWriter Error, Func<Stream> OpenStandardInput, bool ErrorIsTerminal, string WorkingDirectory)
{
    public static CliContext FromConsole() => new(
        new StreamWriter(Console.OpenStandardOutput(), new System.Text.UTF8Encoding(false)) { AutoFlush = false, NewLine = "\n" },
        Console.Error,
        Console.OpenStandardInput,
        !Console.IsErrorRedirected,
        Directory.GetCurrentDirectory());

    /// <summary>Colour only for a person at a terminal who has not asked for none (NO_COLOR convention).</summary>
    public bool UseColour => ErrorIsTerminal && string.IsNullOrEmpty(Environment.GetEnvironmentVariable("NO_COLOR"));
}
