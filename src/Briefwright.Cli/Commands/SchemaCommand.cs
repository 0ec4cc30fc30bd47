using System.CommandLine;
using System.Text.Json;
using System.Text.Json.Nodes;
using Briefwright.Cli.Project;
using Briefwright.Scenario;

namespace Briefwright.Cli.Commands;

/// <summary><c>schema [scenario|theme|settings]</c>: print a JSON Schema (also in docs/*.schema.json).</summary>
public static class SchemaCommand
{
    public static readonly string[] Kinds = { "scenario", "theme", "settings" };

    public static string Text(string kind) => kind switch
    {
        "theme" => Write(ThemeSchema.Build()),
        "settings" => Write(ProjectSettings.Schema()),
        _ => ScenarioSchema.Text(),
    };

    private static string Write(JsonObject schema) =>
        schema.ToJsonString(new JsonSerializerOptions
        {
            WriteIndented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        }) + "\n";

    public static Command Create(TextWriter output, TextWriter error)
    {
        var kind = new Argument<string>("kind")
        {
            Description = "Which file: scenario (default), theme or settings (" + ProjectSettings.FileName + ").",
            Arity = ArgumentArity.ZeroOrOne,
            DefaultValueFactory = _ => "scenario",
        };
        var command = new Command("schema",
            "Print the JSON Schema of the scenario format, a theme or the project settings, for editors' completion " +
            "and checking (save it and point your editor's YAML support at it; docs/ holds all three).") { kind };
        command.SetAction(parse =>
        {
            string k = parse.GetValue(kind)!;
            if (!Kinds.Contains(k))
            {
                string? guess = Scenario.Binding.Suggestions.Closest(k, Kinds);
                error.WriteLine("briefwright schema: must be one of " +
                    $"{string.Join(", ", Kinds)}{(guess is null ? "" : $" (did you mean '{guess}'?)")}. Got '{k}'.");
                error.WriteLine("Run 'briefwright schema --help' for its options.");
                return ExitCodes.InvalidInput;
            }
            output.Write(Text(k));
            return ExitCodes.Ok;
        });
        return command;
    }
}
