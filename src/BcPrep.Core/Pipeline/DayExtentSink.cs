namespace BcPrep.Pipeline;

/// <summary>Records the first and last sample time of the day (log clock, s), for the test day's dates.</summary>
public sealed class DayExtentSink : IChannelSink
{
    /// <summary>Earliest sample time seen; +∞ before any sample.</summary>
    public double FirstS { get; private set; } = double.PositiveInfinity;

    /// <summary>Latest sample time seen; −∞ before any sample.</summary>
    public double LastS { get; private set; } = double.NegativeInfinity;

    public void Accept(string channel, ReadOnlySpan<double> timeS, ReadOnlySpan<double> valueSi)
    {
        // Times arrive in increasing order within a channel, so the ends of each block suffice.
        if (timeS.Length == 0)
        {
            return;
        }
        FirstS = Math.Min(FirstS, timeS[0]);
        LastS = Math.Max(LastS, timeS[^1]);
    }

    public void Complete(string channel)
    {
    }
}
