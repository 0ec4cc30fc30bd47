using System.Text.RegularExpressions;
using Markdig;
using Markdig.Extensions.Tables;
using Markdig.Syntax;
using Markdig.Syntax.Inlines;

using Block = Briefwright.Composer.Document.Block;
using BoxBlock = Briefwright.Composer.Document.BoxBlock;
using CellAlign = Briefwright.Composer.Document.CellAlign;
using FigureBlock = Briefwright.Composer.Document.FigureBlock;
using PageBreakBlock = Briefwright.Composer.Document.PageBreakBlock;
using RunStyle = Briefwright.Composer.Document.RunStyle;
using TableBlock = Briefwright.Composer.Document.TableBlock;
using TextRun = Briefwright.Composer.Document.TextRun;

namespace Briefwright.Composer.Markdown;

/// <summary>
/// Turns the filled template (CommonMark with pipe tables) into blocks. Directives on a line of their own:
/// <c>[[figure: id]]</c> places a chart, <c>[[table: caption | source]]</c> captions the next table,
/// <c>[[pagebreak]]</c> starts a new page. A block quote becomes a shaded box whose first bold line is its title.
/// A paragraph written <c>$$ … $$</c> is a display equation in the math notation (<see cref="Layout.MathNotation"/>).
/// </summary>
public static partial class MarkdownReader
{
    private static readonly MarkdownPipeline Pipeline = new MarkdownPipelineBuilder().UsePipeTables().Build();

    [GeneratedRegex(@"^\[\[(\w+)(?::\s*(.*?))?\]\]$")]
    private static partial Regex Directive();

    public static IReadOnlyList<Block> Read(string markdown, IReadOnlyDictionary<string, FigureBlock> figures)
    {
        var doc = Markdig.Markdown.Parse(markdown, Pipeline);
        var blocks = new List<Block>();
        (string Caption, string? Source)? pendingCaption = null;
        foreach (var node in doc) Convert(markdown, node, blocks, figures, ref pendingCaption);
        return blocks;
    }

    /// <summary>
    /// Schemes a link in a brief may use; anything else (file:, javascript:, a relative path) is refused.
    /// </summary>
    public static readonly string[] LinkSchemes = { "http", "https", "mailto" };

    private static string CheckedLink(string? url, int line)
    {
        string u = (url ?? "").Trim();
        int colon = u.IndexOf(':', StringComparison.Ordinal);
        string scheme = colon > 0 ? u[..colon] : "";
        if (LinkSchemes.Contains(scheme, StringComparer.OrdinalIgnoreCase)) return u;
        throw new ComposeException(
            $"links in a brief must start with http:, https: or mailto:. Got '{(u.Length > 60 ? u[..60] + "…" : u)}'.",
            line,
            u.Length > 0 ? u : null);
    }

    private static void Convert(
        string markdown,
        Markdig.Syntax.Block node,
        List<Block> blocks,
        IReadOnlyDictionary<string, FigureBlock> figures,
        ref (string Caption, string? Source)? caption)
    {
        switch (node)
        {
            case HeadingBlock h:
                blocks.Add(new Document.HeadingBlock(h.Level, PlainText(h.Inline)));
                break;
            case ParagraphBlock p:
                Paragraph(markdown, p, blocks, figures, ref caption);
                break;
            case ListBlock l:
                var items = l.OfType<ListItemBlock>().Select(item => (IReadOnlyList<TextRun>)item
                    .OfType<ParagraphBlock>()
                    .SelectMany(
                        (para, i) => i == 0 ? Runs(para.Inline) : Runs(para.Inline).Prepend(new TextRun(" ")))
                    .ToList()).ToList();
                blocks.Add(new Document.ListBlock(items, l.IsOrdered));
                break;
            case Table t:
                blocks.Add(Table(t, caption));
                caption = null;
                break;
            case QuoteBlock q:
                blocks.Add(Quote(markdown, q, figures));
                break;
            case ThematicBreakBlock:
                break;
            default:
                throw new ComposeException("the brief's text holds a " +
                    $"{node.GetType().Name.Replace("Block", " block").ToLowerInvariant()}, which briefs do not " +
                    "support; use paragraphs, lists, tables, headings or a quote.", node.Line + 1);
        }
    }

    /// <summary>A paragraph: a display equation ($$ … $$), a directive written [[...]] in the template, or
    /// text.</summary>
    private static void Paragraph(
        string markdown,
        ParagraphBlock p,
        List<Block> blocks,
        IReadOnlyDictionary<string, FigureBlock> figures,
        ref (string Caption, string? Source)? caption)
    {
        var runs = Runs(p.Inline);
        string plain = string.Concat(runs.Select(r => r.Text)).Trim();
        // A directive is written as [[...]] in the template itself; escaped brackets (\[\[, as text from a
        // scenario is written) read back as the same characters but are text, never a directive.
        bool written = p.Span.Start >= 0 && p.Span.End < markdown.Length
            && markdown.AsSpan(p.Span.Start, p.Span.Length).TrimStart()
                .StartsWith("[[", StringComparison.Ordinal);
        // A display equation: a paragraph written $$ … $$ in the template, read from its source text so that
        // Markdown never touches its backslashes, underscores and stars.
        string raw = p.Span.Start >= 0 && p.Span.End < markdown.Length
            ? markdown.Substring(p.Span.Start, p.Span.Length).Trim()
            : "";
        if (raw.Length >= 4 && raw.StartsWith("$$", StringComparison.Ordinal)
            && raw.EndsWith("$$", StringComparison.Ordinal))
        {
            blocks.Add(new Document.MathBlock(raw[2..^2].Replace('\n', ' ').Trim(), p.Line + 1));
            return;
        }
        var m = Directive().Match(written ? plain : "");
        if (m.Success)
        {
            Apply(m.Groups[1].Value, m.Groups[2].Value, plain, p.Line + 1, blocks, figures, ref caption);
            return;
        }
        blocks.Add(new Document.ParagraphBlock(runs));
    }

    /// <summary>A quote: a box, titled by its first paragraph when that is all bold.</summary>
    private static BoxBlock Quote(string markdown, QuoteBlock q, IReadOnlyDictionary<string, FigureBlock> figures)
    {
        var inner = new List<Block>();
        (string, string?)? none = null;
        foreach (var child in q) Convert(markdown, child, inner, figures, ref none);
        string? title = null;
        if (inner.FirstOrDefault() is Document.ParagraphBlock first
            && first.Runs.All(r => r.Style == RunStyle.Bold))
        {
            title = string.Concat(first.Runs.Select(r => r.Text));
            inner.RemoveAt(0);
        }
        return new BoxBlock(title, inner);
    }

    private static void Apply(
        string name,
        string argument,
        string text,
        int line,
        List<Block> blocks,
        IReadOnlyDictionary<string, FigureBlock> figures,
        ref (string Caption, string? Source)? caption)
    {
        switch (name)
        {
            case "figure":
                if (!figures.TryGetValue(argument.Trim(), out var figure))
                    throw new ComposeException(
                        $"unknown figure '{argument.Trim()}'. Known figures: " +
                        $"{string.Join(", ", figures.Keys.Order())}.",
                        line,
                        text);
                blocks.Add(figure);
                break;
            case "table":
                var parts = argument.Split('|', 2);
                caption = (parts[0].Trim(), parts.Length > 1 ? parts[1].Trim() : null);
                break;
            case "pagebreak":
                blocks.Add(new PageBreakBlock());
                break;
            default:
                throw new ComposeException($"unknown directive [[{name}]]; known: [[figure: id]], [[table: caption | " +
                    $"source]], [[pagebreak]]. Got {text}.", line, text);
        }
    }

    private static TableBlock Table(Table t, (string Caption, string? Source)? caption)
    {
        var rows = t.OfType<TableRow>().ToList();
        IReadOnlyList<string> Cells(TableRow r) => r.OfType<TableCell>()
            .Select(c => string.Join(" ", c.OfType<ParagraphBlock>().Select(p => PlainText(p.Inline)))).ToList();
        var header = Cells(rows[0]);
        var align = t.ColumnDefinitions.Take(header.Count).Select(d => d.Alignment switch
        {
            TableColumnAlign.Right => CellAlign.Right,
            TableColumnAlign.Center => CellAlign.Center,
            _ => CellAlign.Left,
        }).ToList();
        while (align.Count < header.Count) align.Add(CellAlign.Left);
        var body = rows.Skip(1).Select(r =>
        {
            var cells = Cells(r).ToList();
            while (cells.Count < header.Count) cells.Add("");
            return (IReadOnlyList<string>)cells.Take(header.Count).ToList();
        }).ToList();
        return new TableBlock(header, body, align, caption?.Caption, caption?.Source);
    }

    private static string PlainText(ContainerInline? inline) => string.Concat(Runs(inline).Select(r => r.Text));

    private static List<TextRun> Runs(
        ContainerInline? container,
        RunStyle style = RunStyle.Regular,
        string? link = null)
    {
        var runs = new List<TextRun>();
        if (container is null) return runs;
        foreach (var inline in container)
        {
            switch (inline)
            {
                case LiteralInline lit:
                    runs.Add(new TextRun(lit.Content.ToString(), style, link));
                    break;
                case EmphasisInline em:
                    var next = (style, em.DelimiterCount >= 2) switch
                    {
                        (RunStyle.Italic, true) or (RunStyle.Bold, false) or (RunStyle.BoldItalic, _)
                            => RunStyle.BoldItalic,
                        (_, true) => RunStyle.Bold,
                        _ => RunStyle.Italic,
                    };
                    runs.AddRange(Runs(em, next, link));
                    break;
                case LinkInline l when !l.IsImage:
                    runs.AddRange(Runs(l, style, CheckedLink(l.Url, l.Line + 1)));
                    break;
                case AutolinkInline a:
                    runs.Add(new TextRun(a.Url, style, CheckedLink(a.IsEmail ? "mailto:" + a.Url : a.Url, a.Line + 1)));
                    break;
                case CodeInline code:
                    runs.Add(new TextRun(code.Content, style, link));
                    break;
                case LineBreakInline:
                    runs.Add(new TextRun(" ", style, link));
                    break;
                case HtmlEntityInline entity:
                    runs.Add(new TextRun(entity.Transcoded.ToString(), style, link));
                    break;
                case ContainerInline c:
                    runs.AddRange(Runs(c, style, link));
                    break;
            }
        }
        return runs;
    }
}
