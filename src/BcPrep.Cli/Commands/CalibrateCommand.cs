using System.CommandLine;
using System.Globalization;
using BcPrep.Cli.Output;
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
        var json = TabularOutput.JsonOption();
        var command = new Command("calibrate", "Write every channel's calibrated SI time series as CSV (or JSON lines with --json) to standard output (tares applied).\n" +
                                               "Example: bcprep calibrate sample-logs/marten-rig.toml sample-logs/*.csv | head")
        {
            rig, logs, json,
        };
        command.SetAction(parse =>
        {
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            using var inputs = new LogArguments(parse.GetValue(logs)!, context);
            var writer = new SeriesWriter(TabularOutput.Create(context.Out, parse.GetValue(json)), description);
            var verbosity = common.DiagnosticsFor(parse, context).Verbosity;
            using var progress = ProgressIndicator.Start(context, verbosity, "calibrating", inputs.Inputs.Sum(i => File.Exists(i.Path) ? new FileInfo(i.Path).Length : 0));
            CalibratedSeries.Stream(description, inputs.Inputs, (plan, _) =>
            {
                writer.Start(plan.DayStartS);
                common.DiagnosticsFor(parse, context).Detail($"{plan.Loggers.Count} logger(s), day starts at {plan.DayStartS.ToString("R", CultureInfo.InvariantCulture)} s");
            }, writer);
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
        private double _originS;
        private bool _headerWritten;

        /// <summary>
        /// Remembers the day's start; the header waits for the first converted block, so that a day refused in
        /// its first block leaves standard output empty.
        /// </summary>
        public void Start(double dayStartS) => _originS = dayStartS;

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
                output.Number(timeS[i] - _originS);
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
