using System.Collections.Concurrent;
using System.Globalization;
using BcPrep.Calibration;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>
/// One streaming pass over a test day: each logger's files in time order, each block calibrated channel by channel
/// and handed to the sinks. Holds one block per logger in memory, whatever the file size.
/// </summary>
public static class DayScan
{
    public const int BlockRows = 8192;

    public static void Run(
        RigDescription rig,
        DayPlan plan,
        IReadOnlyDictionary<string, BlockConverter> converters,
        IReadOnlyList<IChannelSink> sinks,
        IBlockSink? blockSink = null,
        ReadProgress? progress = null,
        ScanIndex? index = null,
        IReadOnlyList<TimeWindow>? onlyWindows = null,
        Action<LogInput, long, long>? onFileRead = null,
        LoggerSeconds? readUntil = null)
    {
        progress?.StartPass();
        var reading = new ReadingPlan(index, onlyWindows?.OrderBy(w => w.StartS).ToList(), onFileRead, readUntil);
        foreach (var logger in plan.Loggers)
        {
            ScanLogger(rig, logger, converters, sinks, blockSink, progress, reading);
        }
    }

    /// <summary>
    /// How the files are read: in full, recording the block index when one is given; or, with windows and an index
    /// from an earlier pass, only the blocks that cover the windows; or from the start up to a time.
    /// </summary>
    /// <param name="Index">Block index to record (full read) or to seek by (windows only).</param>
    /// <param name="Windows">The windows to read, or null to read everything.</param>
    /// <param name="OnFileRead">Told, after a file was read in full (to its <see cref="LogInput.LengthLimit"/>), the byte
    /// offset reached and the last line read, so that a later scan can resume there (<see cref="LogInput.ResumeAt"/>).</param>
    /// <param name="Until">When set, the reading thread itself stops after the first block that reaches this time (its
    /// last row at or after it), so every row up to the time is delivered and the rows read, and therefore the
    /// refusals met, do not depend on how far the reader ran ahead of the consumer.</param>
    private sealed record ReadingPlan(ScanIndex? Index, IReadOnlyList<TimeWindow>? Windows, Action<LogInput, long, long>? OnFileRead, LoggerSeconds? Until);

    private static void ScanLogger(RigDescription rig, LoggerFiles logger, IReadOnlyDictionary<string, BlockConverter> converters, IReadOnlyList<IChannelSink> sinks, IBlockSink? blockSink, ReadProgress? progress, ReadingPlan reading)
    {
        var channels = OrderByDependency(logger.Channels, rig);
        var columns = logger.Channels.Select(c => c.Column).ToList();
        var si = channels.ToDictionary(c => c.Id, _ => new double[BlockRows], StringComparer.Ordinal);
        var ids = logger.Channels.Select(c => c.Id).ToList();
        var blockArrays = ids.Select(id => si[id]).ToList();
        var previousEnd = double.NegativeInfinity;
        string? previousFile = null;
        foreach (var (file, block, first) in ReadAhead(rig, logger, columns, progress, reading))
        {
            if (first)
            {
                if (block.TimeS[0] <= previousEnd)
                {
                    throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(file.DisplayName, (int)block.LineNumbers[0], null, rig.Log.TimeColumn),
                        $"this file starts at {Fmt(block.TimeS[0])} s, before the end of {previousFile} ({Fmt(previousEnd)} s): the files overlap in time");
                }
            }
            ConvertBlock(file, block, logger, channels, converters, si);
            blockSink?.AcceptBlock(ids, block.TimeS, blockArrays, block.Count);
            var times = block.TimeS.AsSpan(0, block.Count);
            foreach (var channel in channels)
            {
                var values = si[channel.Id].AsSpan(0, block.Count);
                foreach (var sink in sinks)
                {
                    sink.Accept(channel.Id, times, values);
                }
            }
            previousEnd = block.TimeS[block.Count - 1];
            previousFile = file.DisplayName;
        }
        foreach (var channel in channels)
        {
            foreach (var sink in sinks)
            {
                sink.Complete(channel.Id);
            }
        }
    }

    /// <summary>
    /// Parses on a second thread while the caller converts, so both cores work on a large day. A few blocks
    /// circulate between the two threads, so memory stays bounded; a failure on either side stops both and the
    /// reader's own exception (file, line, column) reaches the caller unchanged.
    /// </summary>
    private static IEnumerable<(LogInput File, LogBlock Block, bool FirstOfFile)> ReadAhead(RigDescription rig, LoggerFiles logger, IReadOnlyList<string> columns, ReadProgress? progress, ReadingPlan reading)
    {
        const int InFlight = 3;
        using var free = new BlockingCollection<LogBlock>();
        using var filled = new BlockingCollection<(LogInput, LogBlock, bool)>(InFlight);
        using var stop = new CancellationTokenSource();
        for (var i = 0; i < InFlight + 1; i++)
        {
            free.Add(new LogBlock(columns.Count, BlockRows));
        }
        // Its own thread, not one of the pool's: the read lasts the whole day, and holding a pool thread that long (with
        // the input hashing on another, on two cores) left the pool none for short parallel work such as the
        // conditioning's, which then waited about half a second for the pool to add a thread.
        var producer = Task.Factory.StartNew(() =>
        {
            try
            {
                foreach (var file in logger.Files)
                {
                    using var reader = new LogFileReader(file, rig.Log, columns);
                    var blocks = reading.Windows is null ? null : reading.Index?.Blocks(file);
                    if (blocks is not null && reader.CanSeek)
                    {
                        ReadWindowsOnly(reader, blocks, reading.Windows!, file, free, filled, progress, reading.Index!, stop.Token);
                        continue;
                    }
                    if (file.ResumeAt is { } resume)
                    {
                        reader.SeekTo(resume.Offset, resume.Line);
                    }
                    var first = true;
                    var reported = reader.BytesRead;
                    while (true)
                    {
                        var block = free.Take(stop.Token);
                        if (!reader.ReadBlock(block))
                        {
                            free.Add(block);
                            break;
                        }
                        progress?.Advance(reader.BytesRead - reported);
                        reported = reader.BytesRead;
                        reading.Index?.Record(file, block, reader.CanSeek);
                        var reached = reading.Until is { } until && block.TimeS[block.Count - 1] >= until.Value;
                        filled.Add((file, block, first), stop.Token);
                        first = false;
                        if (reached)
                        {
                            return;
                        }
                    }
                    reading.OnFileRead?.Invoke(file, reader.BytesRead, reader.LastLine);
                }
            }
            finally
            {
                filled.CompleteAdding();
            }
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        try
        {
            foreach (var item in filled.GetConsumingEnumerable())
            {
                yield return item;
                free.Add(item.Item2);
            }
        }
        finally
        {
            stop.Cancel();
            try
            {
                producer.GetAwaiter().GetResult();
            }
            catch (OperationCanceledException)
            {
                // The consumer stopped first; its own exception (if any) is the one that matters.
            }
        }
    }

    /// <summary>
    /// Reads only the blocks that cover the windows: for each window, seek to the last block starting at or before
    /// it (unless reading already runs past that point) and read on until a block starts after the window's end.
    /// Blocks are never delivered twice, so sample times keep increasing for the sinks.
    /// </summary>
    private static void ReadWindowsOnly(LogFileReader reader, IReadOnlyList<(double TimeS, long Offset, long Line)> blocks, IReadOnlyList<TimeWindow> windows,
        LogInput file, BlockingCollection<LogBlock> free, BlockingCollection<(LogInput, LogBlock, bool)> filled, ReadProgress? progress, ScanIndex index, CancellationToken stop)
    {
        var next = 0; // index of the next block not yet delivered
        foreach (var window in windows)
        {
            var target = 0;
            while (target + 1 < blocks.Count && blocks[target + 1].TimeS <= window.StartS)
            {
                target++;
            }
            if (blocks.Count == 0 || blocks[0].TimeS > window.EndS)
            {
                continue; // the window ends before this file starts
            }
            if (target > next)
            {
                // Blocks are re-read with the first pass's boundaries (same block size), so block k starts at k's offset.
                reader.SeekTo(blocks[target].Offset, blocks[target].Line);
                index.CountSeek();
                next = target;
            }
            while (next < blocks.Count && blocks[next].TimeS <= window.EndS)
            {
                var block = free.Take(stop);
                var start = reader.BytesRead;
                if (!reader.ReadBlock(block))
                {
                    free.Add(block);
                    return;
                }
                progress?.Advance(reader.BytesRead - start);
                filled.Add((file, block, false), stop);
                next++;
                // A block read may span several shorter blocks of the index (a log read piecewise as it grew): those
                // are delivered too, so the reader never seeks back to them.
                while (next < blocks.Count && blocks[next].Offset < reader.BytesRead)
                {
                    next++;
                }
            }
        }
    }

    private static void ConvertBlock(LogInput file, LogBlock block, LoggerFiles logger, IReadOnlyList<ChannelSpec> channels,
        IReadOnlyDictionary<string, BlockConverter> converters, Dictionary<string, double[]> si)
    {
        var referenceEmf = new Dictionary<(string, ThermocoupleType), double[]>();
        foreach (var channel in channels)
        {
            var raw = block.Columns[IndexOf(logger, channel)];
            var output = si[channel.Id];
            var convert = converters[channel.Id];
            var reference = ReferenceJunctionEmf(file, block, channel, si, referenceEmf);
            var fixedReference = channel.Sensor is ThermocoupleSensor { ColdJunctionK: { } k } tc
                ? Its90Thermocouple.EmfV(tc.Type, k)
                : 0.0;
            try
            {
                convert.Convert(raw.AsSpan(0, block.Count), reference is null ? default : reference.AsSpan(0, block.Count), fixedReference, output);
            }
            catch (BcPrepDataException e) when (e is not BcPrepFailure)
            {
                throw FailedSample(file, block, channel, convert, raw, reference, fixedReference);
            }
        }
    }

    /// <summary>The error for the first sample of a failed block that cannot be converted: file, line, column, time and value.</summary>
    private static BcPrepFailure FailedSample(LogInput file, LogBlock block, ChannelSpec channel, BlockConverter convert, double[] raw, double[]? reference, double fixedReference)
    {
        for (var i = 0; i < block.Count; i++)
        {
            try
            {
                if (!double.IsNaN(raw[i]))
                {
                    convert.PerSample(raw[i], reference is null ? fixedReference : reference[i]);
                }
            }
            catch (BcPrepDataException e) when (e is not BcPrepFailure)
            {
                return new BcPrepFailure(FailureKind.InputData, new SourceLocation(file.DisplayName, (int)block.LineNumbers[i], null, channel.Column),
                    $"channel '{channel.Id}' at t = {Fmt(block.TimeS[i])} s reads {Fmt(raw[i])} {channel.Sensor.RawUnit}: {e.Message}");
            }
        }
        throw new InvalidOperationException($"channel '{channel.Id}': the block failed but no sample fails alone");
    }

    /// <summary>
    /// E(T_cj) of each row for a thermocouple served by a cold-junction channel, computed once per block and per
    /// (junction, type) pair: the direct function (with type K's exponential term) is the costly part of a
    /// conversion, and several thermocouples usually share one junction.
    /// </summary>
    private static double[]? ReferenceJunctionEmf(LogInput file, LogBlock block, ChannelSpec channel, Dictionary<string, double[]> si,
        Dictionary<(string, ThermocoupleType), double[]> cache)
    {
        if (channel.Sensor is not ThermocoupleSensor { ColdJunctionChannel: { } junction } tc)
        {
            return null;
        }
        var type = tc.Type;
        if (cache.TryGetValue((junction, type), out var emf))
        {
            return emf;
        }
        var junctionK = si[junction];
        emf = new double[block.Count];
        for (var i = 0; i < block.Count; i++)
        {
            try
            {
                emf[i] = double.IsNaN(junctionK[i]) ? double.NaN : Its90Thermocouple.EmfV(type, junctionK[i]);
            }
            catch (BcPrepDataException e) when (e is not BcPrepFailure)
            {
                throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(file.DisplayName, (int)block.LineNumbers[i], null, channel.Column),
                    $"cold junction '{junction}' of channel '{channel.Id}' at t = {Fmt(block.TimeS[i])} s reads {Fmt(junctionK[i])} K: {e.Message}");
            }
        }
        cache[(junction, type)] = emf;
        return emf;
    }

    private static int IndexOf(LoggerFiles logger, ChannelSpec channel)
    {
        for (var i = 0; i < logger.Channels.Count; i++)
        {
            if (logger.Channels[i].Id == channel.Id)
            {
                return i;
            }
        }
        throw new InvalidOperationException("channel not in logger");
    }

    /// <summary>Cold-junction channels are converted before the thermocouples that need them.</summary>
    private static List<ChannelSpec> OrderByDependency(IReadOnlyList<ChannelSpec> channels, RigDescription rig)
    {
        var ids = channels.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        foreach (var c in channels)
        {
            if (c.Sensor is ThermocoupleSensor { ColdJunctionChannel: { } cj } && !ids.Contains(cj))
            {
                var where = rig.Channel(cj)?.Column ?? cj;
                throw new BcPrepFailure(FailureKind.Configuration, c.Location with { Key = $"channel '{c.Id}'.cold_junction" },
                    $"the cold-junction channel '{cj}' (column '{where}') must be logged by the same logger as '{c.Column}', row by row");
            }
        }
        return channels.OrderBy(c => c.Sensor is ThermocoupleSensor { ColdJunctionChannel: not null } ? 1 : 0).ToList();
    }

    private static string Fmt(double value) => value.ToString("G10", CultureInfo.InvariantCulture);
}
