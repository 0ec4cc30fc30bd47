using System.CommandLine;
using Briefwright.Brief;
using Briefwright.Cli.Project;
using Briefwright.Scenario;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Cli.Commands;

/// <summary>
/// Expands the paths given on the command line into scenario files and loads them, printing every problem.
/// </summary>
public static class ScenarioInputs
{
    /// <summary>The name a scenario read from standard input (the path <c>-</c>) goes by in messages.</summary>
    public const string StdinName = "<stdin>";

    /// <summary>Problems printed for one file before the rest are only counted.</summary>
    public const int MaxPrinted = 100;

    /// <summary>The PATHS argument shared by check, solve and build.</summary>
    public static Argument<string[]> PathsArgument(string verb, bool stdin = true) => new("paths")
    {
        Description = $"Scenario files, or folders whose *.yaml files are all {verb}." + (stdin ? " '-' reads one " +
            "scenario from standard input." : ""),
        Arity = ArgumentArity.OneOrMore,
    };

    /// <summary>The --root option shared by the commands that read scenarios.</summary>
    public static Option<string?> RootOption() => new("--root")
    {
        Description = "Project folder: every file a scenario or theme names (extends, life tables, logo, fonts) must " +
            "lie inside it. " +
                      "Default: the folder of each scenario (and of the theme) given on the command line.",
    };

    /// <summary>
    /// Whether a file in a folder is a scenario: *.yaml or *.yml, except themes (*.theme.yaml) and the project settings
    /// file.
    /// </summary>
    public static bool IsScenarioFile(string path)
    {
        string name = Path.GetFileName(path);
        return (name.EndsWith(".yaml", StringComparison.Ordinal) || name.EndsWith(".yml", StringComparison.Ordinal))
               && !name.EndsWith(".theme.yaml", StringComparison.Ordinal) && name != ProjectSettings.FileName;
    }

    /// <summary>Files as given (and <c>-</c> for standard input); folders expand to their scenario files (not
    /// recursive), sorted by name. A folder without scenario files is reported and sets
    /// <paramref name="invalid"/>.</summary>
    public static IReadOnlyList<string> Expand(IEnumerable<string> paths, TextWriter error, out bool invalid)
    {
        invalid = false;
        var files = new List<string>();
        foreach (var p in paths)
        {
            if (p != "-" && Directory.Exists(p))
            {
                var found = Directory.EnumerateFiles(p).Where(IsScenarioFile).Order(StringComparer.Ordinal).ToList();
                if (found.Count == 0)
                {
                    error.WriteLine($"{p}: the folder holds no scenario files (*.yaml, *.yml); nothing to do for it.");
                    invalid = true;
                }
                files.AddRange(found);
            }
            else files.Add(p == "-" ? StdinName : p);
        }
        return files;
    }

    /// <summary>
    /// <see cref="Expand(IEnumerable{string}, TextWriter, out bool)"/> for commands that stop when there is nothing to
    /// do.
    /// </summary>
    public static IReadOnlyList<string> Expand(IEnumerable<string> paths, TextWriter error) =>
        Expand(paths, error, out _);

    /// <summary>Checks the --root folder; false (after printing why) when it is not a folder.</summary>
    public static bool RootIsValid(string? root, TextWriter error)
    {
        if (root is null || Directory.Exists(root)) return true;
        error.WriteLine($"--root: must be an existing folder. Got '{Binding(root)}'.");
        return false;
    }

    public static LoadResult Load(string path, TextWriter error, ISourceReader? reader = null, string? root = null)
    {
        var result = new ScenarioLoader(reader ?? new FileSourceReader(), root).Load(path);
        Report(path, result, error);
        return result;
    }

    /// <summary>Prints the problems of a loaded scenario with their lines and carets (the first
    /// <see cref="MaxPrinted"/>), then how many there were.</summary>
    public static void Report(string path, LoadResult result, TextWriter error)
    {
        Print(result.Problems, result.Sources, error);
        if (result.Problems.Count > 0)
            error.WriteLine($"{path}: {result.Problems.Count} problem{(result.Problems.Count == 1 ? "" : "s")}; " +
                "nothing written.");
    }

    /// <summary>
    /// Two scenarios of one batch with the same <c>brief.id</c> would write the same files and take turns making new
    /// editions of each other. Returns, for each such file, the positioned problem: at its own <c>brief.id</c>, or at
    /// its <c>extends</c> when the id is inherited.
    /// </summary>
    public static IReadOnlyDictionary<string, Diagnostic> DuplicateIds(
        IReadOnlyList<(string File, LoadResult Loaded)> batch,
        ISourceReader reader)
    {
        var found = new Dictionary<string, Diagnostic>(StringComparer.Ordinal);
        foreach (var group in batch.Where(b => b.Loaded.Ok)
            .GroupBy(b => b.Loaded.Document!.Brief.Id, StringComparer.Ordinal)
            .Where(g => g.Count() > 1))
        {
            var members = group.Select(g => g.File).ToList();
            foreach (var file in members)
            {
                string others = string.Join(", ", members.Where(m => m != file).Select(m => $"'{m}'"));
                var (at, inherited) = IdPosition(file, reader);
                string rule = inherited
                    ? "must be unique within the batch; this scenario keeps the id of the scenario it extends, " +
                        $"which {others} also use{(members.Count > 2 ? "" : "s")}: give it its own brief.id"
                    : $"must be unique within the batch; {others} also use{(members.Count > 2 ? "" : "s")} it, and " +
                        "their briefs would overwrite each other";
                found[file] = new Diagnostic(at, "brief.id", rule, $"'{group.Key}'");
            }
        }
        return found;
    }

    /// <summary>
    /// Where a scenario file sets its id: its own <c>brief.id</c>, else its <c>extends</c> (inherited), else line 1.
    /// </summary>
    private static (SourceSpan At, bool Inherited) IdPosition(string file, ISourceReader reader)
    {
        if (reader.TryRead(file, out string text, out _) && YamlTreeReader.Read(file, text).Root is YMapping map)
        {
            if (map["brief"] is YMapping brief && brief.KeyNode("id") is { } id && brief["id"] is { } value)
                return (value.At, false);
            if (map.KeyNode("extends") is { } ext) return (map["extends"]?.At ?? ext.At, true);
        }
        return (new SourceSpan(file, 1, 1), false);
    }

    /// <summary>
    /// The first <see cref="MaxPrinted"/> problems with their lines and carets, then how many more there are.
    /// </summary>
    public static void Print(IReadOnlyList<Diagnostic> problems, SourceSet sources, TextWriter error)
    {
        foreach (var d in problems.Take(MaxPrinted)) error.WriteLine(sources.Render(d));
        if (problems.Count > MaxPrinted)
            error.WriteLine($"… and {Numbers.Count(problems.Count - MaxPrinted)} more " +
                $"problem{(problems.Count - MaxPrinted == 1 ? "" : "s")} not shown (fix these first).");
    }

    /// <summary>
    /// Solves a loaded scenario; null (after printing the reason, with the scenario's name) when the model cannot.
    /// </summary>
    public static SolvedScenario? Solve(string path, ScenarioDocument scenario, TextWriter error)
    {
        try
        {
            return ScenarioSolver.Solve(scenario);
        }
        catch (UnsolvableScenarioException ex)
        {
            foreach (var line in StageErrors.Describe(ex, path).Lines) error.WriteLine(line);
            return null;
        }
    }

    private static string Binding(string s) => Scenario.Binding.BindContext.Printable(s);
}

/// <summary>
/// Reads <see cref="ScenarioInputs.StdinName"/> from standard input (once) and everything else from disk.
/// </summary>
public sealed class InputReader(TextReader stdin) : ISourceReader
{
    private readonly FileSourceReader files = new();
    private string? stdinText;

    // Files named inside a scenario are always read from disk under the confinement rules, never from standard input.
    public bool TryReadInside(string path, string root, out string text, out string error) =>
        files.TryReadInside(path, root, out text, out error);

    public bool TryReadBytes(string path, string root, long maxBytes, out byte[] bytes, out string error) =>
        files.TryReadBytes(path, root, maxBytes, out bytes, out error);

    public bool TryRead(string path, out string text, out string error)
    {
        if (path != ScenarioInputs.StdinName) return files.TryRead(path, out text, out error);
        lock (files)
        {
            if (stdinText is null)
            {
                var buffer = new char[(int)FileSourceReader.MaxBytes + 1];
                int total = 0, read;
                while (total < buffer.Length && (read = stdin.Read(buffer, total, buffer.Length - total)) > 0)
                    total += read;
                if (total > FileSourceReader.MaxBytes)
                {
                    text = "";
                    error = $"standard input is over the {FileSourceReader.MaxBytes / 1024} KiB limit";
                    return false;
                }
                stdinText = new string(buffer, 0, total);
            }
        }
        text = stdinText;
        error = "";
        return true;
    }
}
