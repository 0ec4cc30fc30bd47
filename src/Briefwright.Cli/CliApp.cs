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
        if (parsed.Errors.Count > 0 && !args.Any(a => a is "-h" or "--help" or "-?" or "--version"))
        {
            // A usage mistake (unknown option, missing path, stray argument) is invalid input: exit code 2, in words.
            foreach (var e in parsed.Errors.Take(10)) error.WriteLine($"briefwright: {e.Message}");
            error.WriteLine("Run 'briefwright --help' (or 'briefwright COMMAND --help') for the commands and their options.");
            return ExitCodes.InvalidInput;
        }
        return parsed.Invoke(config);
    }
}
