using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Composer.Layout;

namespace Briefwright.Composer.Tests;

/// <summary>Layout checked on a recording surface: positions and pages, no PDF involved.</summary>
public class LayoutTests
{
    /// <summary>Every character 5 pt wide, ascent 80% of the size: layout arithmetic becomes exact.</summary>
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
        return surface;
    }

    private static ParagraphBlock Words(int count, char prefix = 'w') =>
        new(new[] { new TextRun(string.Join(" ", Enumerable.Range(0, count).Select(i => $"{prefix}{i:000}"))) });

    private static IEnumerable<RecordingSurface.Op> BodyText(RecordingSurface s) =>
        s.Ops.Where(o => o.Kind == "text" && o.Y > Theme.MarginTop && o.Y < Theme.PageHeight - Theme.MarginBottom);

    [Fact]
    public void A_table_split_across_pages_repeats_its_header_row()
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
        for (int page = 0; page < s.PageCount; page++)
        {
            var first = BodyText(s).Where(o => o.Page == page).OrderBy(o => o.Y).ThenBy(o => o.X).ToList();
            int at = page == 0 ? 2 : 0; // the caption comes first on page 1
            Assert.Equal("Name", first[at].Text);
        }
        Assert.Equal(40, BodyText(s).Count(o => o.Text.StartsWith("row ")));
    }

    [Fact]
    public void Numbers_in_a_right_aligned_column_end_at_the_same_x()
    {
        var rows = new[] { (IReadOnlyList<string>)new[] { "a", "1.5" }, new[] { "b", "12345.5" } };
        var s = Draw(
            new TableBlock(new[] { "Name", "Value" }, rows, new[] { CellAlign.Left, CellAlign.Right }, null, null));
        var ends = BodyText(s).Where(o => o.Text is "1.5" or "12345.5").Select(o => o.X + o.Text.Length * 5.0).ToList();
        Assert.Equal(ends[0], ends[1], 6);
    }

    [Fact]
    public void A_long_paragraph_breaks_at_the_page_end_and_continues_on_the_next_page()
    {
        var s = Draw(Words(600));
        Assert.True(s.PageCount >= 2);
        var lines = BodyText(s).ToList();
        double bottom = Theme.PageHeight - Theme.MarginBottom;
        Assert.All(lines, l => Assert.True(l.Y <= bottom));
        var page1Last = lines.Where(l => l.Page == 0).Max(l => l.Y);
        double lineHeight = Theme.BodySize * Theme.LineFactor;
        Assert.True(bottom - page1Last < 2 * lineHeight, "page 1 should be filled before breaking");
        string all = string.Join(" ", lines.OrderBy(l => l.Page).ThenBy(l => l.Y).Select(l => l.Text));
        Assert.Equal(string.Join(" ", Enumerable.Range(0, 600).Select(i => $"w{i:000}")), all);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void No_page_starts_or_ends_with_a_single_line_of_a_paragraph(int linesLeft)
    {
        // Given a first paragraph that leaves room for about `linesLeft` lines on page 1,
        // when a five-line paragraph follows, then neither page holds exactly one of its lines.
        double lh = Theme.BodySize * Theme.LineFactor;
        int firstLines = (int)Math.Floor((Theme.ContentHeight - Theme.ParagraphGap) / lh) - linesLeft;
        int wordsPerLine = (int)Math.Floor((Theme.ContentWidth + 5) / 25);
        var s = Draw(Words(firstLines * wordsPerLine), Words(wordsPerLine * 5, 'v'));
        var second = BodyText(s).Where(o => o.Text.StartsWith('v')).ToList();
        Assert.Equal(5, second.Count);
        int onFirstPage = second.Count(o => o.Page == 0);
        Assert.NotEqual(1, onFirstPage);
        Assert.NotEqual(4, onFirstPage);
    }

    [Fact]
    public void A_figure_that_does_not_fit_moves_to_the_next_page_with_its_caption()
    {
        var figure = new FigureBlock("chart", Array.Empty<byte>(), 1, 400, 200, "A chart", "Model", "Alt text");
        var s = Draw(Words(300), figure);
        var fig = Assert.Single(s.Ops, o => o.Kind == "figure");
        Assert.Equal(1, fig.Page);
        var caption = s.Ops.First(o => o.Kind == "text" && o.Text.StartsWith("Figure 1."));
        Assert.Equal(1, caption.Page);
        Assert.True(caption.Y < fig.Y);
        Assert.True(fig.Y + fig.Height <= Theme.PageHeight - Theme.MarginBottom);
    }

    [Fact]
    public void Headings_are_numbered_and_recorded_for_the_outline()
    {
        var s = Draw(
            new HeadingBlock(1, "Title"),
            new HeadingBlock(2, "First"),
            new HeadingBlock(3, "Sub"),
            new HeadingBlock(2, "Second"));
        var outline = s.Ops.Where(o => o.Kind == "outline").Select(o => o.Text).ToList();
        Assert.Equal(new[] { "Title", "1  First", "1.1  Sub", "2  Second" }, outline);
    }

    [Fact]
    public void Text_never_runs_past_the_right_margin()
    {
        var s = Draw(Words(200), new ParagraphBlock(new[] { new TextRun(new string('x', 300)) }));
        double right = Theme.PageWidth - Theme.MarginRight;
        Assert.All(BodyText(s), o => Assert.True(
            o.X + o.Text.Length * 5.0 <= right + 1e-6,
            $"'{o.Text}' ends at {o.X + o.Text.Length * 5.0}"));
    }

    [Fact]
    public void Every_page_has_page_x_of_y_in_its_footer()
    {
        var s = Draw(Words(900));
        for (int p = 0; p < s.PageCount; p++)
            Assert.Contains(s.Ops, o => o.Page == p && o.Text == $"Page {p + 1} of {s.PageCount}");
    }
    private static double Bottom => Theme.PageHeight - Theme.MarginBottom;

    /// <summary>The lowest point drawn in the content area of each page (text baselines and figure bottoms).</summary>
    private static double[] Filled(RecordingSurface s) => Enumerable.Range(0, s.PageCount).Select(p => s.Ops
        .Where(o => o.Page == p && o.Y > Theme.MarginTop && o.Y < Bottom + 1 && o.Kind is "text" or "figure")
        .Select(o => o.Kind == "figure" ? o.Y + o.Height : o.Y)
        .DefaultIfEmpty(Theme.MarginTop).Max() - Theme.MarginTop).ToArray();

    [Fact]
    public void A_figure_that_does_not_fit_waits_while_the_text_after_it_fills_the_page()
    {
        // Half a page of text, a figure taller than what is left, then more text.
        var figure = new FigureBlock("chart", Array.Empty<byte>(), 1, 400, 200, "A chart", "Model", "Alt text");
        var s = Draw(Words(150), figure, Words(300, 'v'));
        var fig = Assert.Single(s.Ops, o => o.Kind == "figure");
        Assert.Equal(1, fig.Page);
        Assert.Contains(BodyText(s), o => o.Page == 0 && o.Text.StartsWith('v'));
        // The caption and source stay with the chart, above and below it, on its page.
        var caption = s.Ops.Single(o => o.Kind == "text" && o.Text.StartsWith("Figure 1."));
        var source = s.Ops.Single(o => o.Kind == "text" && o.Text.StartsWith("Source:"));
        Assert.Equal(1, caption.Page);
        Assert.Equal(1, source.Page);
        Assert.True(caption.Y < fig.Y && source.Y > fig.Y + fig.Height);
        // The figure opens its page; no page but the last is more than a third empty.
        Assert.True(caption.Y - Theme.MarginTop < 20);
        var filled = Filled(s);
        for (int p = 0; p < s.PageCount - 1; p++)
            Assert.True(
                filled[p] > Theme.ContentHeight * 2 / 3,
                $"page {p + 1} is filled to {filled[p]:0} of {Theme.ContentHeight:0} pt");
    }

    [Fact]
    public void A_heading_at_the_foot_of_a_page_moves_to_the_next_page_with_its_paragraph()
    {
        double lh = Theme.BodySize * Theme.LineFactor;
        int wordsPerLine = (int)Math.Floor((Theme.ContentWidth + 5) / 25);
        // Leaves room for the heading and about one line, not for the heading and the two lines it keeps with.
        int firstLines = (int)Math.Floor(
            (Theme.ContentHeight - Theme.ParagraphGap - 16 - 13.5 * 1.25 - 3 - Theme.ParagraphGap - 1.2 * lh) / lh);
        var s = Draw(
            Words(firstLines * wordsPerLine),
            new HeadingBlock(2, "Next section"),
            Words(wordsPerLine * 6, 'v'));
        var heading = s.Ops.Single(o => o.Kind == "text" && o.Text.EndsWith("Next section"));
        var firstAfter = BodyText(s).First(o => o.Text.StartsWith('v'));
        Assert.Equal(1, heading.Page);
        Assert.Equal(heading.Page, firstAfter.Page);
        Assert.True(heading.Y < firstAfter.Y);
    }

    [Fact]
    public void A_paragraph_that_leads_into_an_equation_stays_on_its_page()
    {
        double lh = Theme.BodySize * Theme.LineFactor;
        int wordsPerLine = (int)Math.Floor((Theme.ContentWidth + 5) / 25);
        int most = (int)Math.Floor(Theme.ContentHeight / lh);
        // Every fill of the first page, so that one of them leaves room for the lead-in line but not the equation.
        for (int fill = 1; fill < most; fill++)
        {
            var s = Draw(
                Words(fill * wordsPerLine),
                new ParagraphBlock(new[] { new TextRun("Lead-in, the working years are:") }),
                new MathBlock(@"W^{*} = \frac{Q}{Z}"));
            var lead = s.Ops.Single(o => o.Kind == "text" && o.Text.StartsWith("Lead-in", StringComparison.Ordinal));
            var equation = s.Ops.First(o => o.Kind == "text" && o.Text.Contains('Q'));
            Assert.True(
                lead.Page == equation.Page,
                $"fill {fill}: the lead-in is on page {lead.Page + 1}, its equation on {equation.Page + 1}");
        }
    }

    [Fact]
    public void Short_cells_such_as_numbers_and_ranges_never_wrap()
    {
        string longText = string.Join(" ", Enumerable.Repeat("explanation", 30));
        var rows = new[] { (IReadOnlyList<string>)new[] { longText, "63 to 67", "+4.1% to +4.3%" } };
        var s = Draw(new TableBlock(
            new[] { "Assumption", "Range tested", "Change" },
            rows,
            new[] { CellAlign.Left, CellAlign.Right, CellAlign.Right },
            null,
            null));
        Assert.Contains(BodyText(s), o => o.Text == "63 to 67");
        Assert.Contains(BodyText(s), o => o.Text == "+4.1% to +4.3%");
        Assert.Contains(BodyText(s), o => o.Text == "Range tested");
    }

    [Fact]
    public void A_block_that_can_never_fit_on_a_page_is_an_error_that_names_it()
    {
        var rows = new[] {
            (IReadOnlyList<string>)new[] { "Overlong row " + string.Join(" ", Enumerable.Repeat("word", 3000)), "1" } };
        var e = Assert.Throws<ComposeException>(() => Draw(
            new TableBlock(new[] { "Name", "Value" }, rows, new[] { CellAlign.Left, CellAlign.Right }, null, null)));
        Assert.Contains("table row 'Overlong row", e.Message);
        Assert.Contains("cannot fit on a page", e.Message);
    }

    [Fact]
    public void Nothing_is_drawn_below_the_content_area()
    {
        var figure = new FigureBlock("chart", Array.Empty<byte>(), 1, 400, 200, "A chart", "Model", "Alt text");
        var rows = Enumerable.Range(1, 30).Select(i => (IReadOnlyList<string>)new[] { $"row {i}", $"{i}.0" }).ToList();
        var s = Draw(Words(100), figure, new HeadingBlock(2, "H"), Words(200), new TableBlock(
            new[] { "Name", "Value" },
            rows,
            new[] { CellAlign.Left, CellAlign.Right },
            "Caption",
            "Source"), figure, Words(50));
        Assert.All(s.Ops.Where(o => o.Kind == "figure"), f => Assert.True(f.Y + f.Height <= Bottom + 1e-6));
        // The footer's baseline is 30 pt below the content area; anything between is content drawn too low.
        Assert.All(
            s.Ops.Where(o => o.Kind == "text" && o.Y > Theme.MarginTop && o.Y < Bottom + 25),
            t => Assert.True(t.Y <= Bottom, $"'{t.Text}' at {t.Y}"));
        Assert.Equal(0, s.OpenTags);
    }
}
