using System.CommandLine;
using System.Globalization;
using BcPrep.Lab;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep check RIG</c>: validate a rig file and report every problem at once.</summary>
public static class CheckCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var date = LabOptions.Date();
        var allowExpired = LabOptions.AllowExpired();
        var command = new Command("check", "Validate a rig file and report every problem with its line and key.\n" +
                                           "Example: bcprep check sample-logs/marten-rig.toml --date 2026-11-24") { rig, date, allowExpired };
        command.SetAction(parse =>
        {
            var diagnostics = common.DiagnosticsFor(parse, context);
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            var allowed = parse.GetValue(allowExpired) ?? [];
            if (parse.GetValue(date) is { } dateText)
            {
                // A named test date: an expired sensor fails exactly as it would in process.
                var report = CalibrationCheck.Evaluate(description, TestDates.On(LabOptions.ParseDate(dateText)), allowed);
                foreach (var warning in report.Warnings)
                {
                    diagnostics.Warning(warning);
                }
            }
            else
            {
                // No test day named: check against today (the front end may read the clock; Core never does), and
                // only warn, because the file may describe a day already done.
                var today = DateOnly.FromDateTime(DateTime.Now);
                var (report, expired) = CalibrationCheck.Review(description, TestDates.On(today), allowed);
                foreach (var problem in expired)
                {
                    diagnostics.Warning($"{problem} (checked against today's date; give --date to check a test day)");
                }
                foreach (var warning in report.Warnings)
                {
                    diagnostics.Warning(warning);
                }
            }
            diagnostics.Info(string.Create(CultureInfo.InvariantCulture,
                $"{description.SourceFile}: ok ({description.Channels.Count} channels, {description.Points.Count} pinned operating points)"));
            foreach (var line in Pipeline.DetectionSettingsText.Lines(description))
            {
                diagnostics.Info(line);
            }
            return ExitCodes.Success;
        });
        return command;
    }
}
