using BcPrep.Pipeline;
using BcPrep.Rig;
using BcPrep.Steady;

namespace BcPrep.Writing;

/// <summary>
/// The table of detected windows (the <c>windows</c> command): one row per accepted window, optionally one per
/// rejected stretch, with every key channel's mean, drift slope ± standard uncertainty, scatter, R and MSER
/// truncation beside the limits they were held to. Times in s since the first sample of the day.
/// For an accepted row, start/end is the averaging window (the settled tail) and stretch start/end the steady
/// stretch it closes; for a rejected row, start/end is the test window that came closest to passing and stretch
/// start/end the whole rejected stretch.
/// </summary>
public static class WindowTable
{
    /// <summary>Builds the table; <paramref name="includeRejected"/> adds the rejected stretches with their reasons.</summary>
    public static CsvTable Build(RigDescription rig, DayWindows day, bool includeRejected)
    {
        ArgumentNullException.ThrowIfNull(rig);
        ArgumentNullException.ThrowIfNull(day);
        // The key channels in force: written in [steady], or the defaults (DetectionKeys); step markers are not judged.
        var keys = DetectionKeys.For(rig, _ => []).Where(k => !k.StepOnly).Select(k => (Channel: k.Name, Unit: Unit(rig, k.Name))).ToList();
        var header = new List<string>
        {
            "point", "status", "origin", "start [s]", "end [s]", "duration [s]", "stretch start [s]", "stretch end [s]", "accepted by", "reason",
        };
        foreach (var (channel, unit) in keys)
        {
            var rate = unit.Contains('/', StringComparison.Ordinal) ? $"({unit})/s" : unit + "/s";
            header.AddRange([
                $"{channel} mean [{unit}]", $"{channel} slope [{rate}]", $"{channel} slope u [{rate}]", $"{channel} drift limit [{rate}]",
                $"{channel} std dev [{unit}]", $"{channel} scatter limit [{unit}]", $"{channel} R [1]", $"{channel} R crit [1]",
                $"{channel} MSER truncation [s]", $"{channel} tau [s]", $"{channel} remaining change [{unit}]", $"{channel} tolerance [{unit}]",
                $"{channel} settled since [s]",
            ]);
        }
        var table = new CsvTable(header);
        var pinned = rig.Points.Select(p => new TimeWindow(p.Id, day.Start.Resolve(p.Start).Value, day.Start.Resolve(p.End).Value)).ToList();
        var plan = PointWindows.Plan(pinned, day.Detection, day.Start);
        var rows = new List<(double StartS, object?[] Cells)>();
        foreach (var assignment in plan.Detected)
        {
            var w = assignment.Window;
            var origin = assignment.PinnedBy is null ? "detected" : "detected, replaced by the window pinned in the rig file";
            rows.Add((w.StretchStartS, Row(assignment.PointId, "accepted", origin, w.StartS, w.EndS, w.StretchStartS, w.StretchEndS, Methods(w.AcceptedBy), "", w.Channels, keys)));
        }
        if (includeRejected)
        {
            foreach (var r in day.Detection.Rejected)
            {
                rows.Add((r.StartS, Row("", "rejected", "detected", r.EvaluatedStartS, r.EvaluatedEndS, r.StartS, r.EndS, "", r.Reason, r.Channels, keys)));
            }
        }
        foreach (var (_, cells) in rows.OrderBy(r => r.StartS))
        {
            table.Add(cells);
        }
        return table;
    }

    /// <summary>Method flags as words joined by '+', e.g. "drift-scatter+r-test+mser"; "none" when empty.</summary>
    public static string Methods(SteadyMethod methods) => ChoiceSpelling.Names(methods);

    private static object?[] Row(string id, string status, string origin, double startS, double endS, double stretchStartS, double stretchEndS,
        string methods, string reason, IReadOnlyList<ChannelCriteria> criteria, List<(string Channel, string Unit)> keys)
    {
        var cells = new List<object?> { id, status, origin, startS, endS, endS - startS, stretchStartS, stretchEndS, methods, reason };
        foreach (var (channel, _) in keys)
        {
            var c = criteria.FirstOrDefault(x => x.Channel == channel);
            cells.AddRange(c is null
                ? Enumerable.Repeat<object?>(null, 13)
                : [c.Mean, c.SlopePerS, c.SlopeUncertaintyPerS, c.DriftLimitPerS, c.StandardDeviation, c.ScatterLimit, c.R, c.RCritical, c.MserTruncationS,
                    c.TauS, c.RemainingChange, c.Tolerance, c.SettledSinceS]);
        }
        return [.. cells];
    }

    private static string Unit(RigDescription rig, string channel) =>
        rig.Channel(channel) is { } spec ? UnitText.SiSymbol(spec.Dimension) : "1";
}
