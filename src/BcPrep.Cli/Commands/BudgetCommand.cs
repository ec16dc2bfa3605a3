using System.CommandLine;
using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep budget RIG LOG…</c>: the uncertainty budgets of a day's points as CSV on standard output.</summary>
public static class BudgetCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var reduction = ReductionOptions.WithoutMonteCarlo();
        var point = PointSelection.Option();
        var quantity = new Option<string?>("--quantity") { Description = "Only this quantity (e.g. inlet.temperature, or a profile point inlet.velocity.3).", HelpName = "NAME" };
        var command = new Command("budget", "Write every input's sensitivity, contribution and share of variance in each quantity as CSV to standard output.\n" +
                                            "Example: bcprep budget sample-logs/marten-rig.toml sample-logs/*.csv --point OP1 --quantity inlet.temperature")
        {
            rig, logs, point, quantity,
        };
        reduction.AddTo(command);
        command.SetAction(parse =>
        {
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            common.DiagnosticsFor(parse, context).Detail($"reading {inputs.Inputs.Count} log file(s)");
            var day = DayProcessor.Process(description, inputs.Inputs, reduction.Read(parse, description));
            var points = PointSelection.Select(day, parse.GetValue(point));
            var only = parse.GetValue(quantity);
            if (only is not null && !points.Any(p => p.OutputIndex(only) >= 0))
            {
                throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--quantity"),
                    $"no quantity '{only}'; the scalars are: {string.Join(", ", points[0].Model.Outputs.Where(o => o.Kind != QuantityKind.ProfilePoint).Select(o => o.Name))}, and {ProfileOutputs.Velocity(0)} … {ProfileOutputs.Velocity(points[0].Model.ProfileRadiiM.Length - 1)}");
            }

            Func<string, bool>? filter = only is null ? null : name => name == only;
            var table = BoundaryTables.Budget(points[0], includeProfile: only is not null, filter);
            foreach (var next in points.Skip(1))
            {
                table.Append(BoundaryTables.Budget(next, includeProfile: only is not null, filter));
            }

            context.Out.Write(table.ToString());
            return ExitCodes.Success;
        });
        return command;
    }
}
