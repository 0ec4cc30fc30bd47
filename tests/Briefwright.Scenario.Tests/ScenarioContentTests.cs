namespace Briefwright.Scenario.Tests;

/// <summary>
/// The scenario's content hash, on which a new edition starts: what the scenario says, apart from its date and edition
/// number, whatever the file looks like.
/// </summary>
public class ScenarioContentTests
{
    private static string Content(string text, params (string Path, string Text)[] more)
    {
        var r = MemoryReader.Load(text, more);
        Assert.True(r.Ok, string.Join("\n", r.Problems));
        return r.Document!.ContentHash;
    }

    private static readonly string Base = Content(MemoryReader.Valid);

    [Theory]
    [InlineData("date: 2026-11-30", "date: 2027-01-15")] // a new date
    [InlineData("date: 2026-11-30", "date: 2026-11-30\n  edition: 4")] // an edition number
    [InlineData("title: Test brief", "title: Test brief   # a comment")] // a comment
    [InlineData("depreciation: 3%", "depreciation:    3%")] // layout
    [InlineData("  saving_rate: 0.2\n  capital_share: 0.33", "  capital_share: 0.33\n  saving_rate: 0.2")] // key order
    public void Stays_the_same_when_only_the_date_edition_comments_layout_or_key_order_change(
        string find,
        string replace)
    {
        Assert.Equal(Base, Content(MemoryReader.With(find, replace)));
        Assert.NotEqual(
            MemoryReader.Load(MemoryReader.Valid).Document!.InputHash,
            MemoryReader.Load(MemoryReader.With(find, replace)).Document!.InputHash);
    }

    [Theory]
    [InlineData("saving_rate: 0.2", "saving_rate: 0.21")] // an assumption
    [InlineData("depreciation: 3%", "depreciation: { value: 3%, source: Invented office }")] // a source
    [InlineData("title: Test brief", "title: Another test brief")] // the title
    [InlineData("label: More", "label: Longer")] // an option's wording
    public void Changes_with_any_value(string find, string replace) =>
        Assert.NotEqual(Base, Content(MemoryReader.With(find, replace)));

    [Fact]
    public void A_scenario_split_with_extends_says_the_same_as_one_file()
    {
        var child = "extends: p.yaml\nbrief:\n  date: 2027-02-01\n";
        Assert.Equal(Base, Content(child, ("p.yaml", MemoryReader.Valid)));
    }

    [Fact]
    public void Knows_where_brief_edition_is_written()
    {
        var r = MemoryReader.Load(MemoryReader.With("date: 2026-11-30", "date: 2026-11-30\n  edition: 4"));
        Assert.Equal((6, 12), (r.Document!.EditionAt!.Value.Line, r.Document.EditionAt.Value.Column));
        Assert.Null(MemoryReader.Load(MemoryReader.Valid).Document!.EditionAt);
    }
}
