namespace BcPrep.Cli;

/// <summary>The documented, stable exit codes of bcprep (README "Exit codes").</summary>
public static class ExitCodes
{
    public const int Success = 0;
    /// <summary>Unused: reserved so that a generic failure of the runtime is never mistaken for one of ours.</summary>
    public const int Reserved = 1;
    /// <summary>Usage error on the command line, or an invalid rig file.</summary>
    public const int UsageOrRigFile = 2;
    /// <summary>A log file is unreadable, malformed, or holds values that cannot be trusted.</summary>
    public const int BadInputData = 3;
    /// <summary>No steady operating point was found, or a consistency check that must pass failed.</summary>
    public const int NoSteadyPoint = 4;
    /// <summary>Outputs could not be written (nothing partial is left behind).</summary>
    public const int OutputFailure = 5;
    /// <summary>Some operating points failed (too little of their window left after gaps); every other point was written.</summary>
    public const int SomePointsFailed = 6;
    /// <summary>A bug in bcprep; please report it with the command line.</summary>
    public const int InternalError = 70;
    /// <summary>The run needed more memory than the machine or its limit allowed (nothing partial is left behind).</summary>
    public const int NotEnoughMemory = 71;

    public static int For(FailureKind kind) => kind switch
    {
        FailureKind.Configuration => UsageOrRigFile,
        FailureKind.InputData => BadInputData,
        FailureKind.NoSteadyPoint => NoSteadyPoint,
        FailureKind.Output => OutputFailure,
        _ => InternalError,
    };
}
