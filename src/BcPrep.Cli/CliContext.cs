namespace BcPrep.Cli;

/// <summary>
/// The process's streams, injected so that tests run commands in-process. Standard output carries data only;
/// everything meant for a person goes to <see cref="Error"/>.
/// </summary>
public sealed record CliContext(TextWriter Out, TextWriter Error, Func<Stream> OpenStandardInput, bool ErrorIsTerminal, string WorkingDirectory)
{
    // Standard output is unbuffered below the writer: with the writer's default 1 kB buffer, `calibrate`'s 1 GB of
    // rows went out in a million write calls; 64 k characters make it a few thousand.
    public static CliContext FromConsole() => new(
        new StreamWriter(Console.OpenStandardOutput(), new System.Text.UTF8Encoding(false), OutputBufferChars) { AutoFlush = false, NewLine = "\n" },
        Console.Error,
        Console.OpenStandardInput,
        !Console.IsErrorRedirected,
        Directory.GetCurrentDirectory());

    private const int OutputBufferChars = 1 << 16;

    /// <summary>Colour only for a person at a terminal who has not asked for none (NO_COLOR convention).</summary>
    public bool UseColour => ErrorIsTerminal && string.IsNullOrEmpty(Environment.GetEnvironmentVariable("NO_COLOR"));
}
