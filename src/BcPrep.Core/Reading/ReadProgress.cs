using System.Globalization;

namespace BcPrep.Reading;

/// <summary>
/// How far the reading has got, for a progress display: the pass over the day (a day whose operating points are
/// detected is read twice) and the bytes of logs read in this pass. Updated by the reading thread, read by a
/// display thread; it changes nothing in the results.
/// </summary>
public sealed class ReadProgress(long totalBytes)
{
    private long _passBytes;
    private int _pass;

    public long TotalBytes { get; } = totalBytes;

    public int Pass => Volatile.Read(ref _pass);

    public long PassBytes => Interlocked.Read(ref _passBytes);

    public void StartPass()
    {
        Interlocked.Exchange(ref _passBytes, 0);
        Interlocked.Increment(ref _pass);
    }

    public void Advance(long bytes) => Interlocked.Add(ref _passBytes, bytes);

    /// <summary>"pass 1, 42 %"; a compressed log reads more bytes than its file holds, so the share is capped.</summary>
    public string Describe()
    {
        var share = TotalBytes > 0 ? Math.Min(99.0, 100.0 * PassBytes / TotalBytes) : 0.0;
        return string.Create(CultureInfo.InvariantCulture, $"pass {Math.Max(Pass, 1)}, {share:F0} %");
    }
}
