using System.Runtime.InteropServices;

namespace BcPrep;

/// <summary>
/// Lowers the scheduling priority of the calling thread alone (its Linux nice value), for work that may wait while
/// the read runs: on two cores the log's reader is the one thread a run cannot make up for later, and a thread of
/// work that competes with it at the same priority slows the read, while the same work started later fills the moments
/// when the reader alone has work (per-thread profile of the 1 h 1 kHz day, issue 19). Linux gives each thread its own
/// nice value and lets any thread raise its own; elsewhere, or when the call is refused, nothing changes.
/// </summary>
public static class BackgroundPriority
{
    /// <summary>Nice value of work that must not hold the read back at all (the logs' hash): the lowest priority.</summary>
    public const int Idle = 19;

    /// <summary>
    /// Lowers the calling thread's priority to <paramref name="niceness"/> (0 normal … 19 lowest). Only a thread of our
    /// own for the whole of its life may call it: a pool thread would keep the priority for other work. A lower
    /// priority cannot be raised again without privileges, so whoever waits for such work must be able to do it itself.
    /// </summary>
    public static void LowerCurrentThread(int niceness)
    {
        if (!OperatingSystem.IsLinux())
        {
            return;
        }
        try
        {
            // PRIO_PROCESS with who = 0 is the calling thread on Linux (its threads are tasks with their own nice value).
            _ = setpriority(PriorityProcess, 0, Math.Clamp(niceness, 0, 19));
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            // Not there: the thread keeps its priority.
        }
    }

    private const int PriorityProcess = 0;

    [DllImport("libc", SetLastError = true)]
    private static extern int setpriority(int which, uint who, int priority);
}
