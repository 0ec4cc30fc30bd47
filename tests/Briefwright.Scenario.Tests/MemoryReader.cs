namespace Briefwright.Scenario.Tests;

internal sealed class MemoryReader(Dictionary<string, string> files) : ISourceReader
{
    public bool TryRead(string path, out string text, out string error)
    {
        error = "no such file";
        return files.TryGetValue(path, out text!);
    }

    /// <summary>A valid scenario; tests replace one line to break one rule.</summary>
    public const string Valid = """
        brief:
          id: test-brief
          title: Test brief
          organisation: Test Institute (invented)
          date: 2026-11-30
        demography:
          population_growth: 1%
          school_entry_age: 6
          retirement_age: 65
          survival:
            form: rectangular
            max_age: 80
        production:
          saving_rate: 0.2
          capital_share: 0.33
          depreciation: 3%
          technology_growth: 2%
        options:
          - id: base
            label: Base
            schooling_years: 11
          - id: more
            label: More
            schooling_years: 12
        """;

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
