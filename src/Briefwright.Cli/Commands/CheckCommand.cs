using System.CommandLine;

namespace Briefwright.Cli.Commands;

/// <summary><c>check PATH...</c>: validate scenarios without solving them.</summary>
public static class CheckCommand
{
    public static Command Create(TextWriter output, TextWriter error)
    {
        var paths = ScenarioInputs.PathsArgument("checked");
        var command = new Command("check", "Validate scenario files and report every problem at once, as file:line:col: field: rule. Got value.") { paths };
        command.SetAction(parse =>
        {
            int code = ExitCodes.Ok;
            foreach (var file in ScenarioInputs.Expand(parse.GetValue(paths)!, error))
            {
                var result = ScenarioInputs.Load(file, error);
                if (result.Ok) output.WriteLine($"{file}: ok ({result.Document!.Brief.Id}, {result.Document.Inputs.Options.Count} options)");
                else code = ExitCodes.InvalidInput;
            }
            return code;
        });
        return command;
    }
}
