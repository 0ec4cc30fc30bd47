using System.CommandLine;
using Briefwright.Scenario;

namespace Briefwright.Cli.Commands;

/// <summary><c>schema</c>: print the JSON Schema of the scenario format (also in docs/scenario.schema.json).</summary>
public static class SchemaCommand
{
    public static Command Create(TextWriter output)
    {
        var command = new Command("schema", "Print the JSON Schema of the scenario format, for editors' completion and checking (save it and point your editor's YAML support at it).");
        command.SetAction(_ =>
        {
            output.Write(ScenarioSchema.Text());
            return ExitCodes.Ok;
        });
        return command;
    }
}
