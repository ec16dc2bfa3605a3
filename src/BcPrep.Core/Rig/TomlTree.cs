using Tomlyn;
using Tomlyn.Parsing;
using Tomlyn.Syntax;

namespace BcPrep.Rig;

/// <summary>A TOML value with the place it was written, so every later check can point at file, line and key.</summary>
public sealed record TomlEntry(string Path, object Value, SourceLocation Location);

/// <summary>A TOML table whose entries keep their order and source locations.</summary>
public sealed class TomlTableNode
{
    private readonly Dictionary<string, TomlEntry> _entries = new(StringComparer.Ordinal);
    private readonly List<string> _order = [];

    public TomlTableNode(string path, SourceLocation location)
    {
        Path = path;
        Location = location;
    }

    public string Path { get; }

    public SourceLocation Location { get; }

    public IEnumerable<TomlEntry> Entries => _order.Select(k => _entries[k]);

    public IEnumerable<string> Keys => _order;

    public bool TryGet(string key, out TomlEntry entry) => _entries.TryGetValue(key, out entry!);

    internal bool TryAdd(string key, TomlEntry entry)
    {
        if (!_entries.TryAdd(key, entry))
        {
            return false;
        }
        _order.Add(key);
        return true;
    }
}

/// <summary>Builds a located tree from Tomlyn's syntax tree (Tomlyn's object model drops positions).</summary>
public static class TomlTree
{
    /// <summary>Parses TOML text. Syntax errors and duplicate keys are all reported, each with its line.</summary>
    public static (TomlTableNode Root, IReadOnlyList<Problem> Problems) Parse(string text, string fileName)
    {
        var problems = new List<Problem>();
        DocumentSyntax document;
        try
        {
            document = SyntaxParser.Parse(text, fileName, false);
        }
        catch (TomlException)
        {
            // The parser stops at a fixed nesting depth (64); report where the nesting first goes that deep.
            problems.Add(new Problem(new SourceLocation(fileName, TooDeepLine(text)), "TOML syntax: tables or arrays nested more than 64 levels deep; a rig file needs a few"));
            return (new TomlTableNode("", new SourceLocation(fileName, 1, 1)), problems);
        }
        foreach (var diagnostic in document.Diagnostics)
        {
            if (diagnostic.Kind == DiagnosticMessageKind.Error)
            {
                problems.Add(new Problem(At(fileName, diagnostic.Span, null), "TOML syntax: " + diagnostic.Message));
            }
        }
        var root = new TomlTableNode("", new SourceLocation(fileName, 1, 1));
        if (problems.Count > 0)
        {
            return (root, problems);
        }
        var builder = new Builder(fileName, problems);
        foreach (var keyValue in document.KeyValues)
        {
            builder.AddKeyValue(root, keyValue);
        }
        foreach (var table in document.Tables)
        {
            builder.AddTable(root, table);
        }
        return (root, problems);
    }

    /// <summary>Line where brackets and braces (outside strings) first nest 64 deep; 1 when not found.</summary>
    private static int TooDeepLine(string text)
    {
        var depth = 0;
        var line = 1;
        var quote = '\0';
        foreach (var c in text)
        {
            if (c == '\n')
            {
                line++;
            }
            else if (quote != '\0')
            {
                quote = c == quote ? '\0' : quote;
            }
            else if (c is '"' or '\'')
            {
                quote = c;
            }
            else if (c is '[' or '{' && ++depth >= 64)
            {
                return line;
            }
            else if (c is ']' or '}')
            {
                depth--;
            }
        }
        return 1;
    }

    internal static SourceLocation At(string file, SourceSpan span, string? key) =>
        new(file, span.Start.Line + 1, span.Start.Column + 1, key);

    private sealed class Builder(string file, List<Problem> problems)
    {
        public void AddTable(TomlTableNode root, TableSyntaxBase table)
        {
            var names = KeyParts(table.Name!);
            var isArray = table is TableArraySyntax;
            var location = At(file, table.Span, string.Join('.', names));
            var parent = root;
            for (var i = 0; i < names.Count - 1; i++)
            {
                parent = DescendOrCreate(parent, names[i], location);
                if (parent is null)
                {
                    return;
                }
            }
            var last = names[^1];
            var path = Join(parent.Path, last);
            TomlTableNode target;
            if (isArray)
            {
                if (!parent.TryGet(last, out var existing))
                {
                    existing = new TomlEntry(path, new List<TomlTableNode>(), location);
                    parent.TryAdd(last, existing);
                }
                if (existing.Value is not List<TomlTableNode> list)
                {
                    problems.Add(new Problem(location, $"'{path}' is already defined at line {existing.Location.Line} and is not an array of tables"));
                    return;
                }
                target = new TomlTableNode($"{path}[{list.Count}]", location);
                list.Add(target);
            }
            else
            {
                if (parent.TryGet(last, out var existing))
                {
                    problems.Add(new Problem(location, $"table '{path}' is defined twice (first at line {existing.Location.Line})"));
                    return;
                }
                target = new TomlTableNode(path, location);
                parent.TryAdd(last, new TomlEntry(path, target, location));
            }
            if (table.Items is { } items)
            {
                foreach (var keyValue in items)
                {
                    AddKeyValue(target, keyValue);
                }
            }
        }

        public void AddKeyValue(TomlTableNode table, KeyValueSyntax keyValue)
        {
            var names = KeyParts(keyValue.Key!);
            var location = At(file, keyValue.Span, Join(table.Path, string.Join('.', names)));
            var parent = table;
            for (var i = 0; i < names.Count - 1; i++)
            {
                parent = DescendOrCreate(parent, names[i], location);
                if (parent is null)
                {
                    return;
                }
            }
            var path = Join(parent.Path, names[^1]);
            var value = Convert(keyValue.Value!, path, location);
            if (!parent.TryAdd(names[^1], new TomlEntry(path, value, location with { Key = path })))
            {
                parent.TryGet(names[^1], out var first);
                problems.Add(new Problem(location with { Key = path }, $"key is defined twice (first at line {first.Location.Line})"));
            }
        }

        private TomlTableNode? DescendOrCreate(TomlTableNode parent, string name, SourceLocation location)
        {
            var path = Join(parent.Path, name);
            if (parent.TryGet(name, out var entry))
            {
                switch (entry.Value)
                {
                    case TomlTableNode child:
                        return child;
                    case List<TomlTableNode> { Count: > 0 } list:
                        return list[^1];
                    default:
                        problems.Add(new Problem(location, $"'{path}' is a value (line {entry.Location.Line}), not a table"));
                        return null;
                }
            }
            var created = new TomlTableNode(path, location);
            parent.TryAdd(name, new TomlEntry(path, created, location));
            return created;
        }

        private object Convert(ValueSyntax value, string path, SourceLocation location)
        {
            switch (value)
            {
                case StringValueSyntax s:
                    return s.Value ?? "";
                case IntegerValueSyntax i:
                    return (double)i.Value;
                case FloatValueSyntax f:
                    return f.Value;
                case BooleanValueSyntax b:
                    return b.Value;
                case DateTimeValueSyntax d:
                    return d.Token?.Text ?? "";
                case ArraySyntax a:
                    var items = new List<TomlEntry>();
                    var index = 0;
                    foreach (var item in a.Items)
                    {
                        var itemPath = $"{path}[{index++}]";
                        var itemLocation = At(file, item.Value!.Span, itemPath);
                        items.Add(new TomlEntry(itemPath, Convert(item.Value!, itemPath, itemLocation), itemLocation));
                    }
                    return items;
                case InlineTableSyntax t:
                    var node = new TomlTableNode(path, location);
                    foreach (var item in t.Items)
                    {
                        AddKeyValue(node, item.KeyValue!);
                    }
                    return node;
                default:
                    problems.Add(new Problem(location, "unsupported TOML value"));
                    return "";
            }
        }

        private static List<string> KeyParts(KeySyntax key)
        {
            var parts = new List<string> { KeyText(key.Key) };
            foreach (var dotted in key.DotKeys)
            {
                parts.Add(KeyText(dotted.Key));
            }
            return parts;
        }

        private static string KeyText(BareKeyOrStringValueSyntax? key) => key switch
        {
            BareKeySyntax bare => bare.Key?.Text ?? "",
            StringValueSyntax quoted => quoted.Value ?? "",
            _ => "",
        };

        private static string Join(string parent, string name) => parent.Length == 0 ? name : parent + "." + name;
    }
}
