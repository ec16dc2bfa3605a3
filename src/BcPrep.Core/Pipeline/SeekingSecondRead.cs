using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// The window source of last resort: it takes every window, and <see cref="Complete"/> reads again only the blocks
/// that cover them, seeking by the first read's <see cref="ScanIndex"/> (gzip and UTF-16 logs are read again in full).
/// </summary>
internal sealed class SeekingSecondRead(
    RigDescription rig, DayPlan plan, IReadOnlyDictionary<string, BlockConverter> converters, ScanIndex index, ReadProgress? progress,
    Action<TimeWindow, string, double[], double[]> onWindow) : IWindowSource
{
    private readonly List<TimeWindow> _windows = [];

    /// <summary>Windows taken so far.</summary>
    public int Count => _windows.Count;

    public bool TryGather(TimeWindow window)
    {
        _windows.Add(window);
        return true;
    }

    /// <summary>Reads the blocks covering the windows taken, handing their samples over; nothing when none was taken.</summary>
    public void Complete()
    {
        if (_windows.Count == 0)
        {
            return;
        }
        var collector = new WindowCollector(_windows, onWindow);
        DayScan.Run(rig, plan, converters, [collector], progress: progress, index: index, onlyWindows: _windows);
    }
}
