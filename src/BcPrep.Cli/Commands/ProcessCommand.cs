using System.CommandLine;
using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep process RIG LOG… --out DIR</c>: the whole reduction, writing tables and the manifest.</summary>
public static class ProcessCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var output = new Option<string>("--out", "-o") { Description = "Output folder (created if needed).", Required = true, HelpName = "DIR" };
        var force = new Option<bool>("--force") { Description = "Recompute even when inputs, rig file and tool version match the existing manifest." };
        var reduction = ReductionOptions.WithMonteCarlo();
        var report = ReportOption.Create();
        var command = new Command("process", "Reduce a test day to boundary conditions with uncertainties, one folder per operating point.\n" +
                                             "Example: bcprep process sample-logs/marten-rig.toml sample-logs/marten-2026-11-24-*.csv --out out")
        {
            rig, logs, output, force,
        };
        reduction.AddTo(command);
        command.Options.Add(report);
        command.SetAction(parse =>
        {
            // The logs' hashing starts before the rig is loaded, on the core the start-up leaves idle.
            var early = EarlyFingerprints.Start(parse.GetValue(logs)!);
            var diagnostics = common.DiagnosticsFor(parse, context);
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var outDir = parse.GetValue(output)!;
            var options = reduction.Read(parse, description);
            // The folder is claimed (checked, locked) before any work, and held until the result is swapped in.
            using var folder = ResultFolder.Claim(outDir,
                [parse.GetValue(rig)!, .. parse.GetValue(logs)!.Where(l => l != "-"), .. reduction.MatrixPath(parse) is { } m ? new[] { m } : []],
                CommitHook.FromEnvironment(context));
            var rigFingerprint = LogArguments.Fingerprint(parse.GetValue(rig)!, parse.GetValue(rig)!);
            RunProvenance Provenance(IReadOnlyList<InputFingerprint> logFingerprints) =>
                reduction.Record(new(BcPrepApp.Version, rigFingerprint, logFingerprints), parse, ReportOption.Choices(parse.GetValue(report)));
            var facePoints = FacePoints.Read(description, parse.GetValue(rig)!);
            // The face points file is not among the hashed inputs, so a configured face always recomputes.
            var mayBeUpToDate = !parse.GetValue(force) && facePoints is null && ExistingOutputs.MayBeUpToDate(outDir, inputs.Sizes());
            // Hashing a multi-GB day is a full read. When the outputs cannot be up to date it runs beside the processing
            // from the start: the reading and the window statistics leave gaps on the two cores that it fills (measured
            // in BENCHMARKS.md against starting it after the read).
            // On its own thread (LongRunning), not the pool's, which the processing's short parallel work needs, and at
            // the lowest priority, so that it takes only what the reader and the statistics leave (BackgroundPriority);
            // what is left when the outputs need it is hashed then by this thread at its own priority (below).
            IReadOnlyList<InputFingerprint>? upToDateCheck = null;
            if (mayBeUpToDate)
            {
                upToDateCheck = inputs.Fingerprints(early);
            }
            else
            {
                _ = Task.Factory.StartNew(() => early.HashInBackground(inputs.Inputs), CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
            }
            if (upToDateCheck is not null && ExistingOutputs.IsUpToDate(outDir, Provenance(upToDateCheck).Key))
            {
                OutputFileSet.RemoveStalePartials(outDir, ExistingOutputs.ListedFiles(outDir));
                diagnostics.Info($"{outDir}: up to date (inputs, rig file and tool version unchanged); nothing to do. Use --force to recompute.");
                return ExistingOutputs.HasFailedPoints(outDir) ? ExitCodes.SomePointsFailed : ExitCodes.Success;
            }
            diagnostics.Detail($"reading {inputs.Inputs.Count} log file(s)");
            OutputFileSet files;
            DayResult day;
            var reading = new ReadProgress(inputs.Sizes().Sum());
            using var processed = new CancellationTokenSource();
            if (upToDateCheck is null)
            {
                // The background hash runs at the lowest priority; on a busy machine it may have got little by the end of
                // the read. From there on it goes on at normal priority beside the last windows' statistics rather than
                // on this thread after them (an 8 h day under a load average of 17 took twice as long).
                _ = Task.Factory.StartNew(() => FinishHashAfterRead(early, inputs.Inputs, reading, processed.Token), CancellationToken.None,
                    TaskCreationOptions.LongRunning, TaskScheduler.Default);
            }
            using (ProgressIndicator.Start(context, diagnostics.Verbosity, "processing", reading.TotalBytes, reading))
            {
                day = DayProcessor.Process(description, inputs.Inputs, options with { Progress = reading });
                // The chunks not hashed yet are hashed now by this thread (EarlyFingerprints.For), the background stopping.
                var provenance = Provenance(upToDateCheck ?? inputs.Fingerprints(early));
                processed.Cancel();
                files = DayOutputs.Build(day, provenance, facePoints, ReportOption.Files(parse.GetValue(report), day, diagnostics));
                folder.Commit(files);
            }
            foreach (var warning in day.Warnings.Concat(day.Calibration?.Warnings ?? []).Concat(day.Matrix?.Warnings ?? []))
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
            foreach (var failed in day.FailedPoints)
            {
                diagnostics.Warning($"{failed.Id}: point failed and was not written: {failed.Reason}");
            }
            diagnostics.Detail(string.Create(CultureInfo.InvariantCulture, $"wrote {day.Points.Count} operating point(s), {files.Files.Count} files, to {outDir}"));
            return day.FailedPoints.Count > 0 ? ExitCodes.SomePointsFailed : ExitCodes.Success;
        });
        return command;
    }
    /// <summary>
    /// Waits (polling, without work) until the first pass has read every byte, then hashes what the background hash has
    /// not, at this thread's normal priority; gives up when the processing is done first. A file that cannot be hashed
    /// is left to the caller, which reports it.
    /// </summary>
    private static void FinishHashAfterRead(EarlyFingerprints early, IReadOnlyList<LogInput> logs, ReadProgress reading, CancellationToken processed)
    {
        while (reading.Pass <= 1 && reading.PassBytes < reading.TotalBytes)
        {
            if (processed.WaitHandle.WaitOne(25))
            {
                return;
            }
        }
        try
        {
            foreach (var log in logs)
            {
                if (processed.IsCancellationRequested)
                {
                    return;
                }
                early.For(log);
            }
        }
        catch (BcPrepFailure)
        {
            // Reported by the caller, which asks for the same fingerprint.
        }
    }
}
