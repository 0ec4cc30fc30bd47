using Briefwright.Scenario;

namespace Briefwright.Benchmarks;

internal static class Demo
{
    public static ScenarioDocument Load(string name)
    {
        string file = Path.Combine(TestSupport.RepositoryRoot.Path, "briefs-demo", name + ".yaml");
        var result = new ScenarioLoader(new Reader()).Load(file);
        return result.Document ?? throw new InvalidOperationException(string.Join("\n", result.Problems));
    }

    private sealed class Reader : ISourceReader
    {
        public bool TryRead(string path, out string text, out string error)
        {
            error = "no such file";
            text = File.Exists(path) ? File.ReadAllText(path) : "";
            return File.Exists(path);
        }
    }
}
