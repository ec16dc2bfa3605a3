using BcPrep.Cli;

namespace BcPrep.Tests.Cli.BadInputs;

/// <summary>
/// Runs <c>process</c> once on the untouched base files, so that (a) every case is known to differ from a good
/// day only by its planted mistake, and (b) process cases can start from a folder holding a previous good run,
/// which a refusal must leave byte for byte unchanged.
/// </summary>
public sealed class BaseRunFixture : IDisposable
{
    public BaseRunFixture()
    {
        Scratch = Directory.CreateTempSubdirectory("bcprep-badinput-base-").FullName;
        var rig = Path.Combine(BadInputCase.CorpusFolder, "base", "rig.toml");
        var day = Path.Combine(BadInputCase.CorpusFolder, "base", "day.csv");
        PreviousOutputs = Path.Combine(Scratch, "out");
        var output = new StringWriter();
        var error = new StringWriter();
        var context = new CliContext(output, error, () => Stream.Null, false, Scratch);
        ExitCode = BcPrepApp.Run(["process", rig, day, "--out", PreviousOutputs, "--quiet"], context);
        Error = error.ToString();
    }

    public string Scratch { get; }

    public string PreviousOutputs { get; }

    public int ExitCode { get; }

    public string Error { get; }

    /// <summary>False when running as a user who reads any file (root): a mode-000 file is then still readable.</summary>
    public static bool ChmodBlocksReading()
    {
        if (OperatingSystem.IsWindows())
        {
            return false;
        }
        var probe = Path.GetTempFileName();
        File.SetUnixFileMode(probe, UnixFileMode.None);
        try
        {
            File.ReadAllText(probe);
            return false;
        }
        catch (UnauthorizedAccessException)
        {
            return true;
        }
        finally
        {
            File.Delete(probe);
        }
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Scratch, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
