namespace Briefwright.Brief.Tests;

/// <summary>
/// Golden text of the standard template filled for the demo scenario. A change to the template, the model or
/// the demo shows up here as a diff; regenerate with BRIEFWRIGHT_UPDATE_SNAPSHOTS=1 after checking it.
/// </summary>
public class TemplateSnapshotTests
{
    [Theory]
    [InlineData("auroria-national")]
    [InlineData("auroria-silverdale")]
    public void Filled_template_matches_the_snapshot(string name)
    {
        string actual = Demo.Build(name).Markdown;
        string path = Path.Combine(Demo.Root, "tests", "Briefwright.Brief.Tests", "Snapshots", name + ".filled.md");
        if (Environment.GetEnvironmentVariable("BRIEFWRIGHT_UPDATE_SNAPSHOTS") == "1") File.WriteAllText(path, actual);
        Assert.True(File.Exists(path), $"Snapshot {path} is missing; run once with BRIEFWRIGHT_UPDATE_SNAPSHOTS=1.");
        Assert.Equal(File.ReadAllText(path), actual);
    }
}
