using BcPrep.Conditioning;
using BcPrep.Uncertainty;

namespace BcPrep.Pipeline;

/// <summary>
/// What one channel did inside one window: counts, the mean and its Type A uncertainty (from de-spiked but
/// unfiltered samples, because a low-pass narrows the scatter and would understate the uncertainty), and what
/// conditioning changed.
/// </summary>
public sealed record ChannelWindowStats(
    string Channel,
    string Window,
    int SampleCount,
    int MissingCount,
    int BridgedSamples,
    int SpikesReplaced,
    double Mean,
    double StandardDeviation,
    double Min,
    double Max,
    WindowMeanResult TypeA,
    IReadOnlyList<SensorFaultFlag> Faults);

/// <summary>Reduces one channel's window samples to <see cref="ChannelWindowStats"/>.</summary>
public static class WindowStatistics
{
    /// <summary>Longest gap (s) bridged by interpolation inside a window; a longer one fails the window.</summary>
    public const double DefaultMaxBridgeS = 2.0;

    public static ChannelWindowStats Evaluate(string channel, TimeWindow window, double[] timesS, double[] values, double maxBridgeS = DefaultMaxBridgeS)
    {
        var finite = values.Count(double.IsFinite);
        if (finite < 3)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel),
                $"window '{window.Id}' ({window.StartS:F1}–{window.EndS:F1} s) holds {finite} valid samples of '{channel}'; at least 3 are needed");
        }
        var bridged = GapBridging.Bridge(timesS, values, maxBridgeS);
        var interior = bridged.Report.Unbridged.Where(g => !g.AtRecordEdge).ToList();
        if (interior.Count > 0)
        {
            var gap = interior.OrderByDescending(g => g.DurationS).First();
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel), string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"channel '{channel}' has a {gap.DurationS:F1} s gap ({gap.StartS:F1}–{gap.EndS:F1} s) inside window '{window.Id}', longer than the {maxBridgeS:G} s that may be bridged"));
        }
        var kept = bridged.Values.Where(double.IsFinite).ToArray();
        var despiked = HampelFilter.Apply(kept);
        var clean = despiked.Values;
        var faults = SensorFaults.Check(clean, new SensorFaultLimits()).Flags;
        var typeA = WindowMean.Evaluate(clean);
        return new ChannelWindowStats(
            channel, window.Id, clean.Length, values.Length - finite, bridged.Report.InterpolatedSamples,
            despiked.ReplacedIndices.Count, typeA.Mean, typeA.StandardDeviation, clean.Min(), clean.Max(), typeA, faults);
    }
}
