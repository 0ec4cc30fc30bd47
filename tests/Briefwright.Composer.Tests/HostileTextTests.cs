using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;
using Briefwright.Composer.Markdown;

namespace Briefwright.Composer.Tests;

/// <summary>
/// Text no template or scenario can turn against the layout: words longer than the line are broken at the margin in
/// time linear in their length, links use only http, https or mailto, and escaped brackets are text, never a directive.
/// </summary>
public class HostileTextTests
{
    /// <summary>Every character 5 pt wide; counts the characters it is asked to measure.</summary>
    private sealed class CountingMeasurer : ITextMeasurer
    {
        public long Measured { get; private set; }
        public double Width(string text, FontSpec font)
        {
            Measured += text.Length;
            return text.Length * 5.0;
        }

        public double Ascent(FontSpec font) => font.Size * 0.8;
    }

    [Theory]
    [InlineData(2_000)]
    [InlineData(20_000)]
    [InlineData(100_000)]
    public void A_word_longer_than_the_line_is_broken_at_the_margin_with_linear_work(int length)
    {
        var measurer = new CountingMeasurer();
        var lines = LineBreaker.Break(new[] { new TextRun("a " + new string('w', length) + " b") }, 10, 100, measurer);
        // 100 pt lines hold 20 characters: "a" alone, then full lines of the word, then its rest with " b".
        Assert.Equal("a", lines[0].Spans[0].Text);
        Assert.All(lines.Skip(1).SkipLast(1), l => Assert.Equal(new string('w', 20), Assert.Single(l.Spans).Text));
        Assert.Equal(length, lines.Skip(1).Sum(l => l.Spans.Sum(s => s.Text.Count(c => c == 'w'))));
        Assert.All(lines, l => Assert.True(l.Width <= 100 + 1e-6));
        // Each character is measured a bounded number of times (once alone, once in its piece, once in its word).
        Assert.True(
            measurer.Measured < 4L * length + 100,
            $"{measurer.Measured} characters measured for a word of {length}");
    }

    [Fact]
    public void Surrogate_pairs_are_never_split()
    {
        string word = string.Concat(Enumerable.Repeat("😀", 30));
        var lines = LineBreaker.Break(new[] { new TextRun(word) }, 10, 50, new CountingMeasurer());
        Assert.All(lines.SelectMany(l => l.Spans), s => Assert.False(char.IsHighSurrogate(s.Text[^1])));
        Assert.Equal(word, string.Concat(lines.SelectMany(l => l.Spans).Select(s => s.Text)));
    }

    [Theory]
    [InlineData("[memo](file:///etc/passwd)", "file:///etc/passwd")]
    [InlineData("[x](javascript:alert(1))", "javascript:alert(1)")]
    [InlineData("[x](notes.html)", "notes.html")]
    [InlineData("<file:///etc/passwd>", "file:///etc/passwd")]
    public void A_link_with_another_scheme_is_refused(string markdown, string url)
    {
        var ex = Assert.Throws<ComposeException>(
            () => MarkdownReader.Read("# T\n\n" + markdown + "\n", new Dictionary<string, FigureBlock>()));
        Assert.Contains($"links in a brief must start with http:, https: or mailto:. Got '{url}'.", ex.Message);
        Assert.Equal(3, ex.Line);
    }

    [Fact]
    public void Http_https_and_mailto_links_are_kept()
    {
        var blocks = MarkdownReader.Read(
            "[a](https://example.org) [b](http://example.org) [c](mailto:x@example.org) <https://example.org/d>\n",
            new Dictionary<string, FigureBlock>());
        var links = ((ParagraphBlock)Assert.Single(blocks)).Runs.Where(r => r.Link is not null).Select(r => r.Link)
            .ToList();
        Assert.Equal(
            new[] { "https://example.org", "http://example.org", "mailto:x@example.org", "https://example.org/d" },
            links);
    }

    [Fact]
    public void Escaped_brackets_are_text_and_a_written_directive_still_works()
    {
        var blocks = MarkdownReader.Read(
            "\\[\\[pagebreak\\]\\]\n\n\\[\\[figure: nope\\]\\]\n\n[[pagebreak]]\n",
            new Dictionary<string, FigureBlock>());
        Assert.Equal("[[pagebreak]]", string.Concat(((ParagraphBlock)blocks[0]).Runs.Select(r => r.Text)));
        Assert.Equal("[[figure: nope]]", string.Concat(((ParagraphBlock)blocks[1]).Runs.Select(r => r.Text)));
        Assert.IsType<PageBreakBlock>(blocks[2]);
    }
}
