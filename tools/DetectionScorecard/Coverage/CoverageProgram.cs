using System.Globalization;
using System.Text;
using BcPrep.Cli;

namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>
/// The coverage scorecard (BENCHMARKS.md "Coverage scorecard"): for each generated day of the detection scorecard
/// (<see cref="DayRecipe"/>, same seeds, same generator), DRAWS realisations of the rig's calibration errors
/// (<see cref="CalibrationErrors"/>) are put on the logged signals, the rig file states the drawn diameter and loss
/// fraction, `process` runs with default detection, and every written value ± U (and every channel's window mean ±
/// 2u_A) is compared with the generator's truth (<see cref="CoverageTruth"/>).
/// Usage: DetectionScorecard coverage [--days 50] [--first-seed 1] [--draws 4] [--monte-carlo] [--no-drift] [--keep DIR]
/// [--card FILE]. With --monte-carlo, `process` also propagates by JCGM 101 and its 95 % intervals are scored too;
/// with --no-drift the days lose the generator's undeclared pressure zero drift.
/// The card (Markdown) goes to standard output (and after every day to FILE), one line per run to standard error.
/// </summary>
public static class CoverageProgram
{
    /// <summary>The quantities compared: those whose truth the generator knows (turbulence quantities are correlations).</summary>
    public static readonly string[] Quantities =
    [
        "inlet.static_pressure", "outlet.static_pressure", "pressure_drop.measured", "inlet.temperature", "outlet.temperature",
        "mass_flow", "heater_power", "wall.heat_flux", "wall.temperature.t_w1", "wall.temperature.t_w2", "wall.temperature.t_w3",
        "wall.temperature.t_w4", "inlet.density", "inlet.viscosity", "inlet.bulk_velocity", "reynolds", "energy_balance.mismatch",
    ];

    public static int Run(string[] args)
    {
        ArgumentNullException.ThrowIfNull(args);
        var days = (int)(Option(args, "--days") ?? 50);
        var firstSeed = (int)(Option(args, "--first-seed") ?? 1);
        var draws = (int)(Option(args, "--draws") ?? 4);
        var keep = Text(args, "--keep");
        var interim = Text(args, "--card");
        var monteCarlo = args.Contains("--monte-carlo");
        // Without the generator's undeclared pressure zero drift: how much of a pressure's misses the drift causes.
        var noDrift = args.Contains("--no-drift");
        var root = keep ?? Path.Combine(Path.GetTempPath(), "bcprep-coverage-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture));
        Directory.CreateDirectory(root);
        var expanded = new CoverageTally();
        var typeA = new CoverageTally();
        var jcgm101 = new CoverageTally();
        var refusals = new List<string>();
        var rates = new List<double>();
        for (var seed = firstSeed; seed < firstSeed + days; seed++)
        {
            var recipe = DayRecipe.Draw(seed);
            if (noDrift)
            {
                recipe = recipe with { PressureZeroDriftPaPerH = 0.0 };
            }
            rates.Add(recipe.RateHz);
            var dir = Path.Combine(root, "day-" + seed.ToString(CultureInfo.InvariantCulture));
            Directory.CreateDirectory(dir);
            var cleanLog = Path.Combine(dir, "generated.csv");
            LogWriter.Write(recipe, cleanLog);
            for (var draw = 0; draw < draws; draw++)
            {
                // The calibration errors of a draw come from their own stream, so the day's noise stays that of its seed.
                var errors = CalibrationErrors.Draw(new Random(unchecked((seed * 104_729) + draw)));
                var runDir = Path.Combine(dir, "draw-" + draw.ToString(CultureInfo.InvariantCulture));
                Directory.CreateDirectory(runDir);
                var rig = Path.Combine(runDir, "rig.toml");
                var log = Path.Combine(runDir, "day.csv");
                File.WriteAllText(rig, RigTextWith(errors));
                CalibratedLog.Write(cleanLog, log, errors);
                var output = Path.Combine(runDir, "out");
                var refusal = Process(rig, log, output, monteCarlo);
                if (refusal is not null)
                {
                    refusals.Add(string.Create(CultureInfo.InvariantCulture, $"seed {seed} draw {draw}: {refusal}"));
                    Console.Error.WriteLine($"seed {seed,3} draw {draw}: REFUSED {refusal}");
                    continue;
                }
                var missed = new List<string>();
                var intervals = MonteCarloInterval.FromManifest(Path.Combine(output, "manifest.json"));
                foreach (var window in Scoring.FromManifest(Path.Combine(output, "manifest.json")))
                {
                    var written = WrittenPoint.Read(Path.Combine(output, "points", window.Id));
                    var truth = CoverageTruth.Of(recipe, errors, window.StartS, window.EndS);
                    foreach (var trial in Trials(written, truth))
                    {
                        expanded.Add(trial);
                        if (!trial.Covered)
                        {
                            missed.Add(string.Create(CultureInfo.InvariantCulture, $"{window.Id} {trial.Quantity} ({trial.Ratio:F2} U)"));
                        }
                    }
                    foreach (var trial in TypeATrials(written, truth))
                    {
                        typeA.Add(trial);
                    }
                    foreach (var interval in intervals.Where(i => i.Point == window.Id && Quantities.Contains(i.Quantity)))
                    {
                        if (truth.Physical.TryGetValue(interval.Quantity, out var t))
                        {
                            jcgm101.Add(interval.Against(t));
                        }
                    }
                }
                Console.Error.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"seed {seed,3} draw {draw} {recipe.RateHz,5} Hz: missed {missed.Count}{(missed.Count == 0 ? "" : ": " + string.Join("; ", missed))}"));
                if (keep is null)
                {
                    Directory.Delete(runDir, recursive: true);
                }
            }
            if (keep is null)
            {
                Directory.Delete(dir, recursive: true);
            }
            if (interim is not null)
            {
                // The card so far, so a long run that is stopped still leaves the days it finished.
                File.WriteAllText(interim, Card(expanded, typeA, jcgm101, seed - firstSeed + 1, firstSeed, draws, rates, refusals));
            }
        }
        if (keep is null)
        {
            Directory.Delete(root, recursive: true);
        }
        Console.Out.Write(Card(expanded, typeA, jcgm101, days, firstSeed, draws, rates, refusals));
        return 0;
    }

    /// <summary>Each compared quantity the point wrote, value ± U against its physical truth.</summary>
    public static IEnumerable<CoverageTrial> Trials(WrittenPoint written, CoverageTruth truth)
    {
        ArgumentNullException.ThrowIfNull(written);
        ArgumentNullException.ThrowIfNull(truth);
        foreach (var s in written.Scalars)
        {
            if (Quantities.Contains(s.Quantity) && truth.Physical.TryGetValue(s.Quantity, out var t))
            {
                yield return new CoverageTrial(s.Quantity, s.Value, s.ExpandedUncertainty, t, s.StandardUncertainty);
            }
        }
    }

    /// <summary>Each channel's window mean ± 2u_A against the noise-free window mean of its (mis)calibrated signal.</summary>
    public static IEnumerable<CoverageTrial> TypeATrials(WrittenPoint written, CoverageTruth truth)
    {
        ArgumentNullException.ThrowIfNull(written);
        ArgumentNullException.ThrowIfNull(truth);
        foreach (var a in written.TypeA)
        {
            if (truth.TypeA.TryGetValue(a.Channel, out var t) && a.StandardUncertainty > 0)
            {
                yield return new CoverageTrial(a.Channel, a.Mean, 2.0 * a.StandardUncertainty, t, a.StandardUncertainty);
            }
        }
    }

    /// <summary>The scorecard rig with the drawn diameter and heater loss fraction as its stated values.</summary>
    public static string RigTextWith(CalibrationErrors errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var text = RigText.Build("");
        const string diameter = "inner_diameter = \"52.5 mm\"";
        const string loss = "heater_loss_fraction = \"5 %\"";
        if (!text.Contains(diameter, StringComparison.Ordinal) || !text.Contains(loss, StringComparison.Ordinal))
        {
            throw new InvalidOperationException("the scorecard rig no longer states the diameter and loss fraction this tool replaces");
        }
        return text
            .Replace(diameter, string.Create(CultureInfo.InvariantCulture, $"inner_diameter = \"{errors.StatedDiameterM * 1000.0:F6} mm\""), StringComparison.Ordinal)
            .Replace(loss, string.Create(CultureInfo.InvariantCulture, $"heater_loss_fraction = \"{errors.StatedLossFraction * 100.0:F6} %\""), StringComparison.Ordinal);
    }

    private static string? Process(string rig, string log, string output, bool monteCarlo)
    {
        var error = new StringWriter();
        var context = new CliContext(new StringWriter(), error, () => Stream.Null, false, Directory.GetCurrentDirectory());
        string[] command = ["process", rig, log, "--out", output, "--quiet"];
        var code = BcPrepApp.Run(monteCarlo ? [.. command, "--monte-carlo"] : command, context);
        if (File.Exists(Path.Combine(output, "manifest.json")))
        {
            return null;
        }
        var first = error.ToString().Split('\n').FirstOrDefault(l => l.StartsWith("error", StringComparison.Ordinal)) ?? "";
        return string.Create(CultureInfo.InvariantCulture, $"exit {code}: {(first.Length > 200 ? first[..200] + "…" : first)}");
    }

    public static string Card(CoverageTally expanded, CoverageTally typeA, CoverageTally monteCarlo, int days, int firstSeed, int draws, IReadOnlyList<double> rates, IReadOnlyList<string> refusals)
    {
        ArgumentNullException.ThrowIfNull(expanded);
        ArgumentNullException.ThrowIfNull(typeA);
        ArgumentNullException.ThrowIfNull(monteCarlo);
        ArgumentNullException.ThrowIfNull(rates);
        ArgumentNullException.ThrowIfNull(refusals);
        var c = CultureInfo.InvariantCulture;
        var text = new StringBuilder();
        text.AppendLine(c, $"{days} days (seeds {firstSeed}–{firstSeed + days - 1}; {string.Join(", ", rates.GroupBy(r => r).OrderBy(g => g.Key).Select(g => $"{g.Count()}× {g.Key} Hz"))}), {draws} calibration draws each, {refusals.Count} runs refused");
        text.AppendLine();
        text.AppendLine("| quantity (value ± U against the true value) | target | covered | coverage | mean (v − t)/u | rms (v − t)/u |");
        text.AppendLine("|---|---|---|---|---|---|");
        Row(text, expanded, "**overall**", expanded.Overall, "93–97 %", null);
        foreach (var q in Quantities.Where(q => expanded.Count(q).Total > 0))
        {
            Row(text, expanded, q, expanded.Count(q), "≥ 90 %", q);
        }
        if (monteCarlo.Overall.Total > 0)
        {
            text.AppendLine();
            text.AppendLine("| quantity (JCGM 101 Monte Carlo 95 % interval against the true value) | covered | coverage | mean (v − t)/u | rms (v − t)/u |");
            text.AppendLine("|---|---|---|---|---|");
            Row(text, monteCarlo, "**overall**", monteCarlo.Overall, null, null);
            foreach (var q in Quantities.Where(q => monteCarlo.Count(q).Total > 0))
            {
                Row(text, monteCarlo, q, monteCarlo.Count(q), null, q);
            }
        }
        text.AppendLine();
        text.AppendLine("| channel (window mean ± 2u_A against its noise-free mean) | covered | coverage | mean (v − t)/u_A | rms (v − t)/u_A |");
        text.AppendLine("|---|---|---|---|---|");
        Row(text, typeA, "**overall**", typeA.Overall, null, null);
        foreach (var ch in RawSignals.ChannelIds.Where(ch => typeA.Count(ch).Total > 0))
        {
            Row(text, typeA, ch, typeA.Count(ch), null, ch);
        }
        foreach (var r in refusals)
        {
            text.AppendLine(c, $"\nrefused: {r}");
        }
        return text.ToString();
    }

    private static void Row(StringBuilder text, CoverageTally tally, string label, (int Covered, int Total) count, string? target, string? quantity)
    {
        var p = CoverageTally.Fraction(count);
        var (mean, rms) = quantity is null ? (double.NaN, double.NaN) : tally.NormalisedErrors(quantity);
        var c = CultureInfo.InvariantCulture;
        var errors = quantity is null ? "| | |" : string.Create(c, $"| {mean:F2} | {rms:F2} |");
        text.AppendLine(c, $"| {label} {(target is null ? "" : "| " + target + " ")}| {count.Covered} of {count.Total} | {100 * p:F1} % ± {100 * CoverageTally.StandardError(p, count.Total):F1} % {errors}");
    }

    private static double? Option(string[] args, string name) => Text(args, name) is { } v ? double.Parse(v, CultureInfo.InvariantCulture) : null;

    private static string? Text(string[] args, string name)
    {
        var i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? args[i + 1] : null;
    }
}
