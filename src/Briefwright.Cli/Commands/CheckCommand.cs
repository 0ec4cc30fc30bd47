using System.CommandLine;
using Briefwright.Cli.Project;
using Briefwright.Scenario;

namespace Briefwright.Cli.Commands;

/// <summary><c>check PATH...</c>: validate scenarios, themes and project settings without solving anything.</summary>
public static class CheckCommand
{
    public static Command Create(CliIo io)
    {
        var paths = ScenarioInputs.PathsArgument("checked");
        paths.Description += " Themes (*.theme.yaml) and the project settings file (" + ProjectSettings.FileName + ") are checked as what they are; a folder's are checked too.";
        var root = ScenarioInputs.RootOption();
        var command = new Command("check", "Validate scenario files, themes and project settings and report every problem at once, as file:line:col: field: rule. Got value. " +
                                           "Scenarios of one check that share a brief.id are reported too.") { paths, root };
        command.SetAction(parse =>
        {
            var (output, error) = (io.Out, io.Err);
            if (!ScenarioInputs.RootIsValid(parse.GetValue(root), error)) return ExitCodes.InvalidInput;
            string? rootDir = parse.GetValue(root);
            var given = parse.GetValue(paths)!;
            // Themes and settings: named directly, or found in a named folder.
            var others = given.Where(p => p != "-" && !Directory.Exists(p) && !ScenarioInputs.IsScenarioFile(p) && (p.EndsWith(".yaml") || p.EndsWith(".yml")))
                .Concat(given.Where(p => p != "-" && Directory.Exists(p)).SelectMany(d => Directory.EnumerateFiles(d)
                    .Where(f => f.EndsWith(".theme.yaml", StringComparison.Ordinal) || Path.GetFileName(f) == ProjectSettings.FileName).Order(StringComparer.Ordinal)))
                .ToList();
            var reader = new InputReader(io.In);
            var scenarios = ScenarioInputs.Expand(given.Where(p => !others.Contains(p)), error, out bool invalid);
            int code = invalid ? ExitCodes.InvalidInput : ExitCodes.Ok;
            var loaded = scenarios.Select(f => (File: f, Loaded: new ScenarioLoader(reader, rootDir).Load(f))).ToList();
            var duplicates = ScenarioInputs.DuplicateIds(loaded, reader);
            foreach (var (file, result) in loaded)
            {
                ScenarioInputs.Print(result.Problems, result.Sources, error);
                if (duplicates.TryGetValue(file, out var dup)) error.WriteLine(result.Sources.Render(dup));
                int count = result.Problems.Count + (duplicates.ContainsKey(file) ? 1 : 0);
                if (count > 0)
                {
                    error.WriteLine($"{file}: {count} problem{(count == 1 ? "" : "s")}.");
                    code = ExitCodes.InvalidInput;
                }
                else output.WriteLine($"{file}: ok ({result.Document!.Brief.Id}, {result.Document.Inputs.Options.Count} options)");
            }
            foreach (var file in others)
            {
                bool ok;
                string what;
                if (Path.GetFileName(file) == ProjectSettings.FileName)
                {
                    var settings = ProjectSettings.Load(file, new FileSourceReader());
                    foreach (var d in settings.Problems) error.WriteLine(settings.Sources.Render(d));
                    (ok, what) = (settings.Problems.Count == 0, "project settings");
                }
                else
                {
                    // The loader reads and checks the logo and fonts a theme names, as the build does.
                    var (spec, problems, sources) = ThemeLoader.Load(file, new FileSourceReader(), rootDir);
                    ScenarioInputs.Print(problems, sources, error);
                    ok = spec is not null && problems.Count == 0;
                    what = spec is null ? "" : $"theme '{spec.Name}', paper {spec.Paper}";
                }
                if (ok) output.WriteLine($"{file}: ok ({what})");
                else
                {
                    error.WriteLine($"{file}: not valid.");
                    code = ExitCodes.InvalidInput;
                }
            }
            return code;
        });
        return command;
    }
}
