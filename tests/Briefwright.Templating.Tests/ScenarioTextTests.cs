using Markdig;
using Markdig.Syntax;
using Markdig.Syntax.Inlines;

namespace Briefwright.Templating.Tests;

/// <summary>
/// Text from a scenario is text: once escaped it must parse (CommonMark, as Markdig reads it) as one paragraph of
/// literal text equal to the input, wherever the template puts it, including at the start of a line or in a heading.
/// </summary>
public class ScenarioTextTests
{
    public static TheoryData<string> Hostile() => new()
    {
        "[memo](file:///etc/passwd)", "# Fake", "[[pagebreak]]", "<div>", "[[figure: nope]]", "- item", "1. item",
        "2) item",
        "> quote", "---", "===", "**bold** _it_ `code`", "![img](x.png)", "<https://example.org>", "&copy; &#169;",
        "a | b",
        "line one\nline two", "back\\slash", "    indented", "~~~", "```", "+ plus", "* star", "\\[[pagebreak]]",
    };

    private static string ReadBack(string markdown, out Block block)
    {
        var doc = Markdown.Parse(markdown, new MarkdownPipelineBuilder().UsePipeTables().Build());
        block = Assert.Single(doc);
        var inline = block is LeafBlock leaf ? leaf.Inline : null;
        return string.Concat(inline!.Descendants<LiteralInline>().Select(l => l.Content.ToString()));
    }

    [Theory]
    [MemberData(nameof(Hostile))]
    public void Escaped_text_reads_back_as_the_same_characters_in_a_paragraph(string text)
    {
        string escaped = Md.Escape(text);
        Assert.Equal(text.Replace('\n', ' ').TrimStart(), ReadBack(escaped, out var block));
        Assert.IsType<ParagraphBlock>(block);
        Assert.Equal(text.Replace('\n', ' ').TrimStart(), ReadBack("Before " + escaped, out _)[7..]);
    }

    [Theory]
    [MemberData(nameof(Hostile))]
    public void Escaped_text_in_a_heading_stays_the_heading_text(string text)
    {
        Assert.Equal(text.Replace('\n', ' ').TrimStart(), ReadBack("# " + Md.Escape(text), out var block));
        Assert.IsType<HeadingBlock>(block);
    }

    [Fact]
    public void Missing_text_stays_missing_for_the_template()
    {
        Assert.Null(Md.Text(null));
        Assert.Equal("\\# x", Md.Text("# x"));
    }
}
