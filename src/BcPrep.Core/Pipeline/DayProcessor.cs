using BcPrep.Conditioning;
using BcPrep.Lab;
using BcPrep.Physics;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Uncertainty;
using BcPrep.Values;
using System.Globalization;
using System.Runtime.ExceptionServices;

namespace BcPrep.Pipeline;

/// <summary>
/// Runs the whole reduction of a test day: read and calibrate (streaming), find or take the operating-point
/// windows, reduce each channel to window statistics, and propagate every input to every boundary-condition
/// quantity. Pure apart from reading the logs it is given.
/// </summary>
public static class DayProcessor
{
    // Accuracy of the Colebrook friction factor used as a 95 % bound in the pressure-drop check: ±15 %, the accuracy
    // usually quoted for the Moody chart (White, Fluid Mechanics; from memory). See Physics/ModelForm.
    public const double FrictionCorrelationAccuracy = ModelForm.FrictionCorrelationAccuracy;

    public static DayResult Process(RigDescription rig, IReadOnlyList<LogInput> logs, ProcessOptions options)
    {
        var plan = DayPlan.Create(rig, logs);
        // Fail before the long scan when a sensor was already out of calibration on the first sample's date.
        CalibrationCheck.Evaluate(rig, TestDates.FromLogs(rig.Log, plan.Start.FirstSample.Value, plan.Start.FirstSample.Value), options.AllowExpired);
        var converters = rig.Channels.ToDictionary(c => c.Id, BlockConverter.For, StringComparer.Ordinal);
        var blocks = new BlockMeanSink(plan.Start.FirstSample.Value, rig.Steady.BlockS);
        var stats = new Dictionary<string, Dictionary<string, ChannelWindowStats>>(StringComparer.Ordinal);
        var tareWindows = TareWindows(rig, plan.Start);
        var pinned = rig.Points.Select(p => new TimeWindow(p.Id, plan.Start.Resolve(p.Start).Value, plan.Start.Resolve(p.End).Value)).ToList();
        var book = new WindowStatsBook();
        var firstPass = new WindowCollector([.. pinned, .. tareWindows], (w, c, t, v) => Collect(rig, plan.Start, book, w, c, t, v, PinnedLocation(rig, w)),
            collects: (w, c) => w.Serves(c));
        var extent = new DayExtentSink();
        var feed = DetectionFeed.For(rig, blocks);
        var index = new ScanIndex();
        var liveBook = new WindowStatsBook();
        var detects = WindowFinder.IsEnabled(rig) || pinned.Count == 0;
        // The rows kept back for the single read go to temporary files when the caller names a folder for them.
        using var live = ReadsLive(rig, plan, detects, options)
            ? new LiveDetection(rig, plan.Start, feed.BlockSink, blocks, pinned, (w, c) => Collect(rig, plan.Start, liveBook, w, c), options.KeptRowsS,
                options.KeptRowsFolder is { } folder ? new DiskRowBlocks(folder) : null)
            : null;
        DayScan.Run(rig, plan, converters, [firstPass, extent], (IBlockSink?)live ?? feed.BlockSink, options.Progress, index);
        feed.Complete();
        var lost = new Dictionary<string, Problem>(StringComparer.Ordinal);
        book.DrainInto(stats, lost: lost);
        var calibration = CalibrationCheck.Evaluate(rig, TestDates.FromLogs(rig.Log, extent.FirstS, extent.LastS), options.AllowExpired);

        var series = WindowFinder.Series(rig, blocks);
        SteadyDetectionResult? detection = null;
        if (detects)
        {
            // One detection per day: the scan that ran during the read, or, without it, the same scan over the block means.
            if (live is not null)
            {
                WindowFinder.RequireBlocks(rig, series);
                detection = live.Finish();
            }
            else
            {
                detection = WindowFinder.Detect(rig, series, plan.Start);
            }
        }
        // Point ids are given here, once: a window pinned by hand replaces the detected ones it overlaps.
        var windowPlan = PointWindows.Plan(pinned, detection, plan.Start);
        if (windowPlan.Points.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.NoSteadyPoint, WindowFinder.NoSteadyProblems(rig, detection!));
        }
        // Each detected window's samples come from the rows kept back during the read, else from a second read.
        var secondRead = new SeekingSecondRead(rig, plan, converters, index, options.Progress, (w, c, t, v) => Collect(rig, plan.Start, book, w, c, t, v));
        var fromKeptRows = new Dictionary<TimeWindow, TimeWindow>();
        foreach (var window in windowPlan.Points.Where(p => p.Origin == WindowOrigin.Detected).Select(p => p.Window))
        {
            if (live is not null && live.TryGather(window))
            {
                fromKeptRows[LiveDetection.Interval(window.StartS, window.EndS)] = window;
            }
            else
            {
                secondRead.TryGather(window);
            }
        }
        liveBook.DrainInto(stats, lost, fromKeptRows);
        secondRead.Complete();
        book.DrainInto(stats, lost: lost);
        // Every window's statistics are in: the statistics threads' working arrays are not needed for this day again.
        // Collected at once: they are large-object garbage that only a full collection frees, and the points'
        // evaluation and writing allocate little of that kind, so without it they stayed until the end of the run,
        // whose peak they made (8 h 1 kHz day). One blocking collection of a heap of mostly number arrays is brief.
        // Not mirrored in Live/DaySoFar on purpose: a followed day goes on reducing windows as they close, on the same
        // statistics threads, which reuse these arrays.
        ThreadScratch.ReleaseAll();
        GC.Collect();
        var dayWarnings = DetectionWarnings(detection, windowPlan, plan.Start);
        var tareStats = TareStats(tareWindows, stats);
        var endTares = EndTares(tareWindows, stats);
        var (failed, reduced) = SplitLost(windowPlan, lost);
        IReadOnlyList<PointResult> points = InOrder(reduced, p => EvaluatePoint(rig, p.Window, p.Origin, stats[p.Window.Id], tareStats, endTares, options));
        MatrixReport? matrix;
        (points, matrix) = NameByMatrix(options, points);
        return new DayResult(rig, plan.Start, points, series, detection, dayWarnings) { FailedPoints = failed, Calibration = calibration, Matrix = matrix, SecondPassSeeks = index.Seeks, WindowsReadAgain = secondRead.Count, PeakWindowChannelsLoaded = live?.Loaded.Peak ?? 0 };
    }

    /// <summary>The day's warnings about detection: none accepted, or pinned windows that detection does not support.</summary>
    internal static List<string> DetectionWarnings(SteadyDetectionResult? detection, WindowPlan windowPlan, DayStart dayStart)
    {
        var warnings = new List<string>();
        if (detection is { Accepted.Count: 0 })
        {
            warnings.Add("steady detection accepted no window (see the manifest's rejected stretches); only the pinned points are processed");
        }
        else if (detection is not null)
        {
            warnings.AddRange(PointWindows.PinnedWarnings(windowPlan, dayStart));
        }
        return warnings;
    }

    /// <summary>
    /// A point whose window lost too much to gaps fails alone; the others are reduced and written. Fails the day only
    /// when no point is left.
    /// </summary>
    internal static (List<FailedPoint> Failed, List<PlannedPoint> Reduced) SplitLost(WindowPlan windowPlan, IReadOnlyDictionary<string, Problem> lost)
    {
        var failed = windowPlan.Points.Where(p => lost.ContainsKey(p.Window.Id))
            .Select(p => new FailedPoint(p.Window.Id, p.Window.StartS, p.Window.EndS, lost[p.Window.Id].Message)).ToList();
        var reduced = windowPlan.Points.Where(p => !lost.ContainsKey(p.Window.Id)).ToList();
        if (reduced.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.InputData, failed.Select(f => lost[f.Id]).ToList());
        }
        return (failed, reduced);
    }

    /// <summary>The points named by the test matrix when one is given, with its report; else the points as they are.</summary>
    internal static (IReadOnlyList<PointResult> Points, MatrixReport? Matrix) NameByMatrix(ProcessOptions options, IReadOnlyList<PointResult> points) =>
        options.Matrix is null ? (points, null) : MatrixNaming.Apply(options.Matrix, points);

    /// <summary>
    /// Whether the day's detection runs during the read (<see cref="LiveDetection"/>), its windows gathered from the
    /// rows kept back: when detection runs and one logger records every channel, so the kept rows hold all of a
    /// window's channels. Otherwise the detection runs over the block means after the read, and its windows are read
    /// a second time, seeking by the block index.
    /// </summary>
    private static bool ReadsLive(RigDescription rig, DayPlan plan, bool detects, ProcessOptions options) =>
        detects && options.SinglePass && plan.Loggers.Count == 1 && (rig.Steady.Keys.Count > 0 || DetectionKeys.DefaultKeys(rig).Count > 0);

    /// <summary>
    /// Maps the items on the thread pool (each point's propagation is independent and pure) and returns the results
    /// in item order; the failure of the first failing item, in that order, is the one thrown, whatever the scheduling.
    /// </summary>
    internal static List<TResult> InOrder<TItem, TResult>(IReadOnlyList<TItem> items, Func<TItem, TResult> map)
    {
        var results = new TResult[items.Count];
        var failures = new ExceptionDispatchInfo?[items.Count];
        Parallel.For(0, items.Count, i =>
        {
            try
            {
                results[i] = map(items[i]);
            }
            catch (Exception e)
            {
                failures[i] = ExceptionDispatchInfo.Capture(e);
            }
        });
        foreach (var failure in failures)
        {
            failure?.Throw();
        }
        return [.. results];
    }

    private const string EndTarePrefix = "tare-end:";

    internal static List<TimeWindow> TareWindows(RigDescription rig, DayStart dayStart) =>
        [.. rig.Channels.Where(c => c.Tare is not null)
            .Select(c => TimeWindow.Tare(c.Id, dayStart.Resolve(c.Tare!.Start).Value, dayStart.Resolve(c.Tare.End).Value)),
         .. rig.Channels.Where(c => c.Tare is not null && c.TareEnd is not null)
            .Select(c => new TimeWindow(EndTarePrefix + c.Id, dayStart.Resolve(c.TareEnd!.Start).Value, dayStart.Resolve(c.TareEnd.End).Value) { TareOf = c.Id })];

    /// <summary>Channels tared at both ends of the day: the end tare's statistics and both tare mid-times.</summary>
    internal static Dictionary<string, EndTare> EndTares(IReadOnlyList<TimeWindow> tareWindows, Dictionary<string, Dictionary<string, ChannelWindowStats>> stats)
    {
        var result = new Dictionary<string, EndTare>(StringComparer.Ordinal);
        foreach (var end in tareWindows.Where(w => w.Id.StartsWith(EndTarePrefix, StringComparison.Ordinal)))
        {
            var start = tareWindows.First(w => w.TareOf == end.TareOf && !w.Id.StartsWith(EndTarePrefix, StringComparison.Ordinal));
            if (stats.TryGetValue(end.Id, out var byChannel) && byChannel.TryGetValue(end.TareOf!, out var s))
            {
                result[end.TareOf!] = new EndTare(s, 0.5 * (start.StartS + start.EndS), 0.5 * (end.StartS + end.EndS));
            }
        }
        return result;
    }

    /// <summary>
    /// A detected window's channels gathered from the kept rows, handed in together: each one's samples are loaded on the statistics thread when
    /// its statistics start and let go when they are done. The same statistics as a window read again (below).
    /// </summary>
    internal static void Collect(RigDescription rig, DayStart dayStart, WindowStatsBook book, TimeWindow window, IReadOnlyList<GatheredChannel> channels) =>
        book.AddAll(window, [.. channels.Select(channel => (channel.Name, (Func<TimeWindow, ChannelWindowStats>)(named => channel.Reduce((times, values, edits) =>
        {
            RequireSamples(named, channel.Name, times, dayStart, null);
            // The first reduction works in the loaded values (the thread's scratch) where it can, and otherwise
            // de-spikes into their slot once they are bridged into the window arrays: no further window-long array
            // for the de-spiked samples on each statistics thread (a failure loads them again, GatheredChannel).
            return edits is null
                ? FaultPolicy.Evaluate(rig, channel.Name, named, times, values, dayStart)
                : FaultPolicy.EvaluateInPlace(rig, channel.Name, named, times, values, edits, dayStart, ScratchSlots.LoadedValues);
        }))))]);

    /// <summary>
    /// The statistics of a channel's window from arrays handed over for them alone (the collector makes each window's
    /// own): they may work in the values, as a gathered channel's do in its scratch (no de-spiked copy, which stayed on
    /// each statistics thread for the rest of the day). Should they fail, the samples are put back first, because the
    /// failure is evaluated again from the same arrays for its message (<see cref="WindowStatsBook.DrainInto"/>).
    /// </summary>
    private static ChannelWindowStats EvaluateInOwnArray(RigDescription rig, string channel, TimeWindow window, double[] times, double[] values, DayStart dayStart)
    {
        var edits = new SampleEdits();
        try
        {
            return FaultPolicy.EvaluateInPlace(rig, channel, window, times, values, edits, dayStart);
        }
        catch
        {
            edits.Undo(values);
            throw;
        }
    }

    internal static void Collect(RigDescription rig, DayStart dayStart, WindowStatsBook book, TimeWindow window, string channel, double[] times, double[] values,
        SourceLocation? pinnedAt = null)
    {
        if (pinnedAt is null)
        {
            // A detected window is gathered before its point id is given, so even its emptiness is reported only
            // when its statistics are filed under that id.
            book.Add(window, channel, named =>
            {
                RequireSamples(named, channel, times, dayStart, null);
                return EvaluateInOwnArray(rig, channel, named, times, values, dayStart);
            });
            return;
        }
        RequireSamples(window, channel, times, dayStart, pinnedAt);
        WindowCoverage.Require(window, channel, times, rig.Conditioning.MaxBridgeS, pinnedAt);
        book.Add(window, channel, _ =>
        {
            try
            {
                return EvaluateInOwnArray(rig, channel, window, times, values, dayStart);
            }
            catch (WindowLostFailure failure)
            {
                // Still a failure of this point alone, now pointing at the window in the rig file.
                throw new WindowLostFailure(pinnedAt with { Key = $"{pinnedAt.Key}, channel '{channel}'" }, failure.Problems[0].Message);
            }
            catch (BcPrepFailure failure)
            {
                // Point the reader at the window in the rig file as well as at the channel.
                throw new BcPrepFailure(failure.Kind, failure.Problems.Select(p => p with { Location = pinnedAt with { Key = $"{pinnedAt.Key}, channel '{channel}'" } }).ToList());
            }
        });
    }

    private static void RequireSamples(TimeWindow window, string channel, double[] times, DayStart dayStart, SourceLocation? pinnedAt)
    {
        if (times.Length == 0)
        {
            var where = pinnedAt is null ? new SourceLocation("(logs)", Key: channel) : pinnedAt with { Key = $"{pinnedAt.Key}, channel '{channel}'" };
            throw new BcPrepFailure(FailureKind.InputData, where, string.Create(CultureInfo.InvariantCulture,
                $"window '{window.Id}' ({dayStart.Since(window.Start).Value:F1}–{dayStart.Since(window.End).Value:F1} s since the first sample of the day) holds no samples of '{channel}': is the window inside the day?"));
        }
    }

    /// <summary>Where a window pinned in the rig file (operating point or tare) is written; null for a detected one.</summary>
    internal static SourceLocation? PinnedLocation(RigDescription rig, TimeWindow window)
    {
        if (window.TareOf is { } channel)
        {
            var tared = rig.Channel(channel)!;
            return tared.Location with { Key = $"channel '{tared.Id}'.{(window.Id.StartsWith(EndTarePrefix, StringComparison.Ordinal) ? "tare_end" : "tare")}" };
        }
        return rig.Points.FirstOrDefault(p => p.Id == window.Id)?.Location;
    }

    internal static Dictionary<string, ChannelWindowStats> TareStats(IReadOnlyList<TimeWindow> tareWindows, Dictionary<string, Dictionary<string, ChannelWindowStats>> stats)
    {
        var result = new Dictionary<string, ChannelWindowStats>(StringComparer.Ordinal);
        foreach (var window in tareWindows.Where(w => !w.Id.StartsWith(EndTarePrefix, StringComparison.Ordinal)))
        {
            if (stats.TryGetValue(window.Id, out var byChannel) && byChannel.TryGetValue(window.TareOf!, out var s))
            {
                result[window.TareOf!] = s;
            }
        }
        return result;
    }

    internal static PointResult EvaluatePoint(RigDescription rig, TimeWindow window, WindowOrigin origin,
        IReadOnlyDictionary<string, ChannelWindowStats> channels, IReadOnlyDictionary<string, ChannelWindowStats> tares,
        IReadOnlyDictionary<string, EndTare> endTares, ProcessOptions options)
    {
        PointModel model;
        PointQuantities nominal;
        try
        {
            AbsolutePressureCheck.Require(rig, window.Id, channels, tares);
            model = PointModel.Build(rig, channels, tares, endTares, 0.5 * (window.StartS + window.EndS));
            nominal = model.Physics(model.Estimates());
        }
        catch (BcPrepDataException e) when (e is not BcPrepFailure)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: $"point '{window.Id}'"), e.Message);
        }
        var gum = GumPropagation.Propagate(model.Evaluate, model.Inputs, model.Outputs.Select(o => o.Name).ToList(), null, rig.CoverageProbability);
        MonteCarloResult? monteCarlo = null;
        List<GufValidation>? validation = null;
        if (options.MonteCarlo)
        {
            monteCarlo = MonteCarloPropagation.Propagate(model.Evaluate, model.Inputs, model.Outputs.Select(o => o.Name).ToList(), null,
                new MonteCarloOptions(Seed: options.Seed, CoverageProbability: rig.CoverageProbability, SignificantDigits: 1, MaxTrials: options.MonteCarloMaxTrials));
            validation = gum.Outputs.Select((g, i) => GufValidation.Compare(g, monteCarlo.Outputs[i], 1)).ToList();
        }
        var point = new PointResult(window.Id, window, origin, channels, model, gum, nominal, [], [], monteCarlo, validation);
        var (checks, warnings) = Checks(point);
        return point with { Checks = checks, Warnings = warnings };
    }

    private static (List<CheckResult>, List<string>) Checks(PointResult point)
    {
        var checks = new List<CheckResult>();
        var warnings = new List<string>();
        if (point.Output(PointOutputs.EnergyBalanceMismatch) is { } balance)
        {
            checks.Add(new CheckResult("energy balance", Math.Abs(balance.Estimate) <= balance.ExpandedUncertainty, balance.Estimate, balance.ExpandedUncertainty, "1",
                "|(P(1-loss) - m cp dT)/(P(1-loss))| within its expanded uncertainty"));
        }
        if (point.Output(PointOutputs.PressureDropMeasured) is { } measured && point.Output(PointOutputs.PressureDropExpected) is { } expected)
        {
            var tolerance = Math.Sqrt((measured.ExpandedUncertainty * measured.ExpandedUncertainty) + Math.Pow(FrictionCorrelationAccuracy * expected.Estimate, 2) + (expected.ExpandedUncertainty * expected.ExpandedUncertainty));
            checks.Add(new CheckResult("pressure drop", Math.Abs(measured.Estimate - expected.Estimate) <= tolerance, measured.Estimate - expected.Estimate, tolerance, "Pa",
                "measured minus (Colebrook friction + acceleration), within the combined expanded uncertainty and ±15 % correlation accuracy (Moody chart, White)"));
        }
        var re = point.Nominal.Reynolds;
        var regime = re < FrictionFactor.LaminarLimitReynolds ? "laminar" : re < 4000 ? "transitional" : "turbulent";
        checks.Add(new CheckResult($"flow regime ({regime})", regime != "transitional", re, 4000, "1", "Re outside 2300-4000 (transitional flow makes every correlation unreliable)"));
        if (PipeFlow.IsCompressibilityWarning(point.Nominal.Mach))
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"Mach {point.Nominal.Mach:F2} > 0.3: compressibility matters; incompressible boundary conditions are doubtful"));
        }
        warnings.AddRange(point.Model.ModelWarnings);
        foreach (var failed in checks.Where(c => !c.Passed))
        {
            warnings.Add($"check '{failed.Name}' did not pass: {failed.Basis}");
        }
        foreach (var stats in point.Channels.Values.Where(s => s.Faults.Count > 0))
        {
            warnings.AddRange(stats.Faults.Select(f => $"channel '{stats.Channel}': {ChoiceSpelling.Name(f.Kind)}: {f.Evidence}"));
        }
        return (checks, warnings);
    }
}
