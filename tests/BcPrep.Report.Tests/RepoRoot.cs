namespace BcPrep.Tests.Report;

/// <summary>Finds the repository root (the folder holding BcPrep.sln) from the test binaries' folder.</summary>
internal static class RepoRoot
{
    public static string Path { get; } = Find();

    private static string Find()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir.FullName, "BcPrep.sln")))
        {
            dir = dir.Parent;
        }
        return dir?.FullName ?? throw new InvalidOperationException("BcPrep.sln not found above " + AppContext.BaseDirectory);
    }
}
