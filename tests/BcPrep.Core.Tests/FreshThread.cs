namespace BcPrep.Tests;

/// <summary>
/// Runs work on a thread of its own: a new thread starts with no <see cref="ThreadScratch"/> arrays, so a test can see
/// which slots a computation rents and sizes, whatever ran before it on the test runner's threads.
/// </summary>
internal static class FreshThread
{
    public static T Run<T>(Func<T> work)
    {
        T result = default!;
        Exception? failure = null;
        var thread = new Thread(() =>
        {
            try
            {
                result = work();
            }
            catch (Exception e)
            {
                failure = e;
            }
        });
        thread.Start();
        thread.Join();
        return failure is null ? result : throw new InvalidOperationException("The work failed on its thread.", failure);
    }
}
