using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public class WindowStatsBookOutOfMemoryTests
{
    [Fact]
    public void A_window_that_ran_out_of_memory_reports_that_and_is_not_evaluated_again()
    {
        // A failed window is normally evaluated again under its point's id, for a message that names the point. After
        // an out-of-memory the retry fails on its own (its samples may have been let go) and hid the cause.
        var book = new WindowStatsBook();
        var handedIn = new TimeWindow("", 10.0, 20.0);
        var evaluations = 0;
        book.Add(handedIn, "t_w1", _ =>
        {
            evaluations++;
            if (evaluations == 1)
            {
                throw new OutOfMemoryException();
            }
            throw new InvalidOperationException("samples let go");
        });

        var named = new Dictionary<TimeWindow, TimeWindow> { [handedIn] = new TimeWindow("P1", 10.0, 20.0) };
        Assert.Throws<OutOfMemoryException>(() => book.DrainInto([], named: named));
        Assert.Equal(1, evaluations);
    }
}
