using System.CommandLine;
using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep ensemble RIG LOG… --point ID --samples N --out DIR</c>: boundary-condition sets drawn from the input distribution.</summary>
public static class EnsembleCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var reduction = ReductionOptions.WithoutMonteCarlo();
        var point = PointSelection.Option(required: true);
        var samples = new Option<int>("--samples", "-n") { Description = $"Number of members (1 … {PointEnsemble.MaxMembers.ToString(CultureInfo.InvariantCulture)}).", Required = true, HelpName = "N" };
        var seed = new Option<int>("--seed") { Description = "Seed of the draws; the same seed gives the same files.", DefaultValueFactory = _ => 1, HelpName = "N" };
        var latin = new Option<bool>("--latin-hypercube") { Description = "Draw the members as one Latin hypercube instead of independent random draws." };
        var output = new Option<string>("--out", "-o") { Description = "Output folder (replaced as a whole; refused if it holds anything but an earlier ensemble).", Required = true, HelpName = "DIR" };
        var command = new Command("ensemble", "Write N complete boundary-condition sets of one point, drawn from the joint distribution of its inputs through the same physics.\n" +
                                              "Example: bcprep ensemble sample-logs/marten-rig.toml sample-logs/*.csv --point OP1 --samples 50 --seed 7 --out ens")
        {
            rig, logs, point, samples, seed, latin, output,
        };
        reduction.AddTo(command);
        command.SetAction(parse =>
        {
            var diagnostics = common.DiagnosticsFor(parse, context);
            var count = parse.GetValue(samples);
            if (count is < 1 or > PointEnsemble.MaxMembers)
            {
                throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--samples"), string.Create(CultureInfo.InvariantCulture,
                    $"--samples {count} is outside 1 … {PointEnsemble.MaxMembers}: a member is a folder of files, so ask for fewer (or run several seeds)"));
            }

            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var provenance = reduction.Record(new RunProvenance(BcPrepApp.Version, LogArguments.Fingerprint(parse.GetValue(rig)!, parse.GetValue(rig)!), inputs.Fingerprints()), parse, []);
            diagnostics.Detail($"reading {inputs.Inputs.Count} log file(s)");
            var day = DayProcessor.Process(description, inputs.Inputs, reduction.Read(parse, description));
            var chosen = PointSelection.Select(day, parse.GetValue(point))[0];
            var request = new EnsembleOutputs.Request(chosen.Id, count, parse.GetValue(seed),
                parse.GetValue(latin) ? EnsembleSampling.LatinHypercube : EnsembleSampling.Random);
            var outDir = parse.GetValue(output)!;
            var written = EnsembleOutputs.Write(day, chosen, request, provenance, outDir);
            diagnostics.Detail(string.Create(CultureInfo.InvariantCulture, $"wrote {written} member(s) of point {chosen.Id} to {outDir}"));
            return ExitCodes.Success;
        });
        return command;
    }
}
