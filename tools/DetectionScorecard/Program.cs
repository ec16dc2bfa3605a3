using System.Globalization;
using System.Text;
using BcPrep.Cli;

namespace BcPrep.Tools.Scorecard;

/// <summary>
/// The detection scorecard: generates varied days with known truth (<see cref="DayRecipe"/>), runs
/// <c>bcprep process</c> in-process on each with the rig's settings, and prints how the windows compare with the
/// truth. Usage: dotnet run -c Release --project tools/DetectionScorecard -- [--days 50] [--first-seed 1]
/// [--steady hand|defaults] [--filters] [--keep DIR]. --filters adds the conditioning a 1 kHz day with hum needs
/// (mains = "50 Hz", lowpass_cutoff = "0.5 Hz"), so detection runs on the filtered series. The scorecard (Markdown) goes to standard output, one line per day to
/// standard error.
/// </summary>
internal static class Program
{
    private static int Main(string[] args)
    {
        if (args.Length > 0 && args[0] == "coverage")
        {
            return Coverage.CoverageProgram.Run(args[1..]);
        }
        var days = (int)(Option(args, "--days") ?? 50);
        var firstSeed = (int)(Option(args, "--first-seed") ?? 1);
        var steady = Text(args, "--steady") ?? "defaults";
        var keep = Text(args, "--keep");
        var root = keep ?? Path.Combine(Path.GetTempPath(), "bcprep-scorecard-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture));
        Directory.CreateDirectory(root);
        var steadyTable = steady == "hand" ? RigText.HandWrittenSteady : "";
        var filters = args.Contains("--filters");
        if (filters)
        {
            steadyTable += "\n" + RigText.Filters;
        }
        var scores = new List<DayScore>();
        for (var seed = firstSeed; seed < firstSeed + days; seed++)
        {
            var recipe = DayRecipe.Draw(seed);
            var truth = DayTruth.Of(recipe);
            var dir = Path.Combine(root, "day-" + seed.ToString(CultureInfo.InvariantCulture));
            Directory.CreateDirectory(dir);
            var rig = Path.Combine(dir, "rig.toml");
            var log = Path.Combine(dir, "day.csv");
            File.WriteAllText(rig, RigText.Build(steadyTable));
            LogWriter.Write(recipe, log);
            var score = Run(recipe, truth, rig, log, Path.Combine(dir, "out"));
            scores.Add(score);
            Console.Error.WriteLine(DayLine(score, truth));
            if (keep is null)
            {
                Directory.Delete(dir, recursive: true);
            }
        }
        if (keep is null)
        {
            Directory.Delete(root, recursive: true);
        }
        Console.Out.Write(Card(scores, steady + " [steady] settings" + (filters ? ", notch and low-pass" : "")));
        return 0;
    }

    private static DayScore Run(DayRecipe recipe, DayTruth truth, string rig, string log, string output)
    {
        var error = new StringWriter();
        var context = new CliContext(new StringWriter(), error, () => Stream.Null, false, Directory.GetCurrentDirectory());
        var code = BcPrepApp.Run(["process", rig, log, "--out", output, "--quiet"], context);
        var manifest = Path.Combine(output, "manifest.json");
        if (!File.Exists(manifest))
        {
            var first = error.ToString().Split('\n').FirstOrDefault(l => l.StartsWith("error", StringComparison.Ordinal)) ?? "";
            return Scoring.Score(recipe, truth, [], string.Create(CultureInfo.InvariantCulture, $"exit {code}: {Shorten(first)}"));
        }
        return Scoring.Score(recipe, truth, Scoring.FromManifest(manifest), null);
    }

    private static string Shorten(string text) => text.Length > 200 ? text[..200] + "…" : text;

    private static string DayLine(DayScore s, DayTruth truth) => string.Create(CultureInfo.InvariantCulture,
        $"seed {s.Seed,3} {s.RateHz,5} Hz ({DayRecipe.Draw(s.Seed).Shapes.Describe()}): {s.Found.Count}/{s.Points} found, {s.Extra} extra, transient {s.MaxTransientS:F0} s, delays [{string.Join(" ", s.Found.Select(f => f.StartDelayS.ToString("F0", CultureInfo.InvariantCulture)))}] s, used [{string.Join(" ", s.Found.Select(f => f.FractionUsed.ToString("F2", CultureInfo.InvariantCulture)))}], steady [{string.Join(" ", truth.Windows.Select(w => w.SteadyS.ToString("F0", CultureInfo.InvariantCulture)))}] s{(s.Refusal is null ? "" : " REFUSED " + s.Refusal)}");

    private static string Card(List<DayScore> scores, string steady)
    {
        var points = scores.Sum(s => s.Points);
        var found = scores.SelectMany(s => s.Found).ToList();
        var refused = scores.Where(s => s.Refusal is not null).ToList();
        var text = new StringBuilder();
        var c = CultureInfo.InvariantCulture;
        text.AppendLine(c, $"| measure | target | result |");
        text.AppendLine("|---|---|---|");
        text.AppendLine(c, $"| days ({steady}) | ≥ 50 | {scores.Count} ({string.Join(", ", scores.GroupBy(s => s.RateHz).OrderBy(g => g.Key).Select(g => $"{g.Count()}× {g.Key} Hz"))}) |");
        text.AppendLine(c, $"| points found | 100 % | {found.Count} of {points} ({100.0 * found.Count / Math.Max(1, points):F1} %) |");
        text.AppendLine(c, $"| extra windows | 0 | {scores.Sum(s => s.Extra)} |");
        text.AppendLine(c, $"| days refused | 0 | {refused.Count} |");
        text.AppendLine(c, $"| max transient averaged into a window | ≤ 5 s | {(found.Count == 0 ? 0 : found.Max(f => f.TransientS)):F0} s ({found.Count(f => f.TransientS > 5)} windows > 5 s) |");
        text.AppendLine(c, $"| median start after the true settle time | ≤ 60 s | {Median(found.Select(f => f.StartDelayS)):F0} s |");
        text.AppendLine(c, $"| median fraction of the true steady window used | ≥ 80 % | {100 * Median(found.Select(f => f.FractionUsed)):F0} % |");
        foreach (var r in refused)
        {
            text.AppendLine(c, $"\nrefused: seed {r.Seed} ({r.RateHz} Hz): {r.Refusal}");
        }
        return text.ToString();
    }

    private static double Median(IEnumerable<double> values)
    {
        var sorted = values.OrderBy(v => v).ToArray();
        if (sorted.Length == 0)
        {
            return double.NaN;
        }
        return sorted.Length % 2 == 1 ? sorted[sorted.Length / 2] : 0.5 * (sorted[(sorted.Length / 2) - 1] + sorted[sorted.Length / 2]);
    }

    private static double? Option(string[] args, string name) => Text(args, name) is { } v ? double.Parse(v, CultureInfo.InvariantCulture) : null;

    private static string? Text(string[] args, string name)
    {
        var i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? args[i + 1] : null;
    }
}
