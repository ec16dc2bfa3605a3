namespace BcPrep.Cli;

/// <summary>
/// Running out of memory is the machine's limit, not a bug: a day whose longest window holds millions of samples per
/// channel needs a few hundred MB (README "Large days"), and a container or a heap limit may allow less. It gets its
/// own words and exit code instead of the runtime's message under "internal error".
/// </summary>
internal static class OutOfMemory
{
    public const string Message =
        "error: not enough memory: the run needed more than this machine or its memory limit allows, and stopped without writing its outputs. " +
        "Peak memory grows with the longest operating-point window (README, \"Large days\"); free memory, raise the limit, or split the day's logs.";

    /// <summary>True when the failure is, or was caused by, an out-of-memory condition (also inside parallel work).</summary>
    public static bool Caused(Exception e) => e switch
    {
        OutOfMemoryException => true,
        AggregateException a => a.InnerExceptions.Any(Caused),
        _ => e.InnerException is { } inner && Caused(inner),
    };
}
