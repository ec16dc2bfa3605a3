using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using BcPrep.Pipeline;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep process RIG LOG… --out DIR</c>: the whole reduction, writing tables and the manifest.</summary>
public static class ProcessCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var output = new Option<string>("--out", "-o") { Description = "Output folder (created if needed).", Required = true };
        var force = new Option<bool>("--force") { Description = "Recompute even when inputs, rig file and tool version match the existing manifest." };
        var monteCarlo = new Option<bool>("--monte-carlo") { Description = "Also propagate by Monte Carlo (JCGM 101) and flag where it disagrees with GUM." };
        var seed = new Option<int>("--seed") { Description = "Seed of the Monte Carlo trials.", DefaultValueFactory = _ => 1 };
        var command = new Command("process", "Reduce a test day to boundary conditions with uncertainties, one folder per operating point.\n" +
                                             "Example: bcprep process sample-logs/marten-rig.toml sample-logs/marten-2026-11-24-*.csv --out out")
        {
            rig, logs, output, force, monteCarlo, seed,
        };
        command.SetAction(parse =>
        {
            var diagnostics = common.DiagnosticsFor(parse, context);
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var outDir = parse.GetValue(output)!;
            var provenance = new RunProvenance(BcPrepApp.Version, LogArguments.Fingerprint(parse.GetValue(rig)!, parse.GetValue(rig)!), inputs.Fingerprints());
            if (!parse.GetValue(force) && IsUpToDate(outDir, provenance))
            {
                diagnostics.Info($"{outDir}: up to date (inputs, rig file and tool version unchanged); nothing to do. Use --force to recompute.");
                return ExitCodes.Success;
            }
            diagnostics.Detail($"reading {inputs.Inputs.Count} log file(s)");
            var day = DayProcessor.Process(description, inputs.Inputs, new ProcessOptions(MonteCarlo: parse.GetValue(monteCarlo), Seed: parse.GetValue(seed)));
            var files = DayOutputs.Build(day, provenance);
            files.Commit(outDir);
            foreach (var warning in day.Warnings)
            {
                diagnostics.Warning(warning);
            }
            foreach (var point in day.Points)
            {
                foreach (var warning in point.Warnings)
                {
                    diagnostics.Warning($"{point.Id}: {warning}");
                }
            }
            diagnostics.Detail(string.Create(CultureInfo.InvariantCulture, $"wrote {day.Points.Count} operating point(s), {files.Files.Count} files, to {outDir}"));
            return ExitCodes.Success;
        });
        return command;
    }

    private static bool IsUpToDate(string outDir, RunProvenance provenance)
    {
        var manifest = Path.Combine(outDir, DayOutputs.ManifestName);
        if (!File.Exists(manifest))
        {
            return false;
        }
        try
        {
            using var document = JsonDocument.Parse(File.ReadAllBytes(manifest));
            if (document.RootElement.TryGetProperty("run_key", out var key) && key.GetString() == provenance.Key &&
                document.RootElement.TryGetProperty("files", out var files))
            {
                return files.EnumerateArray().All(f => File.Exists(Path.Combine(outDir, f.GetString() ?? "")));
            }
        }
        catch (JsonException)
        {
        }
        return false;
    }
}
