using Briefwright.Scenario;

namespace Briefwright.Cli.Commands;

/// <summary>Expands the paths given on the command line into scenario files and loads them, printing every problem.</summary>
public static class ScenarioInputs
{
    /// <summary>The PATHS argument shared by check, solve and build.</summary>
    public static System.CommandLine.Argument<string[]> PathsArgument(string verb) => new("paths")
    {
        Description = $"Scenario files, or folders whose *.yaml files are all {verb}.",
        Arity = System.CommandLine.ArgumentArity.OneOrMore,
    };

    /// <summary>Files as given; folders expand to their *.yaml and *.yml files (not recursive, themes named *.theme.yaml
    /// left out), sorted by name.</summary>
    public static IReadOnlyList<string> Expand(IEnumerable<string> paths, TextWriter error)
    {
        var files = new List<string>();
        foreach (var p in paths)
        {
            if (Directory.Exists(p))
            {
                var found = Directory.EnumerateFiles(p)
                    .Where(f => (f.EndsWith(".yaml", StringComparison.Ordinal) || f.EndsWith(".yml", StringComparison.Ordinal))
                             && !f.EndsWith(".theme.yaml", StringComparison.Ordinal))
                    .Order(StringComparer.Ordinal).ToList();
                if (found.Count == 0) error.WriteLine($"{p}: folder holds no scenario files (*.yaml, *.yml).");
                files.AddRange(found);
            }
            else files.Add(p);
        }
        return files;
    }

    public static LoadResult Load(string path, TextWriter error)
    {
        var result = new ScenarioLoader(new FileSourceReader()).Load(path);
        foreach (var d in result.Problems) error.WriteLine(result.Sources.Render(d));
        if (result.Problems.Count > 0)
            error.WriteLine($"{path}: {result.Problems.Count} problem{(result.Problems.Count == 1 ? "" : "s")}; nothing written.");
        return result;
    }
}
