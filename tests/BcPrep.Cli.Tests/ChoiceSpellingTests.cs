using System.Text.Json;
using System.Text.RegularExpressions;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// What a person reads spells every choice as the rig file and the windows table do (power_law, auto, r-test,
/// drift-scatter), never as the enum member behind it (PowerLaw, Auto, RTest, DriftScatter). The scan covers the
/// sample day's tables, manifest and report page from process --report --monte-carlo, the windows table, and the
/// messages on standard error.
/// </summary>
public sealed class ChoiceSpellingTests : IDisposable
{
    private readonly TempFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    /// <summary>Every member name of every enum of the tool (Core and Report), three letters or longer (Type A/B, K, AA are trade terms).</summary>
    private static readonly HashSet<string> EnumNames = new[] { typeof(BcPrep.Pipeline.DayResult).Assembly, typeof(BcPrep.Report.DayReport).Assembly }
        .SelectMany(a => a.GetTypes()).Where(t => t.IsEnum).SelectMany(Enum.GetNames).Where(n => n.Length >= 3).ToHashSet(StringComparer.Ordinal);

    [Fact]
    public void Sample_day_outputs_and_messages_spell_choices_in_rig_file_words()
    {
        var outDir = Path.Combine(_dir.Path, "out");
        var process = CliRunner.Run(SampleDay.ProcessArgs(outDir, "--report", "--monte-carlo"));
        Assert.True(process.ExitCode == 0, process.Error);
        var windows = CliRunner.Run(["windows", SampleDay.Rig, .. SampleDay.Logs, "--all"]);
        Assert.True(windows.ExitCode == 0, windows.Error);

        var texts = Directory.GetFiles(outDir, "*", SearchOption.AllDirectories)
            .Where(f => Path.GetExtension(f) is ".csv" or ".json" or ".html")
            .Select(f => (Name: Path.GetRelativePath(outDir, f), Text: File.ReadAllText(f)))
            .Append((Name: "windows --all", Text: windows.Out))
            .Append((Name: "process stderr", Text: process.Error))
            .Append((Name: "windows stderr", Text: windows.Error))
            .ToList();
        Assert.True(texts.Count > 10, $"only {texts.Count} texts scanned");

        var leaks = texts.SelectMany(t => Leaks(t.Name, t.Text)).Distinct().ToList();

        Assert.True(leaks.Count == 0, "enum-style names: " + string.Join("; ", leaks));
        // The rig-file words are there instead (the sample rig asks for velocity_model = "auto"; the walls make it power_law).
        var manifest = texts.Single(t => t.Name == "manifest.json").Text;
        Assert.Contains("\"model_requested\": \"auto\"", manifest, StringComparison.Ordinal);
        Assert.Contains("\"model_used\": \"power_law\"", manifest, StringComparison.Ordinal);
        // Whatever criteria the day's rejected stretches failed, each is one of the windows table's words.
        Assert.All(Regex.Matches(manifest, "\"criterion\": \"([^\"]*)\"").Select(m => m.Groups[1].Value),
            c => Assert.Contains(c, new[] { "drift", "scatter", "r-test", "mser", "coverage", "duration", "range" }));
        Assert.Contains("velocity model power_law;", File.ReadAllText(Path.Combine(outDir, "points", "OP1", "inlet-profile.csv")), StringComparison.Ordinal);
        Assert.Contains("<td>drift-scatter", texts.Single(t => t.Name.EndsWith("index.html", StringComparison.Ordinal)).Text, StringComparison.Ordinal);
    }

    [Fact]
    public void The_scan_finds_an_enum_name_where_one_leaks()
    {
        // The check of the check: the leaks the sample day had before, in each kind of text.
        Assert.NotEmpty(Leaks("m.json", "{ \"criterion\": \"RTest\" }"));
        Assert.NotEmpty(Leaks("m.json", "{ \"model_used\": \"Auto\" }"));
        Assert.NotEmpty(Leaks("p.csv", "# BcPrep inlet profile; point OP1; velocity model PowerLaw; profile\nr [m],u [m/s]\n"));
        Assert.NotEmpty(Leaks("i.html", "<tr><td>accepted</td><td>OP1</td><td>DriftScatter, Mser</td></tr>"));
        Assert.Empty(Leaks("i.html", "<tr><td>accepted</td><td>OP1</td><td>drift-scatter+mser</td><td>Range of the fan</td></tr>"));
    }

    /// <summary>
    /// A compound name (PowerLaw, DriftScatter, RTest) anywhere as a word; a one-word name (Auto, Drift, Mser) as a
    /// whole value: a JSON string, a CSV cell, an HTML cell or a comma/plus-separated part of one. A one-word name
    /// at the start of a sentence ("Range of…") is English, not a leak.
    /// </summary>
    private static IEnumerable<string> Leaks(string name, string text)
    {
        foreach (Match word in Regex.Matches(text, @"(?<![\w-])[A-Z][A-Za-z0-9]*(?![\w-])"))
        {
            if (EnumNames.Contains(word.Value) && Regex.IsMatch(word.Value, "^[A-Z][a-z0-9]*[A-Z]"))
            {
                yield return $"{name}: '{word.Value}'";
            }
        }
        IEnumerable<string> values = Path.GetExtension(name) switch
        {
            ".json" => JsonStrings(JsonDocument.Parse(text).RootElement),
            ".html" => Regex.Matches(text, "<t[dh][^>]*>([^<]*)</t[dh]>").Select(m => m.Groups[1].Value),
            _ => text.Split('\n').Where(l => !l.StartsWith('#')).SelectMany(l => l.Split(',')),
        };
        foreach (var value in values)
        {
            foreach (var part in value.Split([',', '+'], StringSplitOptions.TrimEntries))
            {
                if (EnumNames.Contains(part))
                {
                    yield return $"{name}: value '{part}'";
                }
            }
        }
    }

    private static IEnumerable<string> JsonStrings(JsonElement element) => element.ValueKind switch
    {
        JsonValueKind.String => [element.GetString()!],
        JsonValueKind.Object => element.EnumerateObject().SelectMany(p => JsonStrings(p.Value)),
        JsonValueKind.Array => element.EnumerateArray().SelectMany(JsonStrings),
        _ => [],
    };
}
