using System.Text.Json;

namespace BcPrep.Tools.Scorecard;

/// <summary>An averaging window a run wrote (s since the first sample).</summary>
public sealed record FoundWindow(string Id, double StartS, double EndS);

/// <summary>How one found window compares with the true steady window of the point it falls in.</summary>
public sealed record PointScore(int Index, double StartDelayS, double FractionUsed, double TransientS);

/// <summary>One day's result against its truth.</summary>
public sealed record DayScore(int Seed, double RateHz, int Points, IReadOnlyList<PointScore> Found, int Extra, string? Refusal)
{
    public double MaxTransientS => Found.Count == 0 ? 0 : Found.Max(p => p.TransientS);
}

/// <summary>Scores the windows of a run against a day's truth.</summary>
public static class Scoring
{
    /// <summary>
    /// A window belongs to the point whose step-to-step span holds its midpoint; the first such window is the point
    /// found, any other (and any window in the rest period before the first step) is extra. Transient averaged in:
    /// the seconds of the window before the true settle time or after the next step. Start delay: window start
    /// minus true settle time. Fraction used: the part of the true steady window that the window covers.
    /// </summary>
    public static DayScore Score(DayRecipe recipe, DayTruth truth, IReadOnlyList<FoundWindow> windows, string? refusal)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        ArgumentNullException.ThrowIfNull(truth);
        ArgumentNullException.ThrowIfNull(windows);
        var found = new List<PointScore>();
        var extra = 0;
        foreach (var w in windows.OrderBy(w => w.StartS))
        {
            var mid = 0.5 * (w.StartS + w.EndS);
            var point = truth.Windows.FirstOrDefault(t => mid >= t.StepS && mid < t.EndS);
            if (point is null || found.Any(f => f.Index == point.Index))
            {
                extra++;
                continue;
            }
            var transient = Math.Max(0, Math.Min(w.EndS, point.SettledS) - w.StartS) + Math.Max(0, w.EndS - Math.Max(w.StartS, point.EndS));
            var overlap = Math.Max(0, Math.Min(w.EndS, point.EndS) - Math.Max(w.StartS, point.SettledS));
            found.Add(new PointScore(point.Index, w.StartS - point.SettledS, overlap / point.SteadyS, transient));
        }
        return new DayScore(recipe.Seed, recipe.RateHz, truth.Windows.Count, found, extra, refusal);
    }

    /// <summary>The windows of the points a run wrote, from its manifest.</summary>
    public static IReadOnlyList<FoundWindow> FromManifest(string manifestPath)
    {
        using var document = JsonDocument.Parse(File.ReadAllBytes(manifestPath));
        var result = new List<FoundWindow>();
        foreach (var point in document.RootElement.GetProperty("points").EnumerateArray())
        {
            var window = point.GetProperty("window");
            result.Add(new FoundWindow(point.GetProperty("id").GetString() ?? "", window.GetProperty("start_s").GetDouble(), window.GetProperty("end_s").GetDouble()));
        }
        return result;
    }
}
