using System.Security.Cryptography;
using BcPrep.Cli;
using Xunit.Abstractions;

namespace BcPrep.Tests.Cli.BadInputs;

/// <summary>
/// The bad-input corpus: every case must be refused with its documented exit code, a message that names the file
/// and line/column or key, nothing on standard output, no stack trace, and no new or changed output file.
/// </summary>
public sealed class BadInputCorpusTests(BaseRunFixture baseRun, ITestOutputHelper output) : IClassFixture<BaseRunFixture>
{
    public const int MinimumCases = 40;

    private static readonly bool ChmodBlocksReading = BaseRunFixture.ChmodBlocksReading();

    public static TheoryData<string> CaseNames()
    {
        var data = new TheoryData<string>();
        foreach (var c in BadInputCase.All().Where(c => !c.NeedsNonRoot || ChmodBlocksReading))
        {
            data.Add(c.Name);
        }
        return data;
    }

    [Fact]
    public void Corpus_holds_at_least_40_cases_and_reports_its_count()
    {
        var all = BadInputCase.All();
        var skipped = all.Where(c => c.NeedsNonRoot && !ChmodBlocksReading).Select(c => c.Name).ToList();
        output.WriteLine($"bad-input corpus: {all.Count} cases ({all.Count - skipped.Count} run)");
        if (skipped.Count > 0)
        {
            output.WriteLine($"not run: {string.Join(", ", skipped)} (running as a user whom a mode-000 file does not stop from reading, e.g. root)");
        }
        Assert.True(all.Count >= MinimumCases, $"the corpus holds {all.Count} cases; at least {MinimumCases} are required");
        Assert.Equal(all.Count, all.Select(c => c.Name).Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void The_untouched_base_files_process_cleanly()
    {
        Assert.True(baseRun.ExitCode == ExitCodes.Success, baseRun.Error);
        Assert.True(File.Exists(Path.Combine(baseRun.PreviousOutputs, "manifest.json")));
    }

    [Fact]
    public void Corpus_stays_small()
    {
        var bytes = Directory.GetFiles(BadInputCase.CorpusFolder, "*", SearchOption.AllDirectories).Sum(f => new FileInfo(f).Length);
        output.WriteLine($"bad-input corpus size: {bytes} bytes");
        Assert.True(bytes < 1_000_000, $"the corpus holds {bytes} bytes; keep it under 1 MB");
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Case(string name)
    {
        var badCase = BadInputCase.Load(Path.Combine(BadInputCase.CorpusFolder, "cases", name + ".json"));
        var scratch = Directory.CreateTempSubdirectory("bcprep-badinput-").FullName;
        try
        {
            var outDir = Path.Combine(scratch, "out");
            if (badCase.OutState == "previous")
            {
                CopyTree(baseRun.PreviousOutputs, outDir);
            }
            var args = badCase.Materialize(scratch, outDir);
            var before = Snapshot(outDir);
            var outside = OutsideSnapshot(scratch, outDir);
            var stdout = new StringWriter();
            var stderr = new StringWriter();
            var code = BcPrepApp.Run(args, new CliContext(stdout, stderr, () => Stream.Null, false, scratch));
            var error = stderr.ToString();
            output.WriteLine($"{name}: {badCase.Description}");
            output.WriteLine($"exit {code}; standard error:\n{error}");

            Assert.True(code == badCase.Exit, $"exit code {code}, expected {badCase.Exit}; standard error:\n{error}");
            Assert.Equal("", stdout.ToString());
            Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
            Assert.DoesNotContain("internal error", error, StringComparison.Ordinal);
            var line = error.Split('\n').FirstOrDefault(l => l.Contains(badCase.Message, StringComparison.Ordinal));
            Assert.True(line is not null, $"no line of standard error holds '{badCase.Message}':\n{error}");
            Assert.StartsWith("error: ", line, StringComparison.Ordinal);
            foreach (var part in badCase.Location)
            {
                Assert.True(line.Contains(part, StringComparison.Ordinal), $"the message does not name '{part}':\n{line}");
            }
            Assert.Equal(before, Snapshot(outDir));
            Assert.Equal(outside, OutsideSnapshot(scratch, outDir));
        }
        finally
        {
            RestoreModes(scratch);
            Directory.Delete(scratch, recursive: true);
        }
    }

    /// <summary>Relative path and SHA-256 of every file under the folder (empty when it does not exist).</summary>
    private static string Snapshot(string folder)
    {
        if (!Directory.Exists(folder))
        {
            return "(no folder)";
        }
        var files = Directory.GetFiles(folder, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal)
            .Select(f => Path.GetRelativePath(folder, f) + " " + Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(f))));
        return string.Join("\n", files);
    }

    /// <summary>
    /// Every entry of the scratch folder except the output folder: path, kind, size and modification time (links are
    /// listed with their target, never followed), so that anything written, removed or left beside --out shows.
    /// </summary>
    private static string OutsideSnapshot(string scratch, string outDir)
    {
        var lines = new List<string>();
        void Walk(string folder)
        {
            foreach (var entry in new DirectoryInfo(folder).EnumerateFileSystemInfos().OrderBy(e => e.Name, StringComparer.Ordinal))
            {
                if (entry.FullName == outDir)
                {
                    continue;
                }
                var relative = Path.GetRelativePath(scratch, entry.FullName);
                if (entry.LinkTarget is { } target)
                {
                    lines.Add($"{relative} -> {target}");
                }
                else if (entry is DirectoryInfo)
                {
                    lines.Add(relative + "/");
                    Walk(entry.FullName);
                }
                else
                {
                    lines.Add($"{relative} {((FileInfo)entry).Length} {entry.LastWriteTimeUtc.Ticks}");
                }
            }
        }
        Walk(scratch);
        return string.Join("\n", lines);
    }

    private static void CopyTree(string from, string to)
    {
        foreach (var file in Directory.GetFiles(from, "*", SearchOption.AllDirectories))
        {
            var target = Path.Combine(to, Path.GetRelativePath(from, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
    }

    private static void RestoreModes(string folder)
    {
        foreach (var file in Directory.GetFiles(folder, "*", SearchOption.AllDirectories))
        {
            if (!OperatingSystem.IsWindows() && !new FileInfo(file).Attributes.HasFlag(FileAttributes.ReparsePoint))
            {
                File.SetUnixFileMode(file, UnixFileMode.UserRead | UnixFileMode.UserWrite);
            }
        }
    }
}
