using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;
using BcPrep.Cli;
using CsCheck;

namespace BcPrep.Tests.Cli.BadInputs;

/// <summary>
/// Properties of the whole command on the bad-input base day (one pinned point, 121 rows): how the day is cut into
/// files, in what order they are given and how they are compressed never changes a boundary condition, and a
/// flipped byte is refused naming its line or, outside every window, changes nothing. The result compared is every
/// table (summary.csv and points/); the manifest differs by design (it records the logs' names and hashes).
/// Case counts are small so that the suite stays fast on two cores; CsCheck prints the seed of a failure.
/// </summary>
public sealed partial class LogVariantPropertyTests
{
    private static readonly string Rig = Path.Combine(BadInputCase.CorpusFolder, "base", "rig.toml");
    private static readonly string[] Lines = File.ReadAllText(Path.Combine(BadInputCase.CorpusFolder, "base", "day.csv")).TrimEnd('\n').Split('\n');
    private static readonly Lazy<string> Baseline = new(() => Result([Path.Combine(BadInputCase.CorpusFolder, "base", "day.csv")], out _));

    [Fact]
    public void Any_cut_of_the_day_into_files_given_in_any_order_gives_the_same_tables()
    {
        Gen.Select(Gen.Int[1, 5], Gen.Int[0, int.MaxValue]).Sample(
            (files, seed) =>
            {
                var random = new Random(seed);
                var cuts = Enumerable.Range(0, files - 1).Select(_ => random.Next(1, Lines.Length - 1)).Append(0).Append(Lines.Length - 1).Distinct().Order().ToList();
                using var temp = new Support.TempFolder();
                var paths = new List<string>();
                for (var k = 0; k + 1 < cuts.Count; k++)
                {
                    paths.Add(Write(temp, $"part{k}.csv", Lines[(1 + cuts[k])..(1 + cuts[k + 1])]));
                }
                var shuffled = paths.OrderBy(_ => random.Next()).ToList();
                var result = Result(shuffled, out var error);
                Assert.True(result == Baseline.Value, error);
            },
            iter: 6,
            threads: 1);
    }

    [Fact]
    public void A_day_split_anywhere_into_two_files_gives_the_same_tables()
    {
        Gen.Int[2, Lines.Length - 1].Sample(
            split =>
            {
                using var temp = new Support.TempFolder();
                var first = Write(temp, "first.csv", Lines[1..split]);
                var second = Write(temp, "second.csv", Lines[split..]);
                var result = Result([second, first], out var error);
                Assert.True(result == Baseline.Value, error);
            },
            iter: 8,
            threads: 1);
    }

    [Fact]
    public void Gzipping_the_log_at_any_level_gives_the_same_tables()
    {
        Gen.Int[0, 2].Sample(
            level =>
            {
                using var temp = new Support.TempFolder();
                var path = temp.File("day.csv.gz");
                using (var file = File.Create(path))
                using (var gzip = new GZipStream(file, (CompressionLevel)level))
                {
                    gzip.Write(Encoding.UTF8.GetBytes(string.Join('\n', Lines) + "\n"));
                }
                var result = Result([path], out var error);
                Assert.True(result == Baseline.Value, error);
            },
            iter: 3,
            threads: 1);
    }

    /// <summary>
    /// A bit flipped anywhere: the run either succeeds or is refused with a message naming day.csv and a line, never
    /// anything else (flips after the first data row, see below). A flip in a value cell of a row outside the pinned window (5 s to 115 s after the first row)
    /// that the run accepts leaves every table byte for byte as it was.
    /// </summary>
    [Fact]
    public void A_flipped_bit_is_refused_naming_its_line_or_outside_the_window_changes_nothing()
    {
        var bytes = Encoding.UTF8.GetBytes(string.Join('\n', Lines) + "\n");
        // Flips start after the first data row: that row sets the day's clock origin, from which the pinned window is
        // measured, so an earlier first time moves the window off the data (refused naming the point, not a line).
        var firstRowEnd = Lines[0].Length + 1 + Lines[1].Length + 1;
        Gen.Select(Gen.Int[firstRowEnd, bytes.Length - 1], Gen.Int[0, 7]).Sample(
            (at, bit) =>
            {
                using var temp = new Support.TempFolder();
                var flipped = (byte[])bytes.Clone();
                flipped[at] ^= (byte)(1 << bit);
                var path = temp.File("day.csv");
                File.WriteAllBytes(path, flipped);
                var outDir = temp.File("out");
                var stdout = new StringWriter();
                var stderr = new StringWriter();
                var code = BcPrepApp.Run(["process", Rig, path, "--out", outDir, "--quiet"], new CliContext(stdout, stderr, () => Stream.Null, false, temp.Path));
                var error = stderr.ToString();
                if (code != 0)
                {
                    Assert.True(code is 3 or 4, $"flip at byte {at}, bit {bit}: exit {code}\n{error}");
                    Assert.Matches(LineNamed(), error);
                    Assert.DoesNotContain("internal error", error, StringComparison.Ordinal);
                    Assert.False(Directory.Exists(outDir));
                    return;
                }
                var line = Encoding.UTF8.GetString(bytes, 0, at).Count(c => c == '\n');
                var column = Encoding.UTF8.GetString(bytes, 0, at).Split('\n')[^1].Count(c => c == ',');
                if (line >= 1 && (line - 1 < 5 || line - 1 > 115) && column > 0 && bytes[at] != (byte)',')
                {
                    Assert.True(Baseline.Value == Tables(outDir), $"flip at byte {at} (line {line + 1}, outside the window), bit {bit}: the tables changed");
                }
            },
            iter: 25,
            threads: 1);
    }

    [GeneratedRegex(@"error: [^\n]*day\.csv:\d+")]
    private static partial Regex LineNamed();

    private static string Write(Support.TempFolder temp, string name, string[] rows)
    {
        var path = temp.File(name);
        File.WriteAllText(path, Lines[0] + "\n" + string.Join('\n', rows) + "\n");
        return path;
    }

    /// <summary>Runs process on the logs and returns every table (path and content), or the error.</summary>
    private static string Result(IReadOnlyList<string> logs, out string error)
    {
        using var temp = new Support.TempFolder();
        var outDir = temp.File("out");
        var stderr = new StringWriter();
        var code = BcPrepApp.Run(["process", Rig, .. logs, "--out", outDir, "--quiet"], new CliContext(new StringWriter(), stderr, () => Stream.Null, false, temp.Path));
        error = $"exit {code}: {stderr}";
        return code == 0 ? Tables(outDir) : error;
    }

    private static string Tables(string outDir) =>
        string.Join("\n", Directory.GetFiles(outDir, "*.csv", SearchOption.AllDirectories).Order(StringComparer.Ordinal)
            .Select(f => Path.GetRelativePath(outDir, f) + "\n" + File.ReadAllText(f)));
}
