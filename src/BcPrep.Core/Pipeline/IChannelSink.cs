namespace BcPrep.Pipeline;

/// <summary>Receives a channel's calibrated samples in time order, one block at a time.</summary>
public interface IChannelSink
{
    /// <param name="channel">Channel id.</param>
    /// <param name="timeS">Sample times (log clock, s), increasing.</param>
    /// <param name="valueSi">SI values; NaN marks a missing sample.</param>
    void Accept(string channel, ReadOnlySpan<double> timeS, ReadOnlySpan<double> valueSi);

    /// <summary>Called once after the channel's last sample.</summary>
    void Complete(string channel);
}
