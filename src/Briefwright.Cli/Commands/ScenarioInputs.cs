using System.CommandLine;
using Briefwright.Brief;
using Briefwright.Scenario;
using Briefwright.Scenario.Diagnostics;

namespace Briefwright.Cli.Commands;

/// <summary>Expands the paths given on the command line into scenario files and loads them, printing every problem.</summary>
public static class ScenarioInputs
{
    /// <summary>Problems printed for one file before the rest are only counted.</summary>
    public const int MaxPrinted = 100;

    /// <summary>The PATHS argument shared by check, solve and build.</summary>
    public static Argument<string[]> PathsArgument(string verb) => new("paths")
    {
        Description = $"Scenario files, or folders whose *.yaml files are all {verb}.",
        Arity = ArgumentArity.OneOrMore,
    };

    /// <summary>The --root option shared by the commands that read scenarios.</summary>
    public static Option<string?> RootOption() => new("--root")
    {
        Description = "Project folder: every file a scenario or theme names (extends, life tables, logo, fonts) must lie inside it. " +
                      "Default: the folder of each scenario (and of the theme) given on the command line.",
    };

    /// <summary>Files as given; folders expand to their *.yaml and *.yml files (not recursive, themes named *.theme.yaml
    /// left out), sorted by name. A folder without scenario files is reported and sets <paramref name="invalid"/>.</summary>
    public static IReadOnlyList<string> Expand(IEnumerable<string> paths, TextWriter error, out bool invalid)
    {
        invalid = false;
        var files = new List<string>();
        foreach (var p in paths)
        {
            if (Directory.Exists(p))
            {
                var found = Directory.EnumerateFiles(p)
                    .Where(f => (f.EndsWith(".yaml", StringComparison.Ordinal) || f.EndsWith(".yml", StringComparison.Ordinal))
                             && !f.EndsWith(".theme.yaml", StringComparison.Ordinal))
                    .Order(StringComparer.Ordinal).ToList();
                if (found.Count == 0)
                {
                    error.WriteLine($"{p}: the folder holds no scenario files (*.yaml, *.yml); nothing to do for it.");
                    invalid = true;
                }
                files.AddRange(found);
            }
            else files.Add(p);
        }
        return files;
    }

    /// <summary><see cref="Expand(IEnumerable{string}, TextWriter, out bool)"/> for commands that stop when there is nothing to do.</summary>
    public static IReadOnlyList<string> Expand(IEnumerable<string> paths, TextWriter error) => Expand(paths, error, out _);

    /// <summary>Checks the --root folder; null (after printing why) when it is not a folder.</summary>
    public static bool RootIsValid(string? root, TextWriter error)
    {
        if (root is null || Directory.Exists(root)) return true;
        error.WriteLine($"--root: must be an existing folder. Got '{Binding(root)}'.");
        return false;
    }

    public static LoadResult Load(string path, TextWriter error, string? root = null)
    {
        var result = new ScenarioLoader(new FileSourceReader(), root).Load(path);
        Print(result.Problems, result.Sources, error);
        if (result.Problems.Count > 0)
            error.WriteLine($"{path}: {result.Problems.Count} problem{(result.Problems.Count == 1 ? "" : "s")}; nothing written.");
        return result;
    }

    /// <summary>The first <see cref="MaxPrinted"/> problems with their lines and carets, then how many more there are.</summary>
    public static void Print(IReadOnlyList<Diagnostic> problems, SourceSet sources, TextWriter error)
    {
        foreach (var d in problems.Take(MaxPrinted)) error.WriteLine(sources.Render(d));
        if (problems.Count > MaxPrinted)
            error.WriteLine($"… and {(problems.Count - MaxPrinted).ToString("N0", System.Globalization.CultureInfo.InvariantCulture)} more problem{(problems.Count - MaxPrinted == 1 ? "" : "s")} not shown (fix these first).");
    }

    /// <summary>Solves a loaded scenario; null (after printing the reason, with the scenario's name) when the model cannot.</summary>
    public static SolvedScenario? Solve(string path, ScenarioDocument scenario, TextWriter error)
    {
        try
        {
            return ScenarioSolver.Solve(scenario);
        }
        catch (UnsolvableScenarioException ex)
        {
            error.WriteLine(Unsolvable(path, ex));
            return null;
        }
    }

    public static string Unsolvable(string path, UnsolvableScenarioException ex) =>
        $"{path}: the model cannot solve this scenario: {ex.Message.TrimEnd('.')}. Change the inputs named in the reason; nothing written.";

    private static string Binding(string s) => Scenario.Binding.BindContext.Printable(s);
}
