namespace BcPrep.Pipeline;

/// <summary>An operating point that could not be reduced (its window lost too much to gaps); times on the log clock (s).</summary>
public sealed record FailedPoint(string Id, double StartS, double EndS, string Reason);
