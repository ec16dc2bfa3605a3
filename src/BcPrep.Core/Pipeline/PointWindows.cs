using System.Globalization;
using BcPrep.Steady;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>An operating point's averaging window, where it came from, and the detected windows behind it.</summary>
/// <param name="Window">Averaging window on the log clock (s).</param>
/// <param name="Origin">Pinned in the rig file, or detected.</param>
/// <param name="Detected">
/// Detected windows this point stands for: the one it is (detected point), or those it replaces (pinned point);
/// times in s since the first sample of the day.
/// </param>
public sealed record PlannedPoint(TimeWindow Window, WindowOrigin Origin, IReadOnlyList<SteadyWindow> Detected);

/// <summary>A detected window and the point id it carries in <c>process</c>; <paramref name="PinnedBy"/> names the pinned point that replaces it.</summary>
public sealed record DetectedAssignment(SteadyWindow Window, string PointId, string? PinnedBy);

/// <summary>The operating points of a day in time order, and what became of each detected window.</summary>
public sealed record WindowPlan(IReadOnlyList<PlannedPoint> Points, IReadOnlyList<DetectedAssignment> Detected);

/// <summary>
/// Merges pinned and detected windows, per point: a pinned window replaces every detected window whose steady
/// stretch it overlaps (a stretch overlapping several pinned windows goes to the one it overlaps most) and keeps its
/// id; the other
/// detected windows become points OP1, OP2, … in time order, skipping ids the rig file already uses.
/// </summary>
public static class PointWindows
{
    /// <param name="pinned">Windows pinned in the rig file, on the log clock (s).</param>
    /// <param name="detection">Detection result (times since the day's first sample), or null when detection is off.</param>
    /// <param name="dayStart">The day's first sample, where detection's times meet the log clock.</param>
    public static WindowPlan Plan(IReadOnlyList<TimeWindow> pinned, SteadyDetectionResult? detection, DayStart dayStart)
    {
        ArgumentNullException.ThrowIfNull(pinned);
        var accepted = detection?.Accepted ?? [];
        var replaced = pinned.ToDictionary(p => p.Id, _ => new List<SteadyWindow>(), StringComparer.Ordinal);
        var used = pinned.Select(p => p.Id).ToHashSet(StringComparer.Ordinal);
        var assignments = new List<DetectedAssignment>();
        var points = new List<PlannedPoint>();
        var next = 1;
        foreach (var window in accepted.OrderBy(w => w.StartS))
        {
            var onClock = new TimeWindow("", dayStart.OnClock(window.Start).Value, dayStart.OnClock(window.End).Value);
            // Matched on the whole steady stretch, not only its averaging tail: a stretch is one operating point,
            // so a window pinned early in it must not leave the detected tail behind as a second point.
            var stretch = new TimeWindow("", dayStart.OnClock(window.StretchStart).Value, dayStart.OnClock(window.StretchEnd).Value);
            var owner = pinned.Where(p => Overlap(p, stretch) > 0).OrderByDescending(p => Overlap(p, stretch)).FirstOrDefault();
            if (owner is not null)
            {
                replaced[owner.Id].Add(window);
                assignments.Add(new DetectedAssignment(window, owner.Id, owner.Id));
                continue;
            }
            string id;
            do
            {
                id = string.Create(CultureInfo.InvariantCulture, $"OP{next++}");
            }
            while (used.Contains(id));
            used.Add(id);
            assignments.Add(new DetectedAssignment(window, id, null));
            points.Add(new PlannedPoint(onClock with { Id = id }, WindowOrigin.Detected, [window]));
        }
        points.AddRange(pinned.Select(p => new PlannedPoint(p, WindowOrigin.RigFile, replaced[p.Id])));
        return new WindowPlan([.. points.OrderBy(p => p.Window.StartS)], assignments);
    }

    /// <summary>
    /// Warnings about pinned windows that detection does not support: a pinned window that no detected steady window
    /// overlaps, or one that reaches outside the steady stretch detected there (its edge may still drift). A pinned
    /// window still wins: the engineer may know better, but should be told.
    /// </summary>
    public static IReadOnlyList<string> PinnedWarnings(WindowPlan plan, DayStart dayStart)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var warnings = new List<string>();
        foreach (var point in plan.Points.Where(p => p.Origin == WindowOrigin.RigFile))
        {
            var startS = dayStart.Since(point.Window.Start).Value;
            var endS = dayStart.Since(point.Window.End).Value;
            if (point.Detected.Count == 0)
            {
                warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"point '{point.Window.Id}': no detected steady window overlaps the pinned window {startS:F0}–{endS:F0} s"));
                continue;
            }
            var stretchStartS = point.Detected.Min(w => w.StretchStartS);
            var stretchEndS = point.Detected.Max(w => w.StretchEndS);
            if (startS < stretchStartS || endS > stretchEndS)
            {
                warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"point '{point.Window.Id}': the pinned window {startS:F0}–{endS:F0} s reaches outside the detected steady stretch {stretchStartS:F0}–{stretchEndS:F0} s; its edge may still drift"));
            }
        }
        return warnings;
    }

    /// <summary>Length (s) of the intersection of two windows; 0 or negative when they do not overlap.</summary>
    public static double Overlap(TimeWindow a, TimeWindow b)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        return Math.Min(a.EndS, b.EndS) - Math.Max(a.StartS, b.StartS);
    }
}
