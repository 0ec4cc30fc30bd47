using System.CommandLine;
using Briefwright.Scenario.Binding;

namespace Briefwright.Cli.Commands;

/// <summary>
/// A mistake in the command line itself: which command (empty for none), what is wrong, where to read more.
/// </summary>
public sealed record UsageError(string Command, string Message, string Hint);

/// <summary>
/// The command-line conventions checked before any command runs: a known command first, only that command's options
/// (an option-looking word is never taken as a path; write <c>./-name</c> or put it after <c>--</c>), and whatever the
/// parser itself refuses. Every such mistake is a usage error, exit code 2, with a suggestion when one is close.
/// </summary>
public static class Usage
{
    private static readonly string[] HelpNames = { "-h", "--help", "-?", "/?" };

    public static UsageError? Check(RootCommand root, string[] args, ParseResult parsed)
    {
        var commands = root.Subcommands.Select(c => c.Name).ToList();
        string list = string.Join(", ", commands);
        if (args.Length == 0)
            return new UsageError("", $"briefwright: no command given. Commands: {list}.",
                "Run 'briefwright --help' for what each one does.");
        string first = args[0];
        var command = root.Subcommands.FirstOrDefault(c => c.Name == first);
        if (command is null)
        {
            if (HelpNames.Contains(first) || first == "--version") return null;
            if (first.StartsWith('-'))
                return new UsageError("",
                    $"briefwright: '{first}' is not an option here; a command comes first ({list}).",
                    "Run 'briefwright --help' for what each one does.");
            string? guess = Suggestions.Closest(first, commands);
            return new UsageError("",
                $"briefwright: unknown command '{first}'{Mean(guess)}. Commands: {list}.",
                "Run 'briefwright --help' for what each one does.");
        }
        string hint = $"Run 'briefwright {command.Name} --help' for its options.";
        var options = command.Options.ToList();
        var names = options.SelectMany(o => o.Aliases.Prepend(o.Name)).Concat(HelpNames).Distinct().ToList();
        for (int i = 1; i < args.Length; i++)
        {
            string a = args[i];
            if (a == "--") break;
            if (a == "-" || !a.StartsWith('-')) continue;
            var option = options.FirstOrDefault(o => o.Name == a || o.Aliases.Contains(a));
            if (option is not null)
            {
                if (TakesValue(option)) i++; // its value may itself start with '-'
                continue;
            }
            int sep = a.IndexOfAny(new[] { '=', ':' });
            if (sep > 0 && options.Any(o => o.Name == a[..sep] || o.Aliases.Contains(a[..sep]))) continue;
            if (HelpNames.Contains(a)) continue;
            string name = sep > 0 ? a[..sep] : a;
            return new UsageError(command.Name,
                $"briefwright {command.Name}: '{name}' is not an option of " +
                $"{command.Name}{Mean(Suggestions.Closest(name, names))}.", hint);
        }
        if (parsed.Errors.Count > 0)
            return new UsageError(command.Name,
                $"briefwright {command.Name}: {string.Join(" ", parsed.Errors.Select(e => e.Message))}", hint);
        return null;
    }

    private static string Mean(string? guess) => guess is null ? "" : $" (did you mean '{guess}'?)";

    private static bool TakesValue(Option option) =>
        option.ValueType != typeof(bool) && option.Arity.MaximumNumberOfValues > 0;
}
