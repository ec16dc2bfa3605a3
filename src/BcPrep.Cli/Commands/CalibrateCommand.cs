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
                          "mains notch and low-pass (zero phase); streamed in overlapping chunks, so memory does not grow with the day",
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
            var conditioner = parse.GetValue(conditioned) ? new ConditionedBlockSink(description, writer) : null;
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
            for (var i = 0; i < count; i++)
            {
                output.Number(_start.Since(new LoggerSeconds(timeS[i])).Value);
                foreach (var s in slot)
                {
                    if (s >= 0)
                    {
                        output.Number(valuesSi[s][i]);
                    }
                    else
                    {
                        output.Empty();
                    }
                }
                output.EndRow();
            }
            output.Flush();
        }
    }
}
