using System.CommandLine;
using System.Globalization;
using BcPrep.Lab;
using BcPrep.Rig;

namespace BcPrep.Cli.Commands;

/// <summary>Options about lab practice shared by the commands: allowed expired calibrations, the date checked against.</summary>
public static class LabOptions
{
    public static Option<string[]> AllowExpired() => new("--allow-expired")
    {
        Description = "Use this channel's data although its calibration due date has passed (repeatable; 'all' for every channel). Recorded in the manifest.",
        HelpName = "CHANNEL",
        Arity = ArgumentArity.ZeroOrMore,
        AllowMultipleArgumentsPerToken = false,
    };

    public static Option<string> Date() => new("--date")
    {
        Description = "Check calibration due dates against this test date (yyyy-mm-dd); expired sensors are then errors. Without it, today's date is used and expired sensors are warnings.",
        HelpName = "DATE",
    };

    public static Option<string> Matrix() => new("--matrix")
    {
        Description = "Test-matrix CSV of planned points; matched operating points take its names (see README, 'The test matrix').",
        HelpName = "FILE",
    };

    /// <summary>Reads and checks a test-matrix file against the rig; every problem is reported with line and column.</summary>
    public static TestMatrix LoadMatrix(string path, RigDescription rig)
    {
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            var reason = Directory.Exists(path) ? "it is a directory, not a file" : e.Message;
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(path), "cannot read the test matrix: " + reason);
        }
        return TestMatrixReader.Parse(text, path, rig);
    }

    /// <summary>Parses a yyyy-mm-dd date given on the command line; a usage error otherwise.</summary>
    public static DateOnly ParseDate(string text) =>
        DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date)
            ? date
            : throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--date"), $"'{text}' is not a date written yyyy-mm-dd");
}
