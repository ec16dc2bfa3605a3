using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// Streams a day's calibrated (SI) time series, logger by logger, with tares applied. A tare needs its interval's
/// mean before the first row can be corrected, so a day with tares is read first up to the end of its last tare
/// interval (only the loggers that log a tared channel), then in full. The tare is the one the point model
/// subtracts (<see cref="FaultPolicy.Evaluate(RigDescription, string, TimeWindow, double[], double[], DayStart)"/>'s de-spiked window mean), so both commands agree.
/// </summary>
/// <remarks>
/// A refusal met in the first read comes before any row is written; one further on follows the rows already
/// written. The first read stops after the block that reaches the last tare's end, decided by the reading thread, so
/// which refusals it meets does not depend on timing. Reading the whole day first (as before) cost about 1.2 s of the
/// 10 s of CPU of `calibrate --conditioned` on a 1 h 1 kHz day whose tares end at 9 min, and 1.5 s of its wall time.
/// Each tare window's statistics run on the pool from the moment its window is complete, and the second read starts
/// beside them (one core was idle while they ran on the reading thread); refusals are still taken in the order the
/// windows completed and before any met further on, so which one is reported does not depend on timing.
/// </remarks>
public static class CalibratedSeries
{
    public static void Stream(RigDescription rig, IReadOnlyList<LogInput> logs, Action<DayPlan, IReadOnlyDictionary<string, double>> onStart, IBlockSink sink)
    {
        var plan = DayPlan.Create(rig, logs);
        var converters = rig.Channels.ToDictionary(c => c.Id, BlockConverter.For, StringComparer.Ordinal);
        var tares = new PendingTares(TareMeans(rig, plan, converters), tares => onStart(plan, tares));
        try
        {
            // The second read starts while the tare windows' statistics are still running: it parses ahead and
            // converts, and its sink waits for the tares before the first row goes on (nothing is written before).
            DayScan.Run(rig, plan, converters, [], new TareApplyingSink(tares, sink));
            tares.Wait();
        }
        catch (Exception)
        {
            // A tare refusal came first in the order of the reads: it is the one reported, as when the tares were
            // complete before the second read began. Else the start is announced, as it was before that read.
            tares.FailedFirst()?.Throw();
            tares.Wait();
            throw;
        }
    }

    /// <summary>
    /// Reads up to the end of the last tare interval; each tare window's statistics start as soon as its window is
    /// complete, on the pool, and the result is taken in the order the windows completed (the first failure in that
    /// order is the one reported, as when each window was evaluated on the reading thread in turn).
    /// </summary>
    private static IReadOnlyList<(string Channel, Task<double> Mean)> TareMeans(RigDescription rig, DayPlan plan, IReadOnlyDictionary<string, BlockConverter> converters)
    {
        var result = new List<(string Channel, Task<double> Mean)>();
        var windows = rig.Channels.Where(c => c.Tare is not null)
            .Select(c => TimeWindow.Tare(c.Id, plan.Start.Resolve(c.Tare!.Start).Value, plan.Start.Resolve(c.Tare.End).Value))
            .ToList();
        if (windows.Count == 0)
        {
            return result;
        }
        var collector = new WindowCollector(windows, (w, channel, times, values) =>
        {
            if (w.Serves(channel))
            {
                result.Add((channel, Task.Run(() =>
                {
                    if (!values.Any(double.IsFinite))
                    {
                        throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(logs)", Key: channel), $"the tare interval of '{channel}' holds no samples");
                    }
                    // The tare `process` subtracts: the window statistics' mean (gaps bridged, spikes replaced).
                    return FaultPolicy.Evaluate(rig, channel, w, times, values, plan.Start).TypeA.Mean;
                })));
            }
        }, (w, channel) => w.Serves(channel)); // a tare window's own channel only: the other 16 of a wide day are not held
        var tared = plan with { Loggers = plan.Loggers.Where(l => l.Channels.Any(c => c.Tare is not null)).ToList() };
        try
        {
            DayScan.Run(rig, tared, converters, [collector], readUntil: new LoggerSeconds(windows.Max(w => w.EndS)));
        }
        catch (Exception)
        {
            // A window completed before the read failed, and its statistics failed: evaluated in turn, it came first.
            new PendingTares(result, _ => { }).FailedFirst()?.Throw();
            throw;
        }
        return result;
    }

    /// <summary>The tare means being computed, in the order their windows completed; resolved once, on first need.</summary>
    private sealed class PendingTares(IReadOnlyList<(string Channel, Task<double> Mean)> means, Action<IReadOnlyDictionary<string, double>> onResolved)
    {
        private Dictionary<string, double>? _tares;

        /// <summary>Waits for every mean; throws the first failure in order (its own exception, not an aggregate).</summary>
        public IReadOnlyDictionary<string, double> Wait()
        {
            if (_tares is null)
            {
                var tares = new Dictionary<string, double>(StringComparer.Ordinal);
                foreach (var (channel, mean) in means)
                {
                    tares[channel] = mean.GetAwaiter().GetResult();
                }
                _tares = tares;
                onResolved(tares);
            }
            return _tares;
        }

        /// <summary>Waits for every mean and gives the first failure in order, if any.</summary>
        public System.Runtime.ExceptionServices.ExceptionDispatchInfo? FailedFirst()
        {
            foreach (var (_, mean) in means)
            {
                try
                {
                    mean.GetAwaiter().GetResult();
                }
                catch (Exception e)
                {
                    return System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(e);
                }
            }
            return null;
        }
    }

    private sealed class TareApplyingSink(PendingTares pending, IBlockSink inner) : IBlockSink
    {
        public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
        {
            var tares = pending.Wait();
            for (var c = 0; c < channels.Count; c++)
            {
                if (tares.TryGetValue(channels[c], out var tare))
                {
                    var values = valuesSi[c];
                    for (var i = 0; i < count; i++)
                    {
                        values[i] -= tare;
                    }
                }
            }
            inner.AcceptBlock(channels, timeS, valuesSi, count);
        }
    }
}
