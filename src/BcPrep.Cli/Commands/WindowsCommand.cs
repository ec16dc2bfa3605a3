using System.CommandLine;
using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary>
/// <c>bcprep windows RIG LOG…</c>: the steady windows that <c>process</c> would average, as CSV on standard output,
/// with the evidence that accepted each (and, with --all, why every other stretch was rejected).
/// </summary>
public static class WindowsCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var all = new Option<bool>("--all", "-a") { Description = "Also list the rejected stretches, each with the criterion that failed, its value and its limit." };
        var command = new Command("windows", "Detect the steady operating-point windows of a test day and write them, with their evidence, as CSV to standard output.\n" +
                                             "Example: bcprep windows sample-logs/marten-rig.toml sample-logs/*.csv --all")
        {
            rig, logs, all,
        };
        command.SetAction(parse =>
        {
            var diagnostics = common.DiagnosticsFor(parse, context);
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var day = WindowFinder.Find(description, inputs.Inputs);
            if (day.Detection.Accepted.Count == 0)
            {
                // The table of rejected stretches is still data worth having; the report goes to standard error.
                if (parse.GetValue(all))
                {
                    context.Out.Write(WindowTable.Build(description, day, includeRejected: true).ToString());
                }
                throw new BcPrepFailure(FailureKind.NoSteadyPoint, WindowFinder.NoSteadyProblems(description, day.Detection));
            }
            context.Out.Write(WindowTable.Build(description, day, parse.GetValue(all)).ToString());
            diagnostics.Detail(string.Create(CultureInfo.InvariantCulture,
                $"{day.Detection.Accepted.Count} window(s) accepted, {day.Detection.Rejected.Count} stretch(es) rejected, from {day.Blocks.TimesS.Length} blocks of {description.Steady.BlockS} s"));
            return ExitCodes.Success;
        });
        return command;
    }
}
