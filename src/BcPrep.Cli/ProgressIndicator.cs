using System.Globalization;
using BcPrep.Reading;

namespace BcPrep.Cli;

/// <summary>
/// A one-line progress indicator on standard error for a person waiting at a terminal: the task, the amount of
/// log data and the elapsed time, redrawn in place and erased when the work ends. It appears only when standard
/// error is a terminal, the verbosity is not quiet, and the work is long: after <see cref="LongWorkDelay"/>, or at
/// once for more than <see cref="LargeInputBytes"/> of logs. In pipes, files and tests it writes nothing at all.
/// With a <see cref="ReadProgress"/> it also shows the pass over the day and the share of the logs read in it
/// (a day whose operating points are detected is read twice, so the share restarts once).
/// </summary>
public sealed class ProgressIndicator : IDisposable
{
    /// <summary>Work shorter than this is not worth a progress line (common practice: about 2 s).</summary>
    public static readonly TimeSpan LongWorkDelay = TimeSpan.FromSeconds(2);

    /// <summary>Logs larger than this will take long enough to show the line from the start.</summary>
    public const long LargeInputBytes = 50L * 1000 * 1000;

    private static readonly TimeSpan RedrawPeriod = TimeSpan.FromMilliseconds(250);

    private readonly TextWriter? _error;
    private readonly string _label;
    private readonly TimeSpan _delay;
    private readonly Func<string>? _detail;
    private readonly long _startTicks = Environment.TickCount64;
    private readonly Timer? _timer;
    private readonly Lock _gate = new();
    private int _drawnLength;
    private bool _disposed;

    internal ProgressIndicator(CliContext context, Verbosity verbosity, string label, long inputBytes, TimeSpan delay, TimeSpan period, Func<string>? detail = null)
    {
        _label = label;
        _detail = detail;
        _delay = inputBytes > LargeInputBytes ? TimeSpan.Zero : delay;
        if (IsWanted(context.ErrorIsTerminal, verbosity))
        {
            _error = context.Error;
            if (_delay == TimeSpan.Zero)
            {
                // Work known to be long shows its line at once, not when a busy thread pool gets to the timer.
                Draw();
            }
            _timer = new Timer(_ => Draw(), null, _delay == TimeSpan.Zero ? period : _delay, period);
        }
    }

    /// <summary>Whether a progress line may be shown at all: only to a person at a terminal who did not ask for quiet.</summary>
    public static bool IsWanted(bool errorIsTerminal, Verbosity verbosity) => errorIsTerminal && verbosity != Verbosity.Quiet;

    /// <summary>Starts the indicator for work on <paramref name="inputBytes"/> of logs; dispose it when the work ends.</summary>
    public static ProgressIndicator Start(CliContext context, Verbosity verbosity, string task, long inputBytes, ReadProgress? progress = null) =>
        new(context, verbosity, string.Create(CultureInfo.InvariantCulture, $"{task} ({inputBytes / 1e6:F1} MB of logs)"), inputBytes, LongWorkDelay, RedrawPeriod,
            progress is null ? null : progress.Describe);

    public void Dispose()
    {
        lock (_gate)
        {
            if (_disposed)
            {
                return;
            }
            _disposed = true;
            _timer?.Dispose();
            if (_error is not null && _drawnLength > 0)
            {
                _error.Write("\r" + new string(' ', _drawnLength) + "\r");
                _error.Flush();
            }
        }
    }

    private void Draw()
    {
        lock (_gate)
        {
            if (_disposed || _error is null)
            {
                return;
            }
            var elapsedS = (Environment.TickCount64 - _startTicks) / 1000;
            var line = _detail is null
                ? string.Create(CultureInfo.InvariantCulture, $"{_label}: {elapsedS} s")
                : string.Create(CultureInfo.InvariantCulture, $"{_label}: {_detail()}, {elapsedS} s");
            _error.Write("\r" + line.PadRight(_drawnLength));
            _error.Flush();
            _drawnLength = Math.Max(_drawnLength, line.Length);
        }
    }
}
