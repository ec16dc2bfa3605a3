using System.CommandLine;
using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep covariance RIG LOG…</c>: the GUM covariance of the boundary-condition scalars as CSV on standard output.</summary>
public static class CovarianceCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var reduction = ReductionOptions.WithoutMonteCarlo();
        var point = PointSelection.Option();
        // Not "--matrix": that names the test-matrix file, a result-changing option this command shares with process.
        var square = new Option<bool>("--square") { Description = "Write a square matrix per point instead of one row per pair." };
        var correlation = new Option<bool>("--correlation") { Description = "In the square layout, write correlation coefficients instead of covariances (the long layout always has both)." };
        var profile = new Option<bool>("--include-profile") { Description = "Also include every inlet profile point (inlet.velocity.N)." };
        var command = new Command("covariance", "Write the covariance (and correlation) of every scalar boundary-condition quantity of each point as CSV to standard output.\n" +
                                                "Example: bcprep covariance sample-logs/marten-rig.toml sample-logs/*.csv --point OP1 --square --correlation")
        {
            rig, logs, point, square, correlation, profile,
        };
        reduction.AddTo(command);
        command.SetAction(parse =>
        {
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            common.DiagnosticsFor(parse, context).Detail($"reading {inputs.Inputs.Count} log file(s)");
            var day = DayProcessor.Process(description, inputs.Inputs, reduction.Read(parse, description));
            var points = PointSelection.Select(day, parse.GetValue(point));
            var table = parse.GetValue(square)
                ? CovarianceTables.Matrix(points, parse.GetValue(correlation), parse.GetValue(profile))
                : CovarianceTables.Long(points, parse.GetValue(profile));
            context.Out.Write(table.ToString());
            return ExitCodes.Success;
        });
        return command;
    }
}
