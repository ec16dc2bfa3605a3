using System.CommandLine;
using BcPrep.Rig;

namespace BcPrep.Cli.Commands;

/// <summary>The rig-file and log arguments shared by the commands that read a test day.</summary>
public static class RigArguments
{
    public static Argument<string> Rig() => new("RIG") { Description = "The rig description file (TOML)." };

    public static Argument<string[]> Logs() => new("LOG") { Description = "Log files of the day, any order; '-' reads standard input.", Arity = ArgumentArity.OneOrMore };

    /// <summary>Reads and validates the rig file; all problems are reported at once.</summary>
    public static RigDescription LoadRig(string path)
    {
        var text = SmallTextFile.Read(path, "rig file", FailureKind.Configuration, new SourceLocation(path));
        return RigLoader.Load(text, path);
    }
}
