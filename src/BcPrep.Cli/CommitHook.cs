using System.Diagnostics;
using System.Globalization;

namespace BcPrep.Cli;

/// <summary>
/// Test hooks into the steps of the output commit (<see cref="Writing.ResultFolder"/>), set by environment variables
/// so that tests can run the real binary: <c>BCPREP_TEST_KILL_AT_COMMIT_STEP=N</c> kills the process outright (as
/// kill -9 does) at step N, and <c>BCPREP_TEST_WAIT_AT_COMMIT_STEP=N</c> announces step N on standard error and waits
/// there until standard input closes. Unset, the commit runs without any hook.
/// </summary>
public static class CommitHook
{
    public const string KillVariable = "BCPREP_TEST_KILL_AT_COMMIT_STEP";
    public const string WaitVariable = "BCPREP_TEST_WAIT_AT_COMMIT_STEP";

    public static Action<string>? FromEnvironment(CliContext context)
    {
        var kill = Step(KillVariable);
        var wait = Step(WaitVariable);
        if (kill is null && wait is null)
        {
            return null;
        }
        var count = 0;
        return name =>
        {
            count++;
            if (count == wait)
            {
                context.Error.WriteLine($"commit step {count} ({name}): waiting until standard input closes");
                context.Error.Flush();
                using var input = context.OpenStandardInput();
                input.CopyTo(Stream.Null);
            }
            if (count == kill)
            {
                using var self = Process.GetCurrentProcess();
                self.Kill();
            }
        };
    }

    private static int? Step(string variable) =>
        int.TryParse(Environment.GetEnvironmentVariable(variable), NumberStyles.None, CultureInfo.InvariantCulture, out var n) && n > 0 ? n : null;
}
