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
        paths.Description += " Themes (*.theme.yaml) and the project settings file " +
            "(" + ProjectSettings.FileName + ") are checked as what they are; a folder's are checked too.";
        var root = ScenarioInputs.RootOption();
        var command = new Command("check",
            "Validate scenario files, themes and project settings and report every problem at once, as " +
            "file:line:col: field: rule. Got value. Scenarios of one check that share a brief.id are reported too.")
        {
            paths, root,
        };
        command.SetAction(parse => Execute(io, parse.GetValue(paths)!, parse.GetValue(root)));
        return command;
    }

    /// <summary>Checks the scenarios, then the themes and project settings, among <paramref name="given"/>.</summary>
    private static int Execute(CliIo io, string[] given, string? rootDir)
    {
        var error = io.Err;
        if (!ScenarioInputs.RootIsValid(rootDir, error)) return ExitCodes.InvalidInput;
        // Themes and settings: named directly, or found in a named folder.
        var others = given.Where(p => p != "-" && !Directory.Exists(p) && !ScenarioInputs.IsScenarioFile(p)
                                      && (p.EndsWith(".yaml") || p.EndsWith(".yml")))
            .Concat(given.Where(p => p != "-" && Directory.Exists(p)).SelectMany(d => Directory.EnumerateFiles(d)
                .Where(f => f.EndsWith(".theme.yaml", StringComparison.Ordinal)
                            || Path.GetFileName(f) == ProjectSettings.FileName)
                .Order(StringComparer.Ordinal)))
            .ToList();
        var scenarios = ScenarioInputs.Expand(given.Where(p => !others.Contains(p)), error, out bool invalid);
        bool scenariosOk = CheckScenarios(io, scenarios, rootDir);
        bool othersOk = others.Aggregate(true, (ok, file) => CheckOther(io, file, rootDir) && ok);
        return invalid || !scenariosOk || !othersOk ? ExitCodes.InvalidInput : ExitCodes.Ok;
    }

    /// <summary>Prints each scenario's problems (and brief.ids it shares with another), or ok; true when all are
    /// ok.</summary>
    private static bool CheckScenarios(CliIo io, IReadOnlyList<string> scenarios, string? rootDir)
    {
        var (output, error) = (io.Out, io.Err);
        var reader = new InputReader(io.In);
        bool allOk = true;
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
                allOk = false;
            }
            else
            {
                var document = result.Document!;
                output.WriteLine($"{file}: ok ({document.Brief.Id}, {document.Inputs.Options.Count} options)");
            }
        }
        return allOk;
    }

    /// <summary>Prints the problems of a theme or project settings file, or ok; true when it is valid.</summary>
    private static bool CheckOther(CliIo io, string file, string? rootDir)
    {
        var (output, error) = (io.Out, io.Err);
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
        else error.WriteLine($"{file}: not valid.");
        return ok;
    }
}
