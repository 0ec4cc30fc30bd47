using Briefwright.Scenario;

namespace Briefwright.Benchmarks;

internal static class Demo
{
    public static ScenarioDocument Load(string name)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "ReportBuilder.sln"))) dir = dir.Parent;
        var result = new ScenarioLoader(new Reader()).Load(Path.Combine(dir!.FullName, "briefs-demo", name + ".yaml"));
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
