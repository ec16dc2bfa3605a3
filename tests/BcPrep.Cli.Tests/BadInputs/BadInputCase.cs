using System.Text;
using System.Text.Json;

namespace BcPrep.Tests.Cli.BadInputs;

/// <summary>
/// One case of the bad-input corpus (a <c>cases/NAME.json</c> file): which inputs to build from the shared base
/// files with one planted mistake, the command line, and what the refusal must look like.
/// </summary>
/// <remarks>
/// Files are built in a scratch folder. <c>rig.toml</c> and <c>day.csv</c> are always there (copies of the base);
/// a case overrides them or adds files. Edits of a file built <c>from</c> a base file: <c>replace</c> (exact text,
/// each must occur exactly once), then <c>cells</c> and <c>lines</c> (1-based line numbers of the base file; a line may be generated as prefix + repeat × times + suffix), then
/// <c>keep</c> (ranges of base lines to keep). A file may instead be <c>text</c>, <c>base64</c>, a <c>directory</c>,
/// a <c>symlink</c> (to a path in the scratch folder) or carry a <c>mode</c> (octal, e.g. "000").
/// A file name may lie in the output folder (<c>out/NAME</c>): it is built after the previous run's outputs are copied
/// there, and is part of what the refusal must leave untouched.
/// In <c>args</c>, <c>{name}</c> is the path of a built file, <c>{out}</c> the output folder and <c>{dir}</c> the scratch folder.
/// </remarks>
public sealed record BadInputCase(
    string Name,
    string Description,
    IReadOnlyList<string> Args,
    int Exit,
    string Message,
    IReadOnlyList<string> Location,
    string OutState,
    bool NeedsNonRoot,
    JsonElement Files)
{
    public static string CorpusFolder => Path.Combine(RepoRoot.Path, "tests", "BcPrep.Cli.Tests", "BadInputs");

    public static IReadOnlyList<BadInputCase> All() =>
        Directory.GetFiles(Path.Combine(CorpusFolder, "cases"), "*.json").Order(StringComparer.Ordinal).Select(Load).ToList();

    public static BadInputCase Load(string path)
    {
        using var document = JsonDocument.Parse(File.ReadAllText(path), new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        var root = document.RootElement;
        var name = Path.GetFileNameWithoutExtension(path);
        string Required(string key) => root.TryGetProperty(key, out var v) ? v.GetString()! : throw new InvalidDataException($"{name}: '{key}' is missing");
        return new BadInputCase(
            name,
            Required("description"),
            root.GetProperty("args").EnumerateArray().Select(a => a.GetString()!).ToList(),
            root.GetProperty("exit").GetInt32(),
            Required("message"),
            root.GetProperty("location").EnumerateArray().Select(a => a.GetString()!).ToList(),
            root.TryGetProperty("out", out var o) ? o.GetString()! : "previous",
            root.TryGetProperty("needs_non_root", out var nr) && nr.GetBoolean(),
            root.TryGetProperty("files", out var files) ? files.Clone() : JsonDocument.Parse("{}").RootElement.Clone());
    }

    public bool IsProcess => Args.Count > 0 && Args[0] == "process";

    /// <summary>Builds the case's files in <paramref name="scratch"/> and returns the command line with paths filled in.</summary>
    public string[] Materialize(string scratch, string outDir)
    {
        var paths = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var baseName in new[] { "rig.toml", "day.csv" })
        {
            var target = Path.Combine(scratch, baseName);
            File.Copy(Path.Combine(CorpusFolder, "base", baseName), target);
            paths[baseName] = target;
        }
        var modes = new List<(string Path, string Mode)>();
        foreach (var file in Files.EnumerateObject())
        {
            var target = Path.Combine(scratch, file.Name);
            paths[file.Name] = target;
            Build(file.Value, target, scratch);
            if (file.Value.TryGetProperty("mode", out var mode))
            {
                modes.Add((target, mode.GetString()!));
            }
        }
        foreach (var (path, mode) in modes)
        {
            if (!OperatingSystem.IsWindows())
            {
                File.SetUnixFileMode(path, (UnixFileMode)Convert.ToInt32(mode, 8));
            }
        }
        paths["out"] = outDir;
        paths["dir"] = scratch;
        return Args.Select(a => Fill(a, paths)).ToArray();
    }

    private static string Fill(string arg, Dictionary<string, string> paths)
    {
        foreach (var (name, path) in paths)
        {
            arg = arg.Replace("{" + name + "}", path, StringComparison.Ordinal);
        }
        return arg;
    }

    private void Build(JsonElement spec, string target, string scratch)
    {
        if (File.Exists(target))
        {
            File.Delete(target);
        }
        else if (Directory.Exists(target))
        {
            Directory.Delete(target, recursive: true);
        }
        Directory.CreateDirectory(Path.GetDirectoryName(target)!);
        if (spec.TryGetProperty("directory", out var isDirectory) && isDirectory.GetBoolean())
        {
            Directory.CreateDirectory(target);
            return;
        }
        if (spec.TryGetProperty("symlink", out var link))
        {
            File.CreateSymbolicLink(target, Path.Combine(scratch, link.GetString()!));
            return;
        }
        if (spec.TryGetProperty("text", out var text))
        {
            File.WriteAllText(target, text.GetString()!.Replace("\r\n", "\n", StringComparison.Ordinal), new UTF8Encoding(false));
            return;
        }
        if (spec.TryGetProperty("base64", out var base64))
        {
            File.WriteAllBytes(target, Convert.FromBase64String(base64.GetString()!));
            return;
        }
        var content = File.ReadAllText(Path.Combine(CorpusFolder, "base", spec.GetProperty("from").GetString()!));
        File.WriteAllText(target, Edit(content, spec), new UTF8Encoding(false));
    }

    private string Edit(string content, JsonElement spec)
    {
        if (spec.TryGetProperty("replace", out var replacements))
        {
            foreach (var r in replacements.EnumerateArray())
            {
                var old = r.GetProperty("old").GetString()!;
                var count = Occurrences(content, old);
                if (count != 1)
                {
                    throw new InvalidDataException($"{Name}: the text to replace occurs {count} times in the base file (must be once): {old}");
                }
                content = content.Replace(old, r.GetProperty("new").GetString()!, StringComparison.Ordinal);
            }
        }
        var endsWithNewline = content.EndsWith('\n');
        var lines = content.TrimEnd('\n').Split('\n').ToList();
        if (spec.TryGetProperty("cells", out var cells))
        {
            var header = lines[0].Split(',');
            foreach (var c in cells.EnumerateArray())
            {
                var column = Array.IndexOf(header, c.GetProperty("column").GetString()!);
                if (column < 0)
                {
                    throw new InvalidDataException($"{Name}: no column {c.GetProperty("column").GetString()} in the base file");
                }
                for (var line = c.GetProperty("from_line").GetInt32(); line <= c.GetProperty("to_line").GetInt32(); line++)
                {
                    var fields = lines[line - 1].Split(',');
                    fields[column] = c.GetProperty("value").GetString()!;
                    lines[line - 1] = string.Join(',', fields);
                }
            }
        }
        if (spec.TryGetProperty("lines", out var lineEdits))
        {
            foreach (var edit in lineEdits.EnumerateObject())
            {
                var index = int.Parse(edit.Name, System.Globalization.CultureInfo.InvariantCulture) - 1;
                lines[index] = edit.Value.ValueKind == JsonValueKind.String
                    ? edit.Value.GetString()!
                    : Text(edit.Value, "prefix") + string.Concat(Enumerable.Repeat(edit.Value.GetProperty("repeat").GetString()!, edit.Value.GetProperty("times").GetInt32())) + Text(edit.Value, "suffix");
            }
        }
        if (spec.TryGetProperty("keep", out var keep))
        {
            var ranges = keep.EnumerateArray().Select(r => (From: r[0].GetInt32(), To: r[1].GetInt32())).ToList();
            lines = lines.Where((_, i) => ranges.Any(r => i + 1 >= r.From && i + 1 <= r.To)).ToList();
        }
        return string.Join('\n', lines) + (endsWithNewline ? "\n" : "");
    }

    private static string Text(JsonElement spec, string key) => spec.TryGetProperty(key, out var v) ? v.GetString()! : "";

    private static int Occurrences(string text, string part)
    {
        var count = 0;
        for (var i = text.IndexOf(part, StringComparison.Ordinal); i >= 0; i = text.IndexOf(part, i + 1, StringComparison.Ordinal))
        {
            count++;
        }
        return count;
    }

    public override string ToString() => Name;
}
