namespace BcPrep.Pipeline;

/// <summary>
/// A channel's second tare, at the end of the day: its statistics and the mid-times (s, on the day's clock) of the
/// start and end tare windows, between which the zero is interpolated linearly to each point's mid-time.
/// </summary>
public sealed record EndTare(ChannelWindowStats Stats, double StartMidS, double EndMidS)
{
    /// <summary>Weight of the end tare at <paramref name="timeS"/>: 0 at the start tare, 1 at the end one (common practice).</summary>
    public double WeightAt(double timeS) => EndMidS > StartMidS ? (timeS - StartMidS) / (EndMidS - StartMidS) : 0.5;
}
