namespace BcPrep.Tests;

/// <summary>
/// <see cref="BackgroundPriority"/> lowers the calling thread alone: its nice value, field 19 of
/// /proc/thread-self/stat (proc(5), Linux man-pages), and no other thread's.
/// </summary>
public class BackgroundPriorityTests
{
    [Fact]
    public void Lowers_the_calling_thread_and_leaves_the_others()
    {
        if (!OperatingSystem.IsLinux())
        {
            return;
        }
        var before = Nice();
        var lowered = int.MinValue;
        var thread = new Thread(() =>
        {
            BackgroundPriority.LowerCurrentThread(BackgroundPriority.Idle);
            lowered = Nice();
        });
        thread.Start();
        thread.Join();

        Assert.Equal(19, lowered);
        Assert.Equal(before, Nice());
    }

    /// <summary>The calling thread's nice value: the stat line after the command name in parentheses, 17th field from there.</summary>
    private static int Nice()
    {
        var stat = File.ReadAllText("/proc/thread-self/stat");
        var fields = stat[(stat.LastIndexOf(')') + 2)..].Split(' ');
        // Fields from the state (3rd) on: nice is the 19th, so index 19 - 3.
        return int.Parse(fields[19 - 3], System.Globalization.CultureInfo.InvariantCulture);
    }
}
