using System.CommandLine;
using System.Globalization;

namespace BcPrep.Cli.Commands;

/// <summary>Options about lab practice shared by the commands: allowed expired calibrations, the date checked against.</summary>
public static class LabOptions
{
    public static Option<string[]> AllowExpired() => new("--allow-expired")
    {
        Description = "Use this channel's data although its calibration due date has passed (repeatable; 'all' for every channel). Recorded in the manifest.",
        Arity = ArgumentArity.ZeroOrMore,
        AllowMultipleArgumentsPerToken = false,
    };

    public static Option<string> Date() => new("--date")
    {
        Description = "Check calibration due dates against this test date (yyyy-mm-dd); expired sensors are then errors. Without it, today's date is used and expired sensors are warnings.",
    };

    /// <summary>Parses a yyyy-mm-dd date given on the command line; a usage error otherwise.</summary>
    public static DateOnly ParseDate(string text) =>
        DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date)
            ? date
            : throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--date"), $"'{text}' is not a date written yyyy-mm-dd");
}
