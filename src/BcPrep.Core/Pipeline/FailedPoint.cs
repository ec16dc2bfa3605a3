using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>An operating point that could not be reduced (its window lost too much to gaps); times on the log clock (s).</summary>
public sealed record FailedPoint(string Id, double StartS, double EndS, string Reason)
{
    /// <summary>The window's start on the logger clock, typed.</summary>
    public LoggerSeconds Start => new(StartS);

    /// <summary>The window's end on the logger clock, typed.</summary>
    public LoggerSeconds End => new(EndS);
}
