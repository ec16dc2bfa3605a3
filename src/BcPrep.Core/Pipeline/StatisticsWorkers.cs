using System.Collections.Concurrent;

namespace BcPrep.Pipeline;

/// <summary>
/// The threads that reduce window samples to statistics: one per core, started once and kept. Each statistics call
/// keeps megabyte-sized working arrays per thread (<see cref="ThreadScratch"/>: the FFT of a 1015 s window at 1 kHz
/// needs three arrays of 2²⁰ values). On the thread pool, a machine under load made the pool add threads while
/// long statistics ran, each new thread grew its own working arrays, and peak memory followed the load (BENCHMARKS.md,
/// issue 19). A fixed set of threads bounds that memory to one set of arrays per core.
/// </summary>
internal static class StatisticsWorkers
{
    /// <summary>How many statistics threads there are: one per core. (Set before <see cref="Queue"/>, which starts them.)</summary>
    public static int Threads { get; } = Math.Max(1, Environment.ProcessorCount);

    private static readonly BlockingCollection<Action> Queue = Start();

    /// <summary>Runs <paramref name="work"/> on a statistics thread; the task carries its result or its exception.</summary>
    public static Task<T> Run<T>(Func<T> work)
    {
        var done = new TaskCompletionSource<T>(TaskCreationOptions.RunContinuationsAsynchronously);
        Queue.Add(() =>
        {
            try
            {
                done.SetResult(work());
            }
            catch (Exception e)
            {
                done.SetException(e);
            }
        });
        return done.Task;
    }

    private static BlockingCollection<Action> Start()
    {
        var queue = new BlockingCollection<Action>();
        for (var i = 0; i < Threads; i++)
        {
            var thread = new Thread(() =>
            {
                foreach (var work in queue.GetConsumingEnumerable())
                {
                    work();
                }
            })
            {
                IsBackground = true,
                Name = "window statistics " + i.ToString(System.Globalization.CultureInfo.InvariantCulture),
            };
            thread.Start();
        }
        return queue;
    }
}
