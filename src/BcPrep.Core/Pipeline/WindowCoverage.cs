using System.Globalization;

namespace BcPrep.Pipeline;

/// <summary>
/// A window pinned in the rig file must be covered by samples at its start and at its end. A window that runs past
/// the end of the logs would otherwise be averaged over what happens to be there: a different window from the one
/// asked for, reported as if it were that one. Holes inside the window are the statistics' to judge
/// (<see cref="WindowStatistics"/>): they are reported, and only a window that loses too much to them fails, alone.
/// </summary>
public static class WindowCoverage
{
    /// <summary>
    /// Allowed hole (s) at either edge: the larger of <paramref name="maxBridgeS"/> (the gap
    /// the statistics would bridge) and two median sample intervals (so slow loggers are not refused for their
    /// own rate). Throws <see cref="BcPrepFailure"/> (input data) at <paramref name="location"/>, naming the hole.
    /// Empty input is the caller's to report.
    /// </summary>
    public static void Require(TimeWindow window, string channel, IReadOnlyList<double> timesS, double maxBridgeS, SourceLocation location)
    {
        if (timesS.Count == 0)
        {
            return;
        }
        var allowedS = Math.Max(maxBridgeS, 2 * MedianInterval(timesS));
        var (holeStart, holeEnd) = LargestHole(window, timesS);
        if (holeEnd - holeStart > allowedS)
        {
            var cover = string.Create(CultureInfo.InvariantCulture, $"{timesS[0] - window.StartS:F1}–{timesS[^1] - window.StartS:F1} s");
            throw new BcPrepFailure(FailureKind.InputData, location, string.Create(CultureInfo.InvariantCulture,
                $"window '{window.Id}' lasts {window.DurationS:F1} s but the logs cover only {cover} of it for '{channel}': no samples for {holeEnd - holeStart:F1} s " +
                $"(from {holeStart - window.StartS:F1} s to {holeEnd - window.StartS:F1} s into the window; more than {allowedS:G3} s); move the window or find the missing rows"));
        }
    }

    private static (double Start, double End) LargestHole(TimeWindow window, IReadOnlyList<double> timesS)
    {
        var best = (Start: window.StartS, End: timesS[0]);
        if (window.EndS - timesS[^1] > best.End - best.Start)
        {
            best = (timesS[^1], window.EndS);
        }
        return best;
    }

    private static double MedianInterval(IReadOnlyList<double> timesS)
    {
        if (timesS.Count < 2)
        {
            return 0;
        }
        var steps = new double[timesS.Count - 1];
        for (var i = 1; i < timesS.Count; i++)
        {
            steps[i - 1] = timesS[i] - timesS[i - 1];
        }
        Array.Sort(steps);
        return steps[steps.Length / 2];
    }
}
