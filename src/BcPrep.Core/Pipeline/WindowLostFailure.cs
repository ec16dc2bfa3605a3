namespace BcPrep.Pipeline;

/// <summary>
/// Too little of an operating point's window is left once its gaps are taken out (<see cref="WindowStatistics.LostFractionLimit"/>).
/// The point fails alone: the day's other points are still reduced and written, and the manifest lists this one with
/// its reason. Outside <see cref="DayProcessor"/> it is an ordinary input-data failure (exit code 3).
/// </summary>
public sealed class WindowLostFailure(SourceLocation location, string message) : BcPrepFailure(FailureKind.InputData, location, message);
