namespace BcPrep.Cli;

/// <summary>Verbosity of messages on standard error.</summary>
public enum Verbosity
{
    Quiet,
    Normal,
    Verbose,
}

/// <summary>Writes messages for a person to standard error, at the chosen verbosity.</summary>
public sealed class Diagnostics(CliContext context, Verbosity verbosity)
{
    public Verbosity Verbosity { get; } = verbosity;

    public void Info(string message)
    {
        if (Verbosity >= Verbosity.Normal)
        {
            context.Error.WriteLine(message);
        }
    }

    public void Detail(string message)
    {
        if (Verbosity >= Verbosity.Verbose)
        {
            context.Error.WriteLine(message);
        }
    }

    public void Warning(string message)
    {
        if (Verbosity >= Verbosity.Normal)
        {
            context.Error.WriteLine(Paint("warning: ", "33") + message);
        }
    }

    /// <summary>Errors are printed whatever the verbosity.</summary>
    public void Error(string message) => context.Error.WriteLine(Paint("error: ", "31") + message);

    private string Paint(string text, string code) => context.UseColour ? $"\u001b[{code}m{text}\u001b[0m" : text;
}
