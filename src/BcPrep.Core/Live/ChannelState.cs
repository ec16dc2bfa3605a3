using BcPrep.Uncertainty;

namespace BcPrep.Live;

/// <summary>Where a key channel stands in the current stretch.</summary>
public enum ChannelState
{
    /// <summary>Changing, and no first-order approach describes it yet.</summary>
    Moving,

    /// <summary>Approaching a settled value: τ and the remaining change are known.</summary>
    Approaching,

    /// <summary>Within its tolerance of the settled value since <see cref="ChannelReport.SettledSinceS"/>.</summary>
    Settled,
}

/// <summary>
/// One key channel at one report: its state, the approach (τ, change still to come, time until settled), and once
/// settled the hold the channel's hold target needs (null without a target).
/// </summary>
public sealed record ChannelReport(
    string Channel,
    ChannelState State,
    double MeanSi,
    double TauS,
    double RemainingChangeSi,
    double SettledSinceS,
    double TimeToSettleS,
    HoldTimeEstimate? Hold);

/// <summary>The current stretch at one moment: since when it runs, and each key channel.</summary>
public sealed record StretchReport(double TimeS, double StretchStartS, IReadOnlyList<ChannelReport> Channels)
{
    /// <summary>All key channels settled: the point is being held.</summary>
    public bool Settled => Channels.Count > 0 && Channels.All(c => c.State == ChannelState.Settled);

    /// <summary>The latest moment a key channel became (or will become) settled; NaN while one is still moving.</summary>
    public double SettledFromS => Channels.Any(c => c.State == ChannelState.Moving) ? double.NaN : Channels.Max(c => c.SettledSinceS);
}

/// <summary>A point that ended: its stretch, settled from, and the step that ended it (s since the day's first row).</summary>
public sealed record FinishedStretch(double StretchStartS, double SettledFromS, double EndS);
