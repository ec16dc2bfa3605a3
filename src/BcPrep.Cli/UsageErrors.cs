using System.CommandLine;
using System.CommandLine.Parsing;

namespace BcPrep.Cli;

/// <summary>
/// Turns the parser's errors into BcPrep's own usage problems, located on "(command line)" like every other usage
/// error, so that they are printed, coloured and exit-coded by the same path. The parser's stock English ("Required
/// command was not provided.", "Cannot parse argument … as expected type 'System.Int32'") never reaches the user:
/// the problems are read from the parse's structure, and a parser message is used only for a case not foreseen here.
/// </summary>
internal static class UsageErrors
{
    public const string Location = "(command line)";

    /// <summary>The one follow-up line after a usage error.</summary>
    public static string FollowUp(Command command, RootCommand root) =>
        command == root ? "See 'bcprep --help'." : $"See 'bcprep {command.Name} --help'.";

    public static BcPrepFailure From(ParseResult parse, RootCommand root)
    {
        var command = parse.CommandResult.Command;
        var problems = new List<Problem>();
        void Add(string? key, string message)
        {
            var problem = new Problem(new SourceLocation(Location, Key: key), message);
            if (!problems.Contains(problem))
            {
                problems.Add(problem);
            }
        }

        if (command == root)
        {
            var names = root.Subcommands.Select(c => c.Name).ToList();
            var unknown = parse.UnmatchedTokens.FirstOrDefault(t => !t.StartsWith('-'));
            if (unknown is not null)
            {
                Add(null, $"unknown command '{unknown}'{Suggestion(unknown, names)}; the commands are {string.Join(", ", names)}");
            }
            else if (parse.UnmatchedTokens.Count == 0)
            {
                Add(null, $"no command given; the commands are {string.Join(", ", names)}");
            }
        }

        foreach (var token in parse.UnmatchedTokens.Where(t => command != root || t.StartsWith('-')))
        {
            if (token.StartsWith('-'))
            {
                Add(null, $"unknown option '{token}'{Suggestion(token, OptionNames(command, root))}");
            }
            else
            {
                Add(null, $"unexpected argument '{token}'");
            }
        }

        foreach (var error in parse.Errors)
        {
            switch (error.SymbolResult)
            {
                case OptionResult { Tokens.Count: 0, Implicit: false } option when option.Option.Arity.MinimumNumberOfValues > 0:
                    Add(option.Option.Name, $"needs a value ({Label(option.Option)})");
                    break;
                case OptionResult option when option.Tokens.Count > 0:
                    Add(option.Option.Name, BadValue(option.Tokens[^1].Value, option.Option.ValueType, Label(option.Option)));
                    break;
                case ArgumentResult { Parent: OptionResult option } argument when argument.Tokens.Count > 0:
                    Add(option.Option.Name, BadValue(argument.Tokens[^1].Value, option.Option.ValueType, Label(option.Option)));
                    break;
            }
        }

        if (command != root)
        {
            foreach (var argument in command.Arguments)
            {
                var given = parse.GetResult(argument)?.Tokens.Count ?? 0;
                if (given < argument.Arity.MinimumNumberOfValues)
                {
                    Add(null, $"missing <{argument.Name}>; the usage is {Usage(command)}");
                }
            }
            // A required option that was not typed has no result, or an implicit one without its name.
            foreach (var option in command.Options.Where(o => o.Required && parse.GetResult(o) is not OptionResult { IdentifierToken: not null }))
            {
                Add(null, $"{Label(option)} is required");
            }
        }

        if (problems.Count == 0)
        {
            // A case this translation does not know: still BcPrep's form, with the parser's words.
            foreach (var error in parse.Errors)
            {
                Add(null, error.Message);
            }
        }

        return new BcPrepFailure(FailureKind.Configuration, problems);
    }

    /// <summary>An option as help shows it: "--out &lt;DIR&gt;", or just "--force" for a switch.</summary>
    public static string Label(Option option) =>
        option.ValueType == typeof(bool) ? option.Name : $"{option.Name} <{option.HelpName ?? option.Name.TrimStart('-').ToUpperInvariant()}>";

    private static string Usage(Command command) =>
        $"bcprep {command.Name} " + string.Join(" ", command.Arguments.Select(a => a.Arity.MaximumNumberOfValues > 1 ? $"<{a.Name}>..." : $"<{a.Name}>")) + " [options]";

    private static string BadValue(string value, Type type, string label)
    {
        var wanted = Nullable.GetUnderlyingType(type) ?? type;
        var kind = wanted == typeof(int) || wanted == typeof(long) ? "a whole number"
            : wanted == typeof(double) ? "a number"
            : wanted == typeof(bool) ? "true or false"
            : "a valid value";
        return $"'{value}' is not {kind} ({label})";
    }

    private static IEnumerable<string> OptionNames(Command command, RootCommand root) =>
        command.Options.Concat(root.Options.Where(o => o.Recursive)).SelectMany(o => o.Aliases.Prepend(o.Name)).Where(n => n.StartsWith("--", StringComparison.Ordinal));

    /// <summary>"; did you mean 'x'?" for the one closest name within two edits, else nothing.</summary>
    private static string Suggestion(string typed, IEnumerable<string> names)
    {
        var best = names.Distinct(StringComparer.Ordinal)
            .Select(n => (Name: n, Distance: EditDistance(typed, n)))
            .Where(c => c.Distance <= 2)
            .OrderBy(c => c.Distance).ThenBy(c => c.Name, StringComparer.Ordinal)
            .FirstOrDefault();
        return best.Name is null ? "" : $" (did you mean '{best.Name}'?)";
    }

    private static int EditDistance(string a, string b)
    {
        var previous = Enumerable.Range(0, b.Length + 1).ToArray();
        for (var i = 1; i <= a.Length; i++)
        {
            var current = new int[b.Length + 1];
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            }
            previous = current;
        }
        return previous[b.Length];
    }
}
