namespace BcPrep.Tests.Cli.Support;

/// <summary>Tests that change process-wide state (environment variables, the current culture) run one at a time.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class EnvironmentCollection
{
    public const string Name = "process-wide state";
}
