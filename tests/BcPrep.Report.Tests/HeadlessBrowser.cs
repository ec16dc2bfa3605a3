using System.Diagnostics;

namespace BcPrep.Tests.Report;

/// <summary>
/// Headless Chromium for the page test. In CI (variable CI set) missing Chromium fails the test: .ci/install should
/// have installed it. On a developer's fresh machine the test is reported as skipped, with how to install it, so
/// that `dotnet test` works there as README promises while CI still checks the page in a real browser.
/// </summary>
internal static class HeadlessBrowser
{
    private static readonly string[] Names = ["chromium", "chromium-browser"];

    public static string Find()
    {
        foreach (var directory in (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
        {
            foreach (var name in Names)
            {
                var candidate = Path.Combine(directory, name);
                if (File.Exists(candidate))
                {
                    return candidate;
                }
            }
        }
        if (Environment.GetEnvironmentVariable("CI") is { Length: > 0 })
        {
            Assert.Fail("chromium is not on PATH in CI: .ci/install should have installed it (apt-get install chromium)");
        }
        throw new SkipException("chromium is not on PATH: install it (Debian/Ubuntu: sudo apt-get install chromium) to run the report page test");
    }

    /// <summary>Loads <paramref name="pagePath"/> with no network access of its own and returns the DOM after the page's load event.</summary>
    public static string DumpDom(string pagePath, string profileFolder) => DumpDom(pagePath, profileFolder, windowWidthPx: null);

    /// <summary>As <see cref="DumpDom(string, string)"/>, laid out in a window <paramref name="windowWidthPx"/> wide (900 px high).</summary>
    public static string DumpDom(string pagePath, string profileFolder, int? windowWidthPx)
    {
        var start = new ProcessStartInfo(Find())
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var argument in (string[])[
                     "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update",
                     "--disable-sync", "--no-first-run", "--user-data-dir=" + profileFolder, "--virtual-time-budget=10000",
                     "--dump-dom", new Uri(pagePath).AbsoluteUri,
                 ])
        {
            start.ArgumentList.Add(argument);
        }
        if (windowWidthPx is { } width)
        {
            start.ArgumentList.Insert(0, $"--window-size={width},900");
        }
        using var process = Process.Start(start)!;
        var error = process.StandardError.ReadToEndAsync();
        var output = process.StandardOutput.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(2)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail("chromium did not finish within 2 minutes");
        }
        Assert.True(process.ExitCode == 0, $"chromium exited with {process.ExitCode}: {error.Result}");
        return output.Result;
    }
}
