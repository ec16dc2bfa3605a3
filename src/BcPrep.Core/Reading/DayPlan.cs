using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Reading;

/// <summary>
/// The logs of one test day sorted into loggers (files sharing the same channel columns) and, within a logger,
/// into time order. A file's order comes from its first timestamp, so files may be given in any order.
/// </summary>
public sealed record DayPlan(IReadOnlyList<LoggerFiles> Loggers, DayStart Start)
{

    /// <summary>Groups and orders the inputs; fails naming the channel or file when a column is missing or doubled.</summary>
    public static DayPlan Create(RigDescription rig, IReadOnlyList<LogInput> inputs)
    {
        if (inputs.Count == 0)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(command line)"), "no log file given");
        }
        var headers = inputs.Select(i => (Input: i, Header: LogFileReader.ReadHeader(i, rig.Log))).ToList();
        var problems = new List<Problem>();
        var groups = new Dictionary<string, (List<ChannelSpec> Channels, List<LogInput> Files)>(StringComparer.Ordinal);
        foreach (var (input, header) in headers)
        {
            var present = rig.Channels.Where(c => header.Contains(c.Column)).ToList();
            if (present.Count == 0)
            {
                problems.Add(new Problem(new SourceLocation(input.DisplayName, 1), $"none of the rig file's channel columns is in this file's header"));
                continue;
            }
            var signature = string.Join("\u001f", present.Select(c => c.Id));
            if (!groups.TryGetValue(signature, out var group))
            {
                group = (present, []);
                groups[signature] = group;
            }
            group.Files.Add(input);
        }
        foreach (var channel in rig.Channels)
        {
            var holders = groups.Values.Where(g => g.Channels.Contains(channel)).ToList();
            if (holders.Count == 0)
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.column" }, $"column '{channel.Column}' is in none of the logs ({string.Join(", ", inputs.Select(i => i.DisplayName))})"));
            }
            else if (holders.Count > 1)
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.column" }, $"column '{channel.Column}' is logged by two loggers with different columns; a channel must come from one logger"));
            }
        }
        if (problems.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.InputData, problems);
        }
        var firsts = inputs.ToDictionary(i => i, i => FirstRow(i, rig.Log));
        var starts = firsts.ToDictionary(f => f.Key, f => f.Value.TimeS);
        var dayStart = firsts.MinBy(f => f.Value.TimeS);
        foreach (var (input, first) in firsts)
        {
            // The same bound as within one file (LogFileReader.MaxDaySpanS): a file whose clock is years off would
            // otherwise stretch the day's block grid across those years.
            if (first.TimeS - dayStart.Value.TimeS > LogFileReader.MaxDaySpanS)
            {
                throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(input.DisplayName, (int)Math.Min(first.Line, int.MaxValue), null, rig.Log.TimeColumn),
                    $"the file's first row lies {LogFileReader.Hours(first.TimeS - dayStart.Value.TimeS)} h after the first row of {dayStart.Key.DisplayName}; the logs of one day may start at most {LogFileReader.Hours(LogFileReader.MaxDaySpanS)} h apart (a logger clock glitch, or a log of another day?)");
            }
        }
        var loggers = groups.Values
            .Select(g => new LoggerFiles(g.Channels, g.Files.OrderBy(f => starts[f]).ToList()))
            .ToList();
        return new DayPlan(loggers, new DayStart(new LoggerSeconds(starts.Values.Min())));
    }

    private static (double TimeS, long Line) FirstRow(LogInput input, LogFormat format)
    {
        using var reader = new LogFileReader(input, format, []);
        var block = new LogBlock(0, 1);
        if (!reader.ReadBlock(block))
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(input.DisplayName, 2), "the file has a header but no data rows");
        }
        return (block.TimeS[0], block.LineNumbers[0]);
    }
}

/// <summary>The files of one logger in time order, and the rig channels it records.</summary>
public sealed record LoggerFiles(IReadOnlyList<ChannelSpec> Channels, IReadOnlyList<LogInput> Files);
