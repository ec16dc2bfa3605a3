namespace BcPrep.Tests;

public class ThreadScratchTests
{
    // Common practice (memory only, no value depends on it): short arrays at the length asked for, long ones rounded up
    // to an eighth of their power of two, so that the 8 h 1 kHz day's windows, which grow by 1000 samples from one to
    // the next, reuse one array per slot instead of leaving a 10 MB one behind each time.
    [Theory]
    [InlineData(1, 1024)]
    [InlineData(5000, 5000)]
    [InlineData(ThreadScratch.ExactUpTo, ThreadScratch.ExactUpTo)]
    [InlineData(ThreadScratch.ExactUpTo + 1, 73_728)]
    [InlineData(1_214_001, 1_310_720)]
    [InlineData(1_221_001, 1_310_720)]
    [InlineData(1 << 20, 1 << 20)]
    [InlineData((1 << 20) + 1, 1_179_648)]
    [InlineData(1 << 21, 1 << 21)]
    public void Long_arrays_get_at_most_an_eighth_more(int length, int capacity)
    {
        Assert.Equal(capacity, ThreadScratch.CapacityFor(length));
        Assert.True(capacity <= Math.Max(1024, length + (length / 8)));
    }

    [Fact]
    public void A_slightly_longer_window_reuses_the_slot_and_a_much_longer_one_gets_a_new_array()
    {
        // Slot 0 on a fresh thread, so that no other test's arrays are seen.
        double[]? first = null, second = null, third = null;
        var thread = new Thread(() =>
        {
            first = ThreadScratch.Rent(ScratchSlots.TimeSteps, 1_214_001);
            second = ThreadScratch.Rent(ScratchSlots.TimeSteps, 1_221_001);
            third = ThreadScratch.Rent(ScratchSlots.TimeSteps, 1_400_000);
        });
        thread.Start();
        thread.Join();
        Assert.Same(first, second);
        Assert.NotSame(second, third);
        Assert.True(third!.Length >= 1_400_000);
    }

    [Fact]
    public void After_release_every_thread_rents_new_arrays_and_keeps_the_ones_it_holds()
    {
        double[]? held = null, again = null;
        using var rented = new ManualResetEventSlim();
        using var released = new ManualResetEventSlim();
        var thread = new Thread(() =>
        {
            held = ThreadScratch.Rent(ScratchSlots.TimeSteps, 5000);
            held[4999] = 42.0;
            rented.Set();
            released.Wait();
            again = ThreadScratch.Rent(ScratchSlots.TimeSteps, 5000);
        });
        thread.Start();
        rented.Wait();
        ThreadScratch.ReleaseAll();
        released.Set();
        thread.Join();
        Assert.NotSame(held, again);
        Assert.Equal(42.0, held![4999]);
    }
}
