using System.CommandLine;
using Briefwright.Cli.Commands;

namespace Briefwright.Cli;

/// <summary>The command tree. Every command writes to the given writers and returns an exit code, so tests run it in process.</summary>
public static class CliApp
{
    public static int Run(string[] args, TextWriter output, TextWriter error, bool interactive = false)
    {
        if (args is ["build", ..]) BuildCommand.HeadStart();
        var root = new RootCommand(
            "briefwright turns a scenario file (YAML) and a text template into a dated, reproducible policy brief (PDF) on " +
            "schooling length, demography and long-run output per person, with its numbers also written as data.\n\n" +
            "Start with:  briefwright check briefs-demo,  briefwright solve briefs-demo/auroria-national.yaml,\n" +
            "             briefwright build briefs-demo   (writes briefs-demo/out/<id>-<date>.pdf)\n" +
            "Exit codes: 0 success, 1 a brief or run failed, 2 invalid input (nothing written).")
        {
            CheckCommand.Create(output, error),
            SolveCommand.Create(output, error),
            BuildCommand.Create(output, error, interactive),
            DiffCommand.Create(output, error),
            SchemaCommand.Create(output),
        };
        var config = new InvocationConfiguration { Output = output, Error = error };
        var parsed = root.Parse(args);
        bool help = args.Any(a => a is "-h" or "--help" or "-?" or "--version");
        var mistakes = parsed.Errors.Select(e => e.Message).ToList();
        if (mistakes.Count == 0) mistakes.AddRange(UnknownOptions(args, parsed.CommandResult.Command, root));
        if (mistakes.Count > 0 && !help)
        {
            // A usage mistake (unknown option, missing path, stray argument) is invalid input: exit code 2, in words.
            foreach (var m in mistakes.Take(10)) error.WriteLine($"briefwright: {m}");
            error.WriteLine("Run 'briefwright --help' (or 'briefwright COMMAND --help') for the commands and their options.");
            return ExitCodes.InvalidInput;
        }
        return parsed.Invoke(config);
    }

    /// <summary>
    /// Tokens that look like options but are none of the command's: the paths argument would otherwise take
    /// <c>--frobnicate</c> as a file name. A lone <c>-</c>, numbers and everything after <c>--</c> are left alone.
    /// </summary>
    private static IEnumerable<string> UnknownOptions(string[] args, Command command, RootCommand root)
    {
        var known = command.Options.Concat(root.Options).SelectMany(o => o.Aliases.Append(o.Name)).ToHashSet(StringComparer.Ordinal);
        foreach (var token in args)
        {
            if (token == "--") yield break;
            if (token.Length < 2 || token[0] != '-' || double.TryParse(token, System.Globalization.CultureInfo.InvariantCulture, out _)) continue;
            string name = token.Split('=', 2)[0];
            if (!known.Contains(name)) yield return $"unknown option '{Scenario.Binding.BindContext.Printable(name)}' for '{command.Name}'.";
        }
    }
}
