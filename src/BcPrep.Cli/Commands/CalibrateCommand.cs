using System.CommandLine;
using System.Globalization;
using BcPrep.Cli.Output;
using BcPrep.Pipeline;
using BcPrep.Rig;
using BcPrep.Values;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep calibrate RIG LOG…</c>: the engineering-unit (SI) time series as CSV on standard output.</summary>
public static class CalibrateCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var json = TabularOutput.JsonOption();
        var conditioned = new Option<bool>("--conditioned")
        {
            Description = "Condition each channel first, as set in the rig's [conditioning] table: bridge short gaps, replace spikes (Hampel), " +
                          "mains notch and low-pass (zero phase); streamed in chunks with the filters' states carried across, so memory does not grow with the day",
        };
        var command = new Command("calibrate", "Write every channel's calibrated SI time series as CSV (or JSON lines with --json) to standard output (tares applied).\n" +
                                               "Example: bcprep calibrate sample-logs/marten-rig.toml sample-logs/*.csv | head")
        {
            rig, logs, json, conditioned,
        };
        command.SetAction(parse =>
        {
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var writer = new SeriesWriter(TabularOutput.Create(context.Out, parse.GetValue(json)), description);
            var diagnostics = common.DiagnosticsFor(parse, context);
            using var progress = ProgressIndicator.Start(context, diagnostics.Verbosity, "calibrating", inputs.Inputs.Sum(i => File.Exists(i.Path) ? new FileInfo(i.Path).Length : 0));
            var conditioner = parse.GetValue(conditioned) ? new ConditionedBlockSink(description, writer, parallelChannels: true) : null;
            CalibratedSeries.Stream(description, inputs.Inputs, (plan, _) =>
            {
                writer.Start(plan.Start);
                diagnostics.Detail($"{plan.Loggers.Count} logger(s), day starts at {plan.Start.FirstSample.Value.ToString("R", CultureInfo.InvariantCulture)} s");
            }, conditioner ?? (IBlockSink)writer);
            if (conditioner is not null)
            {
                conditioner.Complete();
                foreach (var (channel, totals) in conditioner.Totals.OrderBy(t => t.Key, StringComparer.Ordinal))
                {
                    var notches = totals.NotchesHz.Count == 0 ? "no mains notch" : "notches at " + string.Join("/", totals.NotchesHz.Select(f => f.ToString(CultureInfo.InvariantCulture))) + " Hz";
                    diagnostics.Detail(string.Create(CultureInfo.InvariantCulture, $"conditioned '{channel}': {totals.Bridged} samples bridged, {totals.Spikes} spikes replaced, {notches}"));
                }
            }
            return ExitCodes.Success;
        });
        return command;
    }

    /// <summary>
    /// Writes blocks as rows (CSV or JSON lines). With one logger every row is full; with several, each logger's rows
    /// carry only its own channels (the other cells empty), logger after logger, each at its native rate.
    /// </summary>
    private sealed class SeriesWriter(TabularOutput output, RigDescription rig) : IBlockSink
    {
        private readonly List<string> _columns = rig.Channels.Select(c => c.Id).ToList();
        private DayStart _start;
        private bool _headerWritten;

        /// <summary>
        /// Remembers the day's start; the header waits for the first converted block, so that a day refused in
        /// its first block leaves standard output empty.
        /// </summary>
        public void Start(DayStart start) => _start = start;

        private void WriteHeader()
        {
            output.Header([.. rig.Channels.Select(c => $"{c.Id} [{UnitText.SiSymbol(c.Dimension)}]").Prepend("time [s]")]);
        }

        public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
        {
            if (!_headerWritten)
            {
                WriteHeader();
                _headerWritten = true;
            }
            var slot = _columns.Select(id => channels.ToList().IndexOf(id)).ToArray();
            // The columns as one array of arrays, read once per cell without the list's interface call (65 million
            // cells on a 1 kHz 17-column hour); a column with no channel in this block is null.
            var columns = slot.Select(s => s >= 0 ? valuesSi[s] : null).ToArray();
            if (output is CsvOutput csv && count >= 2 * RowsPerPart)
            {
                // Formatting the numbers costs more than parsing them: the block's rows are formatted in parts on
                // every core, each into its own buffer, and the parts are written in order. A round holds a few parts
                // per core, so the buffers stay a few megabytes however long the block is (a conditioned block is
                // about 100 000 rows; one part per 2048 rows of it held about 150 MB of text at once).
                var parts = (count + RowsPerPart - 1) / RowsPerPart;
                var perRound = Math.Min(parts, PartsPerCore * Environment.ProcessorCount);
                while (_parts.Count < perRound)
                {
                    _parts.Add(csv.Part());
                }
                for (var first = 0; first < parts; first += perRound)
                {
                    var round = Math.Min(perRound, parts - first);
                    Parallel.For(0, round, p => WriteRows(_parts[p], columns, timeS, (first + p) * RowsPerPart, Math.Min(count, (first + p + 1) * RowsPerPart)));
                    for (var p = 0; p < round; p++)
                    {
                        csv.Write(_parts[p]);
                    }
                }
            }
            else
            {
                WriteRows(output, columns, timeS, 0, count);
            }
            output.Flush();
        }

        private const int RowsPerPart = 2048;
        private const int PartsPerCore = 4;
        private readonly List<CsvOutput> _parts = [];

        private void WriteRows(TabularOutput rows, double[]?[] columns, double[] timeS, int from, int to)
        {
            if (rows is CsvOutput csv)
            {
                // A whole row at a time: a cell with no channel in this block is NaN, which is written empty.
                Span<double> cells = stackalloc double[columns.Length + 1];
                for (var i = from; i < to; i++)
                {
                    cells[0] = _start.Since(new LoggerSeconds(timeS[i])).Value;
                    for (var c = 0; c < columns.Length; c++)
                    {
                        cells[c + 1] = columns[c] is { } column ? column[i] : double.NaN;
                    }
                    csv.Row(cells);
                }
                return;
            }
            for (var i = from; i < to; i++)
            {
                rows.Number(_start.Since(new LoggerSeconds(timeS[i])).Value);
                foreach (var column in columns)
                {
                    if (column is not null)
                    {
                        rows.Number(column[i]);
                    }
                    else
                    {
                        rows.Empty();
                    }
                }
                rows.EndRow();
            }
        }
    }
}
