using System.CommandLine;
using Briefwright.Cli.Commands;

namespace Briefwright.Cli;

/// <summary>What a command may touch besides files: the console's three streams, whether it is a terminal, and the
/// clock (read only for the build log's time stamps). Tests pass their own.</summary>
public sealed record CliIo(TextWriter Out, TextWriter Err, TextReader In, bool Interactive, TimeProvider Clock);

/// <summary>
/// The command tree. Every command writes to the given writers and returns an exit code, so tests run it in process.
/// </summary>
public static class CliApp
{
    public static int Run(
        string[] args,
        TextWriter output,
        TextWriter error,
        bool interactive = false,
        TextReader? input = null,
        TimeProvider? clock = null) =>
        Run(args, new CliIo(output, error, input ?? TextReader.Null, interactive, clock ?? TimeProvider.System));

    public static int Run(string[] args, CliIo io)
    {
        if (args is ["build", ..]) Speed.HeadStart();
        var root = new RootCommand(
            "briefwright turns a scenario file (YAML) and a text template into a dated, reproducible policy brief " +
            "(PDF) on schooling length, demography and long-run output per person, with its numbers also written " +
            "as data.\n\n" +
            "Start with:  briefwright init my-briefs,  briefwright check briefs-demo,\n" +
            "             briefwright solve briefs-demo/auroria-national.yaml,\n" +
            "             briefwright build briefs-demo   (writes briefs-demo/out/<id>-<date>.pdf)\n" +
            "A path '-' reads one scenario from standard input (check, solve, diff).\n" +
            "Exit codes: 0 success, 1 a brief or run failed, 2 invalid input or usage (nothing written).")
        {
            CheckCommand.Create(io),
            SolveCommand.Create(io),
            BuildCommand.Create(io),
            DiffCommand.Create(io.Out, io.Err, io.In),
            SchemaCommand.Create(io.Out, io.Err),
            InitCommand.Create(io.Out, io.Err),
        };
        var parsed = root.Parse(args);
        var usage = Usage.Check(root, args, parsed);
        if (usage is not null)
        {
            io.Err.WriteLine(usage.Message);
            io.Err.WriteLine(usage.Hint);
            // a plan writes nothing
            if (usage.Command == "build" && !args.Contains("--plan"))
                BuildCommand.LogUsageError(args, usage.Message, io);
            return ExitCodes.InvalidInput;
        }
        // Each command reports its stages' failures (StageErrors); what escapes one is a fault of the tool, reported in
        // one line rather than as the parser's stack trace.
        var config = new InvocationConfiguration
        {
            Output = io.Out, Error = io.Err, EnableDefaultExceptionHandler = false,
        };
        try
        {
            return parsed.Invoke(config);
        }
        catch (Exception ex)
        {
            io.Err.WriteLine($"briefwright: {StageErrors.Internal(ex)}");
            return ExitCodes.Failed;
        }
    }
}
