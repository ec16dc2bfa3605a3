using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.Json;
using BcPrep.Live;
using BcPrep.Reading;

namespace BcPrep.Cli.Commands;

/// <summary>
/// <c>bcprep follow RIG FOLDER --out DIR</c>: follows the logs a logger is still writing and says, once per update
/// interval, where the current stretch stands: each key channel moving, approaching (τ, change to come) or settled
/// since t, and once settled the hold its <c>hold_target</c> needs. A point that a step has ended after enough hold
/// is reduced at once, as <c>process</c> would, into DIR; at the end DIR holds what <c>process</c> writes on the
/// same logs. It advises; the operator and the rig's safety case decide.
/// </summary>
public static class FollowCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var folder = new Argument<string>("FOLDER") { Description = "The folder the logger writes its files into." };
        var output = new Option<string>("--out", "-o") { Description = "Output folder: finished points are reduced into it as `process` would.", Required = true, HelpName = "DIR" };
        var pattern = new Option<string>("--pattern") { Description = "File name pattern of the logger's files.", DefaultValueFactory = _ => "*.csv", HelpName = "PATTERN" };
        var interval = new Option<double>("--interval") { Description = "Seconds between two reports.", DefaultValueFactory = _ => 10.0, HelpName = "S" };
        var idle = new Option<double?>("--end-after-idle") { Description = "End when no new row has arrived for this many seconds (default: run until Ctrl-C).", HelpName = "S" };
        var json = new Option<bool>("--json") { Description = "Write each report as one JSON line to standard output (for a wrapper) instead of lines on standard error." };
        // The options that change the reduction, with the names and meaning they have for `process`: the folder
        // written at the end is what `process` writes with the same options.
        var reduction = ReductionOptions.WithMonteCarlo();
        var report = ReportOption.Create();
        var command = new Command("follow", "Follow the logs a logger is still writing: report when the current point is settled and how long it must be held; reduce each finished point.\n" +
                                            "Example: bcprep follow sample-logs/marten-rig.toml /data/logger --out out --interval 30")
        {
            rig, folder, output, pattern, interval, idle, json,
        };
        reduction.AddTo(command);
        command.Options.Add(report);
        command.SetAction(parse =>
        {
            var diagnostics = common.DiagnosticsFor(parse, context);
            var rigPath = parse.GetValue(rig)!;
            var description = RigArguments.LoadRig(rigPath);
            var logFolder = parse.GetValue(folder)!;
            if (!Directory.Exists(logFolder))
            {
                throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(UsageErrors.Location, null, null, "FOLDER"), $"the log folder {logFolder} does not exist");
            }
            var intervalS = parse.GetValue(interval);
            if (!(intervalS > 0))
            {
                throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(UsageErrors.Location, null, null, "--interval"), "the interval must be a positive number of seconds");
            }
            var idleS = parse.GetValue(idle);
            var outDir = parse.GetValue(output)!;
            var options = reduction.Read(parse, description);
            var follower = new LogFollower(logFolder, parse.GetValue(pattern)!);
            var daySoFar = new DaySoFar(description, options);
            using var fingerprints = new GrowingFingerprints();
            var reducer = new Reducer(context, diagnostics, parse, rigPath, description, reduction, report, outDir, follower, daySoFar, fingerprints);
            var monitor = new LiveMonitor(description, LiveSettling.Estimator);
            var writeJson = parse.GetValue(json);
            using var stop = new CancellationTokenSource();
            ConsoleCancelEventHandler onCancel = (_, e) =>
            {
                e.Cancel = true;
                stop.Cancel();
            };
            Console.CancelKeyPress += onCancel;
            var reportedAtS = double.NaN;
            try
            {
                var clock = Stopwatch.StartNew();
                var lastRow = clock.Elapsed;
                var lastReport = TimeSpan.Zero;
                var pollEvery = TimeSpan.FromSeconds(Math.Min(1.0, intervalS));
                while (!stop.IsCancellationRequested)
                {
                    var lines = follower.Poll();
                    foreach (var line in lines)
                    {
                        if (monitor.Feed(line) is { } finished)
                        {
                            Announce(context, diagnostics, writeJson, finished);
                            reducer.ReduceSoFar();
                        }
                    }
                    if (lines.Count > 0)
                    {
                        // Idle time counts from the end of the work on the last rows: a long reduction is no idle logger.
                        lastRow = clock.Elapsed;
                    }
                    if (!double.IsNaN(monitor.NowS) && (clock.Elapsed - lastReport).TotalSeconds >= intervalS)
                    {
                        lastReport = clock.Elapsed;
                        reportedAtS = monitor.NowS;
                        Report(context, writeJson, description, monitor.Report(monitor.NowS));
                    }
                    if (idleS is { } limit && (clock.Elapsed - lastRow).TotalSeconds >= limit)
                    {
                        break;
                    }
                    if (!follower.HasMore)
                    {
                        stop.Token.WaitHandle.WaitOne(pollEvery);
                    }
                }
            }
            finally
            {
                Console.CancelKeyPress -= onCancel;
            }
            // The last rows a poll may not have seen yet, then the whole day as `process` reduces it.
            foreach (var line in follower.Poll())
            {
                monitor.Feed(line);
            }
            if (follower.Files.Count == 0)
            {
                diagnostics.Info($"{logFolder}: no log file matching '{parse.GetValue(pattern)}' appeared; nothing to reduce");
                return ExitCodes.Success;
            }
            if (!double.IsNaN(monitor.NowS) && monitor.NowS != reportedAtS)
            {
                // The state at the last row, unless the loop's last report already gave it.
                Report(context, writeJson, description, monitor.Report(monitor.NowS));
            }
            context.Out.Flush();
            diagnostics.Info($"end of the logs: reducing the day into {outDir}");
            // --force: a reduction of the day so far may have read a copy of the last file that already held all of it; the
            // folder must name the logger's own files, as `process` on them would.
            return BcPrepApp.Run(["process", rigPath, .. follower.Files, "--out", outDir, "--force", .. reducer.ProcessArguments()], context);
        });
        return command;
    }

    /// <summary>Reduces the day so far into the output folder at a finished point, reading only what is new since the last time.</summary>
    private sealed class Reducer(
        CliContext context, Diagnostics diagnostics, ParseResult parse, string rigPath, Rig.RigDescription rig, ReductionOptions reduction, Option<bool> report,
        string outDir, LogFollower follower, DaySoFar daySoFar, GrowingFingerprints fingerprints)
    {
        /// <summary>
        /// The day so far, as `process` would reduce it (pinned windows not yet reached left out), written into the
        /// output folder. A reduction that cannot be made yet is reported, and following goes on.
        /// </summary>
        public void ReduceSoFar()
        {
            // A bad row, or a sensor past its due date, stops following, as it would stop `process`.
            daySoFar.ReadTo(follower.Files, follower.CompleteBytes);
            try
            {
                var day = daySoFar.Reduce();
                using var folder = Writing.ResultFolder.Claim(outDir, [rigPath, .. follower.Files, .. reduction.MatrixPath(parse) is { } m ? new[] { m } : []],
                    CommitHook.FromEnvironment(context));
                var provenance = reduction.Record(
                    new(BcPrepApp.Version, LogArguments.Fingerprint(rigPath, rigPath), fingerprints.Of(follower.Files, follower.CompleteBytes)),
                    parse, ReportOption.Choices(parse.GetValue(report)));
                var files = Writing.DayOutputs.Build(day, provenance, FacePoints.Read(rig, rigPath), ReportOption.Files(parse.GetValue(report), day, diagnostics));
                folder.Commit(files);
                diagnostics.Info(string.Create(CultureInfo.InvariantCulture, $"the day so far ({day.Points.Count} point(s)) is reduced into {outDir}"));
            }
            catch (BcPrepFailure failure) when (failure.Kind is not FailureKind.Output)
            {
                // No steady point yet, a point that lost its window to gaps: more of the day may change that. An output
                // folder that is not ours stops following.
                diagnostics.Info($"the day so far cannot be reduced yet ({failure.Problems[0].Message}); following goes on");
            }
        }

        /// <summary>The reduction's options as given, for the final `process` run.</summary>
        public IEnumerable<string> ProcessArguments()
        {
            foreach (var channel in reduction.Allowed(parse))
            {
                yield return "--allow-expired";
                yield return channel;
            }
            if (reduction.MatrixPath(parse) is { } matrix)
            {
                yield return "--matrix";
                yield return matrix;
            }
            if (parse.GetValue(reduction.MonteCarlo!))
            {
                yield return "--monte-carlo";
                yield return "--seed";
                yield return parse.GetValue(reduction.Seed!).ToString(CultureInfo.InvariantCulture);
            }
            if (parse.GetValue(report))
            {
                yield return "--report";
            }
            if (diagnostics.Verbosity == Verbosity.Quiet)
            {
                yield return "--quiet";
            }
        }
    }

    private static void Announce(CliContext context, Diagnostics diagnostics, bool json, FinishedStretch finished)
    {
        if (json)
        {
            WriteJson(context, w =>
            {
                w.WriteString("event", "point_finished");
                w.WriteNumber("stretch_start_s", finished.StretchStartS);
                w.WriteNumber("settled_from_s", finished.SettledFromS);
                w.WriteNumber("end_s", finished.EndS);
            });
        }
        diagnostics.Info(string.Create(CultureInfo.InvariantCulture,
            $"point finished: settled from {finished.SettledFromS:0} s to the step at {finished.EndS:0} s ({finished.EndS - finished.SettledFromS:0} s held)"));
    }

    private static void Report(CliContext context, bool json, Rig.RigDescription rig, StretchReport report)
    {
        if (json)
        {
            WriteJson(context, w =>
            {
                w.WriteString("event", "report");
                w.WriteNumber("time_s", report.TimeS);
                w.WriteNumber("stretch_start_s", report.StretchStartS);
                w.WriteBoolean("settled", report.Settled);
                w.WriteStartArray("channels");
                foreach (var c in report.Channels)
                {
                    w.WriteStartObject();
                    w.WriteString("channel", c.Channel);
                    w.WriteString("state", c.State.ToString().ToLowerInvariant());
                    Number(w, "mean_si", c.MeanSi);
                    Number(w, "tau_s", c.TauS);
                    Number(w, "remaining_change_si", c.RemainingChangeSi);
                    Number(w, "settled_since_s", c.SettledSinceS);
                    Number(w, "time_to_settle_s", c.TimeToSettleS);
                    Number(w, "hold_needed_s", c.Hold?.NeededS ?? double.NaN);
                    Number(w, "hold_remaining_s", c.Hold?.RemainingS ?? double.NaN);
                    Number(w, "expanded_uncertainty_si", c.Hold?.ExpandedUncertaintyNow ?? double.NaN);
                    Number(w, "hold_target_si", c.Hold?.TargetExpandedUncertainty ?? double.NaN);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            });
            return;
        }
        var text = new StringBuilder();
        text.Append(CultureInfo.InvariantCulture, $"t = {report.TimeS:0} s, stretch since {report.StretchStartS:0} s:");
        foreach (var c in report.Channels)
        {
            text.Append(CultureInfo.InvariantCulture, $" {c.Channel} ");
            text.Append(c.State switch
            {
                ChannelState.Moving => "moving",
                ChannelState.Approaching => string.Create(CultureInfo.InvariantCulture,
                    $"approaching (τ {c.TauS:0} s, {c.RemainingChangeSi:G3} to come, settled in about {c.TimeToSettleS:0} s)"),
                _ => string.Create(CultureInfo.InvariantCulture, $"settled since {c.SettledSinceS:0} s") + Hold(c),
            });
            text.Append(';');
        }
        context.Error.WriteLine(text.ToString().TrimEnd(';'));
    }

    private static string Hold(ChannelReport c) => c.Hold switch
    {
        null => "",
        { Met: true } h => string.Create(CultureInfo.InvariantCulture, $", U {h.ExpandedUncertaintyNow:G3} meets its target {h.TargetExpandedUncertainty:G3}"),
        { Reachable: false } h => string.Create(CultureInfo.InvariantCulture, $", U {h.ExpandedUncertaintyNow:G3}: its target {h.TargetExpandedUncertainty:G3} is below what the Type B alone allows, no hold reaches it"),
        var h => string.Create(CultureInfo.InvariantCulture, $", U {h.ExpandedUncertaintyNow:G3}, hold {h.NeededS:0} s for {h.TargetExpandedUncertainty:G3} ({h.RemainingS:0} s to go)"),
    };

    private static void Number(Utf8JsonWriter w, string name, double value)
    {
        if (double.IsFinite(value))
        {
            w.WriteNumber(name, value);
        }
        else
        {
            w.WriteNull(name);
        }
    }

    private static void WriteJson(CliContext context, Action<Utf8JsonWriter> body)
    {
        using var memory = new MemoryStream();
        using (var w = new Utf8JsonWriter(memory))
        {
            w.WriteStartObject();
            body(w);
            w.WriteEndObject();
        }
        context.Out.WriteLine(Encoding.UTF8.GetString(memory.ToArray()));
        context.Out.Flush();
    }
}
