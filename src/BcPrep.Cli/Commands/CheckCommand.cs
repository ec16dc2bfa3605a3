using System.CommandLine;
using System.Globalization;

namespace BcPrep.Cli.Commands;

/// <summary><c>bcprep check RIG</c>: validate a rig file and report every problem at once.</summary>
public static class CheckCommand
{
    public static Command Create(CommonOptions common, CliContext context)
    {
        var rig = RigArguments.Rig();
        var command = new Command("check", "Validate a rig file and report every problem with its line and key.\n" +
                                           "Example: bcprep check sample-logs/marten-rig.toml") { rig };
        command.SetAction(parse =>
        {
            var diagnostics = common.DiagnosticsFor(parse, context);
            var description = RigArguments.LoadRig(parse.GetValue(rig)!);
            diagnostics.Info(string.Create(CultureInfo.InvariantCulture,
                $"{description.SourceFile}: ok ({description.Channels.Count} channels, {description.Points.Count} pinned operating points)"));
            return ExitCodes.Success;
        });
        return command;
    }
}
