using System.Text.Json;

namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>A JCGM 101 coverage interval a `process --monte-carlo` run wrote for one quantity of one point.</summary>
public sealed record MonteCarloInterval(string Point, string Quantity, double Low, double High, double StandardUncertainty)
{
    /// <summary>The interval as a trial: its midpoint ± its half-width, so covered exactly when Low ≤ truth ≤ High.</summary>
    public CoverageTrial Against(double truth) => new(Quantity, 0.5 * (Low + High), 0.5 * (High - Low), truth, StandardUncertainty);

    /// <summary>Every Monte Carlo interval of a run's manifest (none when it ran without --monte-carlo).</summary>
    public static IReadOnlyList<MonteCarloInterval> FromManifest(string manifestPath)
    {
        using var document = JsonDocument.Parse(File.ReadAllBytes(manifestPath));
        var result = new List<MonteCarloInterval>();
        foreach (var point in document.RootElement.GetProperty("points").EnumerateArray())
        {
            var id = point.GetProperty("id").GetString() ?? "";
            foreach (var quantity in point.GetProperty("quantities").EnumerateArray())
            {
                if (quantity.TryGetProperty("monte_carlo", out var mc)
                    && mc.TryGetProperty("interval_low", out var low) && low.ValueKind == JsonValueKind.Number
                    && mc.TryGetProperty("interval_high", out var high) && high.ValueKind == JsonValueKind.Number)
                {
                    result.Add(new MonteCarloInterval(id, quantity.GetProperty("name").GetString() ?? "", low.GetDouble(), high.GetDouble(),
                        mc.GetProperty("standard_uncertainty").GetDouble()));
                }
            }
        }
        return result;
    }
}
