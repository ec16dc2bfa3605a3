using System.Globalization;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>The steady-detection settings in effect, as lines for a person (<c>bcprep check</c>).</summary>
public static class DetectionSettingsText
{
    public static IReadOnlyList<string> Lines(RigDescription rig)
    {
        ArgumentNullException.ThrowIfNull(rig);
        var steady = rig.Steady;
        var lines = new List<string>();
        if (!WindowFinder.IsEnabled(rig))
        {
            lines.Add("steady detection: off" + (steady.Detect ? " (no key channel, written or by default)" : " ([steady] detect = false)"));
            return lines;
        }
        var c = CultureInfo.InvariantCulture;
        lines.Add(string.Create(c, $"steady detection: block {steady.BlockS} s, test window {steady.WindowS} s (the shortest settled window), shortest plateau {steady.MinDurationS} s"));
        var written = steady.Keys.Count > 0;
        foreach (var key in DetectionKeys.For(rig, _ => []))
        {
            var unit = rig.Channel(key.Name) is { } spec ? UnitText.SiSymbol(spec.Dimension) : "";
            if (key.StepOnly)
            {
                lines.Add($"  {key.Name}: marks set-point steps only (a heater channel)");
                continue;
            }
            var tolerance = written
                ? string.Create(c, $"remaining change ≤ {key.DriftLimitPerS * steady.WindowS:G4} {unit} (max_change), scatter ≤ {key.ScatterLimit:G4} {unit}, step ≥ {key.StepThreshold:G4} {unit}")
                : string.Create(c, $"remaining change ≤ {DetectionKeys.ToleranceFractionOfU:0.##} × its declared standard uncertainty (default), step from its noise");
            var minimum = double.IsFinite(key.MinimumValue) ? string.Create(c, $", operating minimum {key.MinimumValue:G4} {unit}")
                : key.RestFractionOfLargest is { } fraction
                    ? string.Create(c, $", operating minimum {fraction:P0} of the day's largest flow (default)") : "";
            lines.Add($"  key {key.Name}{(written ? "" : " (default)")}: {tolerance}{minimum}");
        }
        return lines;
    }
}
