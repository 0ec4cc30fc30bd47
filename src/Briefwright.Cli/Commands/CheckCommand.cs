using System.CommandLine;

namespace Briefwright.Cli.Commands;

/// <summary><c>check PATH...</c>: validate scenarios without solving them.</summary>
public static class CheckCommand
{
    public static Command Create(TextWriter output, TextWriter error)
    {
        var paths = ScenarioInputs.PathsArgument("checked");
        var root = ScenarioInputs.RootOption();
        var command = new Command("check", "Validate scenario files and report every problem at once, as file:line:col: field: rule. Got value.") { paths, root };
        command.SetAction(parse =>
        {
            if (!ScenarioInputs.RootIsValid(parse.GetValue(root), error)) return ExitCodes.InvalidInput;
            var files = ScenarioInputs.Expand(parse.GetValue(paths)!, error, out bool invalid);
            int code = invalid ? ExitCodes.InvalidInput : ExitCodes.Ok;
            foreach (var file in files)
            {
                var result = ScenarioInputs.Load(file, error, parse.GetValue(root));
                if (result.Ok) output.WriteLine($"{file}: ok ({result.Document!.Brief.Id}, {result.Document.Inputs.Options.Count} options)");
                else code = ExitCodes.InvalidInput;
            }
            return code;
        });
        return command;
    }
}
