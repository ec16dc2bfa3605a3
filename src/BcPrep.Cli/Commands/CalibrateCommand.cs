using System.CommandLine;
using System.Globalization;
using System.Text;
using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep calibrate RIG LOG…</c>: the engineering-unit (SI) time series as CSV on standard output.</summary>
public static class CalibrateCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var logs = RigArguments.Logs();
        var conditioned = new Option<bool>("--conditioned")
        {
            Description = "Condition each channel first, as set in the rig's [conditioning] table: bridge short gaps, replace spikes (Hampel), " +
                          "mains notch and low-pass (zero phase); streamed in overlapping chunks, so memory does not grow with the day",
        };
        var command = new Command("calibrate", "Write every channel's calibrated SI time series as CSV to standard output (tares applied).\n" +
                                               "Example: bcprep calibrate sample-logs/marten-rig.toml sample-logs/*.csv | head")
        {
            rig, logs, conditioned,
        };
        command.SetAction(parse =>
        {
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var writer = new CsvSeriesWriter(context.Out, description);
            var diagnostics = common.DiagnosticsFor(parse, context);
            var conditioner = parse.GetValue(conditioned) ? new ConditionedBlockSink(description, writer) : null;
            CalibratedSeries.Stream(description, inputs.Inputs, (plan, _) =>
            {
                writer.Start(plan.DayStartS);
                diagnostics.Detail($"{plan.Loggers.Count} logger(s), day starts at {plan.DayStartS.ToString("R", CultureInfo.InvariantCulture)} s");
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
    /// Writes blocks as CSV rows. With one logger the columns are fixed; with several, each logger's rows carry only
    /// its own channels (the other cells empty), logger after logger, each at its native rate.
    /// </summary>
    private sealed class CsvSeriesWriter(TextWriter output, RigDescription rig) : IBlockSink
    {
        private readonly StringBuilder _text = new(1 << 16);
        private readonly List<string> _columns = rig.Channels.Select(c => c.Id).ToList();
        private double _originS;

        public void Start(double dayStartS)
        {
            _originS = dayStartS;
            var header = new StringBuilder("time [s]");
            foreach (var channel in rig.Channels)
            {
                header.Append(',').Append(channel.Id).Append(" [").Append(UnitText.SiSymbol(channel.Dimension)).Append(']');
            }
            output.Write(header.Append('\n'));
        }

        public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
        {
            var slot = _columns.Select(id => channels.ToList().IndexOf(id)).ToArray();
            for (var i = 0; i < count; i++)
            {
                _text.Append((timeS[i] - _originS).ToString("R", CultureInfo.InvariantCulture));
                foreach (var s in slot)
                {
                    _text.Append(',');
                    if (s >= 0 && double.IsFinite(valuesSi[s][i]))
                    {
                        _text.Append(valuesSi[s][i].ToString("R", CultureInfo.InvariantCulture));
                    }
                }
                _text.Append('\n');
            }
            output.Write(_text);
            _text.Clear();
        }
    }
}
