namespace BcPrep;

/// <summary>What kind of failure stopped a run; the command-line front end maps each to one exit code.</summary>
public enum FailureKind
{
    /// <summary>The rig file (or another configuration file) is invalid.</summary>
    Configuration,
    /// <summary>A log file is unreadable, malformed, or holds values that cannot be trusted.</summary>
    InputData,
    /// <summary>No steady operating point was found, or a consistency check failed where it must pass.</summary>
    NoSteadyPoint,
    /// <summary>Outputs could not be written.</summary>
    Output,
}

/// <summary>One problem found in an input, with its location.</summary>
public sealed record Problem(SourceLocation Location, string Message)
{
    public override string ToString() => $"{Location}: {Message}";
}

/// <summary>
/// A failure that names every problem found (a rig file with three mistakes reports all three at once).
/// Thrown by Core at the edges; the front end prints <see cref="Problems"/> and exits with the code for
/// <see cref="Kind"/>.
/// </summary>
public class BcPrepFailure : BcPrepDataException
{
    public BcPrepFailure(FailureKind kind, IReadOnlyList<Problem> problems)
        : base(string.Join(Environment.NewLine, problems))
    {
        Kind = kind;
        Problems = problems;
    }

    public BcPrepFailure(FailureKind kind, SourceLocation location, string message)
        : this(kind, [new Problem(location, message)])
    {
    }

    public FailureKind Kind { get; }

    public IReadOnlyList<Problem> Problems { get; }
}
