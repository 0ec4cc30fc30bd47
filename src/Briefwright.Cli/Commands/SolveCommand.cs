using System.CommandLine;
using Briefwright.Brief.Annex;
using Briefwright.Cli.Output;
using Briefwright.Brief;

namespace Briefwright.Cli.Commands;

/// <summary><c>solve PATH... [--json]</c>: the balanced-growth results and the optimum, as a table or JSON.</summary>
public static class SolveCommand
{
    public static Command Create(CliIo io)
    {
        var (output, error) = (io.Out, io.Err);
        var reader = new InputReader(io.In);
        var paths = ScenarioInputs.PathsArgument("solved");
        var json = new Option<bool>("--json") { Description = "Print the results as JSON: always a list with one " +
            "object per scenario solved, in the order given (a list of one for one file). Field names: " +
            "docs/results-json.md." };
        var root = ScenarioInputs.RootOption();
        var command = new Command("solve",
            "Solve scenarios: output per person for every option on the balanced growth path, and the " +
            "output-maximising schooling length.") { paths, json, root };
        command.SetAction(parse =>
        {
            if (!ScenarioInputs.RootIsValid(parse.GetValue(root), error)) return ExitCodes.InvalidInput;
            var files = ScenarioInputs.Expand(parse.GetValue(paths)!, error, out bool invalid);
            bool asJson = parse.GetValue(json);
            int code = invalid ? ExitCodes.InvalidInput : ExitCodes.Ok;
            var documents = new List<ResultsDocument>();
            foreach (var file in files)
            {
                var loaded = ScenarioInputs.Load(file, error, reader, parse.GetValue(root));
                if (!loaded.Ok)
                {
                    code = ExitCodes.InvalidInput;
                    continue;
                }
                var scenario = loaded.Document!;
                if (ScenarioInputs.Solve(file, scenario, error) is not { } solved)
                {
                    code = ExitCodes.InvalidInput;
                    continue;
                }
                var results = solved.BalancedGrowth;
                if (asJson) documents.Add(ResultsDocument.From(scenario, results, solved.Analysis));
                else
                {
                    if (files.Count > 1) output.WriteLine($"== {file}");
                    output.Write(SummaryTable.Render(scenario, results));
                    output.Write(AnalysisSummary.Render(solved));
                    if (files.Count > 1) output.WriteLine();
                }
            }
            // One shape whatever the number of files, so a script reads it the same way for one region or fifty.
            if (asJson) output.Write(ResultsJson.Write(documents));
            return code;
        });
        return command;
    }
}
