namespace Briefwright.Scenario.Tests;

internal sealed class MemoryReader(Dictionary<string, string> files) : ISourceReader
{
    public bool TryRead(string path, out string text, out string error)
    {
        error = "no such file";
        return files.TryGetValue(path, out text!);
    }

    /// <summary>A valid scenario (<see cref="ValidScenario"/>); tests replace one line to break one rule.</summary>
    public const string Valid = ValidScenario.Text;

    public static LoadResult Load(string text, params (string Path, string Text)[] more)
    {
        var files = new Dictionary<string, string> { ["s.yaml"] = text };
        foreach (var (p, t) in more) files[p] = t;
        return new ScenarioLoader(new MemoryReader(files)).Load("s.yaml");
    }

    public static string With(string find, string replace)
    {
        Assert.Contains(find, Valid);
        return Valid.Replace(find, replace);
    }
}
