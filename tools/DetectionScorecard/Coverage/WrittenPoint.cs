using System.Globalization;
using System.Text.RegularExpressions;

namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>A scalar a run wrote: its value, expanded uncertainty U and coverage factor k.</summary>
public sealed record WrittenScalar(string Quantity, double Value, double StandardUncertainty, double ExpandedUncertainty);

/// <summary>A channel's window mean and its Type A standard uncertainty, from a point's budget.</summary>
public sealed record WrittenTypeA(string Channel, double Mean, double StandardUncertainty);

/// <summary>What `process` wrote for one point: points/ID/scalars.csv and the Type A rows of points/ID/budget.csv.</summary>
public sealed partial record WrittenPoint(IReadOnlyList<WrittenScalar> Scalars, IReadOnlyList<WrittenTypeA> TypeA)
{
    public static WrittenPoint Read(string pointFolder)
    {
        var culture = CultureInfo.InvariantCulture;
        var scalars = new List<WrittenScalar>();
        foreach (var line in File.ReadLines(Path.Combine(pointFolder, "scalars.csv")).Where(l => !l.StartsWith('#')).Skip(1))
        {
            // quantity,unit,value,standard_uncertainty,expanded_uncertainty,... : the first five never hold a comma.
            var f = line.Split(',', 6);
            if (f.Length >= 5 && f[2].Length > 0 && f[4].Length > 0)
            {
                scalars.Add(new WrittenScalar(f[0], double.Parse(f[2], culture), double.Parse(f[3], culture), double.Parse(f[4], culture)));
            }
        }
        var typeA = new Dictionary<string, WrittenTypeA>(StringComparer.Ordinal);
        foreach (var line in File.ReadLines(Path.Combine(pointFolder, "budget.csv")))
        {
            if (WindowMeanRow().Match(line) is { Success: true } m && !typeA.ContainsKey(m.Groups["ch"].Value))
            {
                typeA[m.Groups["ch"].Value] = new WrittenTypeA(m.Groups["ch"].Value, double.Parse(m.Groups["mean"].Value, culture), double.Parse(m.Groups["u"].Value, culture));
            }
        }
        return new WrittenPoint(scalars, [.. typeA.Values]);
    }

    // point,quantity,unit,input,type,input_estimate,input_standard_uncertainty,...
    [GeneratedRegex("^[^,]*,[^,]*,[^,]*,(?<ch>[^,\" ]+) window mean,A,(?<mean>[^,]+),(?<u>[^,]+),")]
    private static partial Regex WindowMeanRow();
}
