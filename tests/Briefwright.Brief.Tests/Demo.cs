using Briefwright.Scenario;

namespace Briefwright.Brief.Tests;

/// <summary>Loads the invented demo scenarios from the repository and builds each brief once per test run.</summary>
internal static class Demo
{
    public static string Root => RepositoryRoot.Path;

    private static readonly Dictionary<string, BuiltBrief> Built = new();
    private static readonly object Gate = new();

    public static ScenarioDocument Load(string name)
    {
        var result = new ScenarioLoader(new DiskReader()).Load(Path.Combine(Root, "briefs-demo", name + ".yaml"));
        Assert.True(result.Ok, string.Join("\n", result.Problems));
        return result.Document!;
    }

    public static BuiltBrief Build(string name)
    {
        lock (Gate)
        {
            if (!Built.TryGetValue(name, out var brief))
                Built[name] = brief = BriefBuilder.Build(Load(name), StandardTemplate.Template);
            return brief;
        }
    }

    internal sealed class DiskReader : ISourceReader
    {
        public bool TryRead(string path, out string text, out string error)
        {
            error = "no such file";
            text = File.Exists(path) ? File.ReadAllText(path) : "";
            return File.Exists(path);
        }
    }
}
