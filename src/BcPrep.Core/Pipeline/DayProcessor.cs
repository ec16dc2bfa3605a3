using System.Globalization;
using BcPrep.Physics;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Uncertainty;
using DetectorSettings = BcPrep.Steady.SteadySettings;

namespace BcPrep.Pipeline;

/// <summary>
/// Runs the whole reduction of a test day: read and calibrate (streaming), find or take the operating-point
/// windows, reduce each channel to window statistics, and propagate every input to every boundary-condition
/// quantity. Pure apart from reading the logs it is given.
/// </summary>
public static class DayProcessor
{
    // Accuracy of the Colebrook friction factor used as a 95 % bound in the pressure-drop check (from memory:
    // commonly quoted ±5 % against smooth- and rough-pipe data).
    public const double FrictionCorrelationAccuracy = 0.05;

    public static DayResult Process(RigDescription rig, IReadOnlyList<LogInput> logs, ProcessOptions options)
    {
        var plan = DayPlan.Create(rig, logs);
        var converters = rig.Channels.ToDictionary(c => c.Id, ChannelConversion.For, StringComparer.Ordinal);
        var blocks = new BlockMeanSink(plan.DayStartS, rig.Steady.BlockS);
        var stats = new Dictionary<string, Dictionary<string, ChannelWindowStats>>(StringComparer.Ordinal);
        var tareWindows = TareWindows(rig, plan.DayStartS);
        var pinned = rig.Points.Select(p => new TimeWindow(p.Id, Resolve(p.Start, plan.DayStartS), Resolve(p.End, plan.DayStartS))).ToList();
        var firstPass = new WindowCollector([.. pinned, .. tareWindows], (w, c, t, v) => Collect(rig, plan.DayStartS, stats, w, c, t, v));
        DayScan.Run(rig, plan, converters, [blocks, firstPass]);

        var series = Series(rig, blocks);
        SteadyDetectionResult? detection = null;
        var windows = pinned;
        var origin = WindowOrigin.RigFile;
        if (pinned.Count == 0)
        {
            detection = Detect(rig, series);
            windows = detection.Accepted.Select((w, i) => new TimeWindow($"OP{i + 1}", w.StartS, w.EndS)).ToList();
            origin = WindowOrigin.Detected;
            if (windows.Count == 0)
            {
                throw new BcPrepFailure(FailureKind.NoSteadyPoint, NoSteadyProblems(rig, detection, plan.DayStartS));
            }
            var secondPass = new WindowCollector(windows, (w, c, t, v) => Collect(rig, plan.DayStartS, stats, w, c, t, v));
            DayScan.Run(rig, plan, converters, [secondPass]);
        }

        var tareStats = TareStats(rig, stats);
        var points = windows.Select(w => EvaluatePoint(rig, w, origin, stats[w.Id], tareStats, options)).ToList();
        return new DayResult(rig, plan.DayStartS, points, series, detection, []);
    }

    public static double Resolve(TimeBound bound, double dayStartS) => bound.IsAbsolute ? bound.Seconds : dayStartS + bound.Seconds;

    private static List<TimeWindow> TareWindows(RigDescription rig, double dayStartS) =>
        rig.Channels.Where(c => c.Tare is not null)
            .Select(c => new TimeWindow("tare:" + c.Id, Resolve(c.Tare!.Start, dayStartS), Resolve(c.Tare.End, dayStartS)))
            .ToList();

    private static void Collect(RigDescription rig, double dayStartS, Dictionary<string, Dictionary<string, ChannelWindowStats>> stats, TimeWindow window, string channel, double[] times, double[] values)
    {
        if (window.Id.StartsWith("tare:", StringComparison.Ordinal) && window.Id != "tare:" + channel)
        {
            return;
        }
        if (!stats.TryGetValue(window.Id, out var byChannel))
        {
            byChannel = new Dictionary<string, ChannelWindowStats>(StringComparer.Ordinal);
            stats[window.Id] = byChannel;
        }
        if (times.Length == 0)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel), string.Create(CultureInfo.InvariantCulture,
                $"window '{window.Id}' ({window.StartS:F1}–{window.EndS:F1} s on the log clock) holds no samples of '{channel}': is the window inside the day?"));
        }
        byChannel[channel] = FaultPolicy.Evaluate(rig, channel, window, times, values, dayStartS);
    }

    private static Dictionary<string, ChannelWindowStats> TareStats(RigDescription rig, Dictionary<string, Dictionary<string, ChannelWindowStats>> stats)
    {
        var result = new Dictionary<string, ChannelWindowStats>(StringComparer.Ordinal);
        foreach (var channel in rig.Channels.Where(c => c.Tare is not null))
        {
            if (stats.TryGetValue("tare:" + channel.Id, out var byChannel) && byChannel.TryGetValue(channel.Id, out var s))
            {
                result[channel.Id] = s;
            }
        }
        return result;
    }

    private static BlockSeries Series(RigDescription rig, BlockMeanSink blocks)
    {
        var length = blocks.Length;
        return new BlockSeries(blocks.Times(length), rig.Channels.ToDictionary(c => c.Id, c => blocks.Means(c.Id, length), StringComparer.Ordinal));
    }

    private static SteadyDetectionResult Detect(RigDescription rig, BlockSeries series)
    {
        if (rig.Steady.Keys.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation(rig.SourceFile, Key: "steady.key"),
                "no [[point]] windows are pinned and [steady] names no key channel to detect them with");
        }
        var keys = rig.Steady.Keys.Select(k => new KeyChannel(k.Channel, series.Means[k.Channel], k.MaxChangeSi / rig.Steady.WindowS, k.MaxScatterSi, k.StepSi)).ToList();
        var settings = new DetectorSettings(WindowS: rig.Steady.WindowS, MinStretchS: rig.Steady.MinDurationS, TailS: rig.Steady.SettledTailS, StepS: Math.Max(rig.Steady.BlockS, rig.Steady.WindowS / 30));
        return SteadyStateDetector.Detect(series.TimesS, keys, settings);
    }

    private static List<Problem> NoSteadyProblems(RigDescription rig, SteadyDetectionResult detection, double dayStartS)
    {
        var problems = detection.Rejected.Select(r => new Problem(new SourceLocation("(logs)", Key: string.Create(CultureInfo.InvariantCulture, $"{r.StartS - dayStartS:F0}–{r.EndS - dayStartS:F0} s")),
            "rejected: " + r.Reason)).ToList();
        problems.Insert(0, new Problem(new SourceLocation(rig.SourceFile, Key: "steady"), "no steady operating point found; the stretches closest to steady were:"));
        return problems;
    }

    private static PointResult EvaluatePoint(RigDescription rig, TimeWindow window, WindowOrigin origin,
        IReadOnlyDictionary<string, ChannelWindowStats> channels, IReadOnlyDictionary<string, ChannelWindowStats> tares, ProcessOptions options)
    {
        PointModel model;
        PointQuantities nominal;
        try
        {
            model = PointModel.Build(rig, channels, tares);
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
                new MonteCarloOptions(Seed: options.Seed, CoverageProbability: rig.CoverageProbability, SignificantDigits: 1, MaxTrials: 200_000));
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
        if (point.Output("energy_balance.mismatch") is { } balance)
        {
            checks.Add(new CheckResult("energy balance", Math.Abs(balance.Estimate) <= balance.ExpandedUncertainty, balance.Estimate, balance.ExpandedUncertainty, "1",
                "|(P(1-loss) - m cp dT)/(P(1-loss))| within its expanded uncertainty"));
        }
        if (point.Output("pressure_drop.measured") is { } measured && point.Output("pressure_drop.expected") is { } expected)
        {
            var tolerance = Math.Sqrt((measured.ExpandedUncertainty * measured.ExpandedUncertainty) + Math.Pow(FrictionCorrelationAccuracy * expected.Estimate, 2) + (expected.ExpandedUncertainty * expected.ExpandedUncertainty));
            checks.Add(new CheckResult("pressure drop", Math.Abs(measured.Estimate - expected.Estimate) <= tolerance, measured.Estimate - expected.Estimate, tolerance, "Pa",
                "measured minus (Colebrook friction + acceleration), within the combined expanded uncertainty and ±5 % correlation accuracy"));
        }
        var re = point.Nominal.Reynolds;
        var regime = re < FrictionFactor.LaminarLimitReynolds ? "laminar" : re < 4000 ? "transitional" : "turbulent";
        checks.Add(new CheckResult($"flow regime ({regime})", regime != "transitional", re, 4000, "1", "Re outside 2300-4000 (transitional flow makes every correlation unreliable)"));
        if (PipeFlow.IsCompressibilityWarning(point.Nominal.Mach))
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"Mach {point.Nominal.Mach:F2} > 0.3: compressibility matters; incompressible boundary conditions are doubtful"));
        }
        foreach (var failed in checks.Where(c => !c.Passed))
        {
            warnings.Add($"check '{failed.Name}' did not pass: {failed.Basis}");
        }
        foreach (var stats in point.Channels.Values.Where(s => s.Faults.Count > 0))
        {
            warnings.AddRange(stats.Faults.Select(f => $"channel '{stats.Channel}': {f.Kind}: {f.Evidence}"));
        }
        return (checks, warnings);
    }
}
