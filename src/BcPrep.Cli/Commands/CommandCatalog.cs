using System.CommandLine;

namespace BcPrep.Cli.Commands;

/// <summary>All commands of bcprep, one file each.</summary>
public static class CommandCatalog
{
    public static IEnumerable<Command> Build(CommonOptions common, CliContext context) =>
    [
        CheckCommand.Create(common, context),
        ProcessCommand.Create(common, context),
        CalibrateCommand.Create(common, context),
        BudgetCommand.Create(common, context),
        CovarianceCommand.Create(common, context),
        EnsembleCommand.Create(common, context),
        WindowsCommand.Create(common, context),
        FollowCommand.Create(common, context),
    ];
}
