using System.CommandLine;
using BcPrep.Pipeline;

namespace BcPrep.Cli.Commands;

/// <summary>The --point option shared by the commands that report on processed operating points.</summary>
public static class PointSelection
{
    public static Option<string?> Option(bool required = false) => new("--point")
    {
        Description = "The operating point, by its id (as in summary.csv, e.g. OP1)" + (required ? "." : "; default: every point."),
        Required = required,
        HelpName = "ID",
    };

    /// <summary>Every point, or the one named; an unknown id is a usage error that lists the day's points.</summary>
    public static IReadOnlyList<PointResult> Select(DayResult day, string? id)
    {
        if (id is null)
        {
            return day.Points;
        }

        var found = day.Points.Where(p => p.Id == id).ToList();
        if (found.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--point"),
                $"no operating point '{id}' on this day; it has: {string.Join(", ", day.Points.Select(p => p.Id))}");
        }

        return found;
    }
}
