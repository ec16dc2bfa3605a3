using System.Diagnostics;

namespace BcPrep.Tests.Cli.Support;

/// <summary>
/// The built bcprep (src/BcPrep.Cli/bin/CONFIG/net10.0/bcprep.dll, same configuration as these tests; the test
/// project references the CLI project, so it is built before the tests), run as a real process.
/// </summary>
internal static class BuiltBinary
{
    public static string Dll { get; } = Find();

    /// <summary>The dotnet host that runs the tests (so the same runtime runs bcprep).</summary>
    public static string DotnetHost { get; } =
        Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host && File.Exists(host) ? host : "dotnet";

    public static string Quote(string text) => "'" + text.Replace("'", "'\\''", StringComparison.Ordinal) + "'";

    public static ProcessStartInfo StartInfo(params string[] args)
    {
        var info = new ProcessStartInfo(DotnetHost) { RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true, UseShellExecute = false };
        info.ArgumentList.Add(Dll);
        foreach (var arg in args)
        {
            info.ArgumentList.Add(arg);
        }
        return info;
    }

    /// <summary>
    /// Runs a bash script (via /bin/bash -c) in which the shell function <c>bcprep</c> starts the built binary, and
    /// returns exit code, standard output and standard error.
    /// </summary>
    public static (int ExitCode, string Out, string Error) Bash(string script, TimeSpan timeout)
    {
        var info = new ProcessStartInfo("/bin/bash") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        info.ArgumentList.Add("-c");
        info.ArgumentList.Add("bcprep() { \"$BCPREP_HOST\" \"$BCPREP_DLL\" \"$@\"; }; export -f bcprep\n" + script);
        info.Environment["BCPREP_HOST"] = DotnetHost;
        info.Environment["BCPREP_DLL"] = Dll;
        info.Environment.Remove("NO_COLOR");
        using var process = Process.Start(info)!;
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(timeout))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException("bash script did not finish in " + timeout + ": " + script);
        }
        return (process.ExitCode, output.Result, error.Result);
    }

    private static string Find()
    {
        var testBin = new DirectoryInfo(AppContext.BaseDirectory.TrimEnd(Path.DirectorySeparatorChar));
        var framework = testBin.Name;
        var configuration = testBin.Parent!.Name;
        var dll = Path.Combine(RepoRoot.Path, "src", "BcPrep.Cli", "bin", configuration, framework, "bcprep.dll");
        if (File.Exists(dll))
        {
            return dll;
        }
        throw new FileNotFoundException($"the built bcprep is not at {dll}; build the solution (the test project references the CLI project)");
    }
}
