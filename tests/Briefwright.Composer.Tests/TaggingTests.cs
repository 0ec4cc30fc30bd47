using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Composer.Layout;

namespace Briefwright.Composer.Tests;

/// <summary>
/// The structure a screen reader gets, checked on a recording surface: content that runs over a page stays one
/// element, and what is repeated for the eye (a table's header row) is in the structure once.
/// </summary>
public class TaggingTests
{
    private sealed class FixedMeasurer : ITextMeasurer
    {
        public double Width(string text, FontSpec font) => text.Length * 5.0;
        public double Ascent(FontSpec font) => font.Size * 0.8;
    }

    private static readonly Theme Theme = new() { PageHeight = 400, MarginTop = 50, MarginBottom = 50 };

    private static RecordingSurface Draw(params Block[] blocks)
    {
        var brief = new BriefDocument(
            new DocumentInfo("T", "Short", "A", "S", "K", "en-GB", new DateOnly(2026, 11, 30), "Edition 1", "Footer"),
            blocks);
        var measurer = new FixedMeasurer();
        var pages = DocumentComposer.Layout(brief, Theme, measurer);
        var surface = new RecordingSurface();
        DocumentComposer.Draw(brief, Theme, pages, surface, measurer);
        Assert.Equal(0, surface.OpenTags);
        return surface;
    }

    private static int Tags(RecordingSurface s, StructTag tag)
        => s.Ops.Count(o => o.Kind == "tag" && o.Text == tag.ToString());

    [Fact]
    public void A_table_over_two_pages_is_one_table_with_its_header_row_once()
    {
        var rows = Enumerable.Range(1, 40).Select(i => (IReadOnlyList<string>)new[] { $"row {i}", $"{i}.0" }).ToList();
        var s = Draw(
            new TableBlock(
                new[] { "Name", "Value" },
                rows,
                new[] { CellAlign.Left, CellAlign.Right },
                "Caption",
                null));
        Assert.True(s.PageCount >= 2);
        Assert.True(s.Ops.Count(o => o.Kind == "text" && o.Text == "Name") >= 2); // drawn on every page...
        Assert.Equal(1, Tags(s, StructTag.Table));
        Assert.Equal(2, Tags(s, StructTag.TH)); // ...but tagged once
        Assert.Equal(41, Tags(s, StructTag.TR));
    }

    [Fact]
    public void A_paragraph_over_a_page_break_is_one_paragraph()
    {
        var words = string.Join(" ", Enumerable.Range(0, 900).Select(i => $"w{i:000}"));
        var s = Draw(new ParagraphBlock(new[] { new TextRun(words) }));
        Assert.True(s.PageCount >= 2);
        Assert.Equal(1, Tags(s, StructTag.P));
    }

    [Fact]
    public void A_link_is_opened_before_its_text_so_the_text_is_inside_the_link()
    {
        var s = Draw(
            new ParagraphBlock(
                new[] { new TextRun("See "), new TextRun("the note", Link: "https://example.org/note") }));
        var ops = s.Ops.Select(o => (o.Kind, o.Text)).ToList();
        int link = ops.IndexOf(("link", "https://example.org/note"));
        Assert.True(link >= 0);
        Assert.Equal(("text", "the note"), ops[link + 1]);
    }

    [Theory]
    [InlineData("the note", "https://example.org/n", "the note (link to https://example.org/n)")]
    [InlineData("https://example.org/n", "https://example.org/n", "Link to https://example.org/n")]
    public void A_link_alternative_says_its_words_and_where_it_leads(string text, string url, string expected) =>
        Assert.Equal(expected, PdfSurface.LinkAlternative(text, url));
}
