using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;

namespace Briefwright.Brief.Formats;

/// <summary>
/// The brief as one self-contained web page: no external requests (charts are inline SVG, the logo a data URI, the
/// styles in the page), the outline as landmarks (header, navigation, main, one region per numbered section, footer)
/// and headings, tables with header cells and scopes, charts with their title and alternative text, the document's
/// language, the theme's colours, and print styles. Headings, tables and figures are numbered as in the PDF.
/// </summary>
public sealed partial class HtmlWriter : IBriefWriter
{
    public string Suffix => "html";

    public byte[] Write(BriefContent content) => new UTF8Encoding(false).GetBytes(Render(content));

    public static string Render(BriefContent content)
    {
        var doc = content.Document;
        var charts = content.Charts.ToDictionary(c => c.Id, StringComparer.Ordinal);
        var sb = new StringBuilder(256 * 1024);
        Head(sb, content);
        Masthead(sb, content);
        var headings = Numbered(doc);
        Contents(sb, headings, content.Language);
        sb.Append("<main id=\"main\">\n");
        Body(sb, doc, headings, new State(charts, content.Theme));
        sb.Append("</main>\n");
        Footer(sb, content);
        return sb.ToString();
    }

    /// <summary>The page's head (language, title, metadata, styles) and the link that skips to the text.</summary>
    private static void Head(StringBuilder sb, BriefContent content)
    {
        // A text of the brief's language (templates/languages/*.texts), by key.
        string T(string key) => content.Language.Format(key);
        var doc = content.Document;
        var info = doc.Info;
        var theme = content.Theme;
        sb.Append("<!DOCTYPE html>\n<html lang=\"").Append(Attr(info.Language))
          .Append("\">\n<head>\n<meta charset=\"utf-8\">\n")
          .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
          .Append("<title>").Append(Text(info.Title)).Append("</title>\n")
          .Append("<meta name=\"author\" content=\"").Append(Attr(info.Author)).Append("\">\n")
          .Append("<meta name=\"description\" content=\"").Append(Attr(info.Subject)).Append("\">\n")
          .Append("<meta name=\"keywords\" content=\"").Append(Attr(info.Keywords)).Append("\">\n")
          .Append("<meta name=\"generator\" content=\"briefwright ").Append(Attr(ToolInfo.Version)).Append("\">\n")
          .Append("<style>\n").Append(Styles(theme, doc.FontFamily, doc.Paper)).Append("</style>\n</head>\n<body>\n")
          .Append("<a class=\"skip\" href=\"#main\">").Append(Text(T("output.skip"))).Append("</a>\n");
    }

    /// <summary>Banner: organisation, logo, date and edition, and the draft marker.</summary>
    private static void Masthead(StringBuilder sb, BriefContent content)
    {
        var info = content.Document.Info;
        sb.Append("<header class=\"masthead\">\n");
        if (info.Logo is { } logo)
            sb.Append("<img class=\"logo\" src=\"data:image/png;base64,").Append(Convert.ToBase64String(logo.Png))
              .Append("\" width=\"").Append(Math.Min(logo.Width, 160)).Append("\" alt=\"")
              .Append(Attr(content.OrganisationName)).Append("\">\n");
        sb.Append("<p class=\"org\">").Append(Text(content.OrganisationName)).Append("</p>\n")
          .Append("<p class=\"stamp\">")
          .Append(Text(info.DateText ?? info.Date.ToString("d MMMM yyyy", CultureInfo.InvariantCulture)))
          .Append(" · ").Append(Text(info.Edition)).Append("</p>\n");
        if (info.Marker is { } marker) sb.Append("<p class=\"marker\">").Append(Text(marker)).Append("</p>\n");
        sb.Append("</header>\n");
    }

    /// <summary>Numbering as in the PDF: sections 1, 1.1; tables and figures in order. Each heading's level, number,
    /// text and anchor.</summary>
    private static List<(int Level, string Number, string Text, string Id)> Numbered(BriefDocument doc)
    {
        var headings = new List<(int Level, string Number, string Text, string Id)>();
        int section = 0, subsection = 0;
        foreach (var h in doc.Blocks.OfType<HeadingBlock>())
        {
            string number = "";
            if (h.Level == 2) { section++; subsection = 0; number = $"{section}"; }
            else if (h.Level == 3) { subsection++; number = $"{section}.{subsection}"; }
            headings.Add((h.Level, number, h.Text,
                h.Level == 1 ? "title" : h.Level > 3 ? $"h-{headings.Count}" : "s-" + number.Replace('.', '-')));
        }
        return headings;
    }

    /// <summary>The table of contents: the numbered sections, linked.</summary>
    private static void Contents(StringBuilder sb, List<(int Level, string Number, string Text, string Id)> headings,
        Briefwright.Templating.BriefLanguage language)
    {
        string T(string key) => language.Format(key);
        var sections = headings.Where(h => h.Level == 2).ToList();
        if (sections.Count > 0)
        {
            sb.Append("<nav aria-label=\"").Append(Attr(T("output.contents"))).Append("\">\n<p class=\"toc-title\">")
                .Append(Text(T("output.contents"))).Append("</p>\n<ol>\n");
            foreach (var h in sections)
                sb.Append("<li><a href=\"#").Append(h.Id).Append("\">").Append(Text(h.Text)).Append("</a></li>\n");
            sb.Append("</ol>\n</nav>\n");
        }
    }

    /// <summary>The blocks, with each numbered heading opening a section (closed by the next heading of its level or
    /// above).</summary>
    private static void Body(StringBuilder sb, BriefDocument doc,
        List<(int Level, string Number, string Text, string Id)> headings, State state)
    {
        int open = 0; // sections open: 0, 1 (level 2) or 2 (level 3)
        int heading = 0;
        foreach (var block in doc.Blocks)
        {
            if (block is HeadingBlock h)
            {
                var (level, number, text, id) = headings[heading++];
                if (level > 3) // unnumbered, as in the PDF: a heading inside the current section
                {
                    sb.Append("<h4 id=\"").Append(id).Append("\">").Append(Text(text)).Append("</h4>\n");
                    continue;
                }
                int depth = level switch { 1 => 0, 2 => 1, _ => 2 };
                while (open >= Math.Max(depth, 1)) { sb.Append("</section>\n"); open--; }
                if (depth == 0)
                {
                    sb.Append("<h1 id=\"").Append(id).Append("\">").Append(Text(text)).Append("</h1>\n");
                    continue;
                }
                while (open < depth - 1) { sb.Append("<section>\n"); open++; }
                sb.Append("<section aria-labelledby=\"").Append(id).Append("\">\n");
                open++;
                sb.Append("<h").Append(level >= 3 ? 3 : 2).Append(" id=\"").Append(id).Append("\"><span class=\"num\">")
                    .Append(number).Append("</span> ").Append(Text(text)).Append("</h").Append(level >= 3 ? 3 : 2)
                    .Append(">\n");
                continue;
            }
            Block(sb, block, state);
        }
        while (open-- > 0) sb.Append("</section>\n");
    }

    /// <summary>The footer: note, cautions, and the scenario, edition, input hash and tool version.</summary>
    private static void Footer(StringBuilder sb, BriefContent content)
    {
        // A text of the brief's language (templates/languages/*.texts), by key.
        string T(string key) => content.Language.Format(key);
        var info = content.Document.Info;
        sb.Append("<footer>\n<p>").Append(Text(info.FooterNote)).Append("</p>\n")
          .Append("<p>").Append(Text(T("output.cautions"))).Append("</p>\n")
          .Append("<p class=\"stamp\">").Append(Text(T("output.scenario"))).Append(' ')
          .Append(Text(content.Solved.Scenario.Brief.Id)).Append(" · ").Append(Text(info.Edition))
          .Append(" · ").Append(Text(T("output.input_hash"))).Append(" <code>")
          .Append(Text(content.Solved.Scenario.InputHash)).Append("</code> · briefwright ")
          .Append(Text(ToolInfo.Version)).Append("</p>\n")
          .Append("</footer>\n</body>\n</html>\n");
    }


    private sealed class State(IReadOnlyDictionary<string, Charts.RenderedChart> charts, Composer.Layout.Theme theme)
    {
        public IReadOnlyDictionary<string, Charts.RenderedChart> Charts { get; } = charts;
        /// <summary>The brief's labels for tables, figures and sources, in its language (as in the PDF).</summary>
        public Composer.Layout.Theme Theme { get; } = theme;
        public int Tables;
        public int Figures;
        public int Boxes;
    }

    private static void Block(StringBuilder sb, Block block, State state)
    {
        switch (block)
        {
            case ParagraphBlock p:
                string cls = p.Role switch
                {
                    ParagraphRole.Subtitle => " class=\"subtitle\"", ParagraphRole.Meta => " class=\"meta\"",
                    ParagraphRole.Note => " class=\"note\"", _ => "",
                };
                sb.Append("<p").Append(cls).Append('>');
                Runs(sb, p.Runs);
                sb.Append("</p>\n");
                break;
            case ListBlock l:
                sb.Append(l.Ordered ? "<ol>\n" : "<ul>\n");
                foreach (var item in l.Items)
                {
                    sb.Append("<li>");
                    Runs(sb, item);
                    sb.Append("</li>\n");
                }
                sb.Append(l.Ordered ? "</ol>\n" : "</ul>\n");
                break;
            case TableBlock t:
                Table(sb, t, ++state.Tables, state.Theme);
                break;
            case FigureBlock f:
                Figure(sb, f, ++state.Figures, state.Charts.GetValueOrDefault(f.Id), state.Theme);
                break;
            case BoxBlock b:
                string boxId = $"box-{++state.Boxes}";
                sb.Append("<section class=\"box\"").Append(b.Title is null ? "" : $" aria-labelledby=\"{boxId}\"")
                    .Append(">\n");
                if (b.Title is not null)
                    sb.Append("<h2 class=\"box-title\" id=\"").Append(boxId).Append("\">")
                        .Append(Text(b.Title)).Append("</h2>\n");
                foreach (var inner in b.Content) Block(sb, inner, state);
                sb.Append("</section>\n");
                break;
            case PageBreakBlock:
                sb.Append("<div class=\"page-break\"></div>\n");
                break;
            case HeadingBlock h: // a heading inside a box: not part of the outline
                sb.Append("<p class=\"box-heading\"><strong>").Append(Text(h.Text)).Append("</strong></p>\n");
                break;
        }
    }

    private static void Table(StringBuilder sb, TableBlock t, int number, Composer.Layout.Theme theme)
    {
        string id = $"table-{number}";
        sb.Append("<div class=\"table-wrap\" role=\"region\" tabindex=\"0\" aria-labelledby=\"").Append(id)
            .Append("-caption\">\n<table id=\"").Append(id).Append("\">\n");
        sb.Append("<caption id=\"").Append(id).Append("-caption\"><span class=\"label\">")
            .Append(Text(Label(theme.TableLabel, number))).Append("</span> ").Append(Text(t.Caption ?? ""))
            .Append("</caption>\n");
        sb.Append("<thead>\n<tr>");
        for (int c = 0; c < t.Header.Count; c++)
            sb.Append("<th scope=\"col\"").Append(AlignClass(t, c)).Append('>').Append(Text(t.Header[c]))
                .Append("</th>");
        sb.Append("</tr>\n</thead>\n<tbody>\n");
        foreach (var row in t.Rows)
        {
            sb.Append("<tr>");
            for (int c = 0; c < row.Count; c++)
            {
                // The first column names the row (an option, an assumption): a row header.
                string tag = c == 0 ? "th scope=\"row\"" : "td";
                sb.Append('<').Append(tag).Append(AlignClass(t, c)).Append('>').Append(Text(row[c])).Append("</")
                    .Append(c == 0 ? "th" : "td").Append('>');
            }
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n</div>\n");
        if (t.Source is not null)
            sb.Append("<p class=\"source\"><em>").Append(Text(theme.SourceLabel.TrimEnd()))
                .Append("</em> ").Append(Text(t.Source)).Append("</p>\n");
    }

    private static string AlignClass(TableBlock t, int c) => c < t.Align.Count ? t.Align[c] switch
    {
        CellAlign.Right => " class=\"r\"",
        CellAlign.Center => " class=\"c\"",
        _ => "",
    } : "";

    private static string Label(string label, int number)
        => label.Replace("{0}", number.ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal);

    private static void Figure(StringBuilder sb, FigureBlock f, int number, Charts.RenderedChart? chart,
        Composer.Layout.Theme theme)
    {
        string id = "fig-" + f.Id;
        sb.Append("<figure id=\"").Append(Attr(id)).Append("\">\n<figcaption><span class=\"label\">")
            .Append(Text(Label(theme.FigureLabel, number))).Append("</span> ").Append(Text(f.Caption))
            .Append("</figcaption>\n");
        if (chart?.Svg is { } svg)
            sb.Append(InlineSvg(svg, id, $"{Label(theme.FigureLabel, number)} {f.Caption}", f.AltText)).Append('\n');
        else
            sb.Append("<p role=\"img\" aria-label=\"").Append(Attr(f.AltText)).Append("\">").Append(Text(f.AltText))
                .Append("</p>\n");
        if (f.Source is not null)
            sb.Append("<p class=\"source\"><em>").Append(Text(theme.SourceLabel.TrimEnd()))
                .Append("</em> ").Append(Text(f.Source)).Append("</p>\n");
        sb.Append("</figure>\n");
    }

    /// <summary>
    /// A chart's SVG made fit to sit in the page: no XML declaration, its ids prefixed with the figure's (several
    /// charts share one page), a view box so it scales, and its title and description as the image's accessible name.
    /// </summary>
    public static string InlineSvg(string svg, string id, string title, string description)
    {
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        svg = svg[start..].TrimEnd();
        svg = SvgId().Replace(svg, m => $"{id}-{m.Value}");
        int close = svg.IndexOf('>', StringComparison.Ordinal);
        string open = svg[..close];
        var w = SizeAttr().Match(open);
        string width = w.Success ? w.Groups[1].Value : "470", height = w.Success ? w.Groups[2].Value : "290";
        open = SizeAttr().Replace(open, "");
        var head = new StringBuilder(open)
            .Append($" viewBox=\"0 0 {width} {height}\" width=\"{width}\" height=\"{height}\" role=\"img\" " +
                $"aria-labelledby=\"{id}-title {id}-desc\">")
            .Append("<title id=\"").Append(id).Append("-title\">").Append(Text(title)).Append("</title>")
            .Append("<desc id=\"").Append(id).Append("-desc\">").Append(Text(description)).Append("</desc>");
        return head + svg[(close + 1)..];
    }

    [GeneratedRegex(@"\b(?:cl|img)_[0-9]+\b")]
    private static partial Regex SvgId();

    [GeneratedRegex(@"\s+width=""([0-9.]+)""\s+height=""([0-9.]+)""")]
    private static partial Regex SizeAttr();

    private static void Runs(StringBuilder sb, IReadOnlyList<TextRun> runs)
    {
        foreach (var r in runs)
        {
            if (r.Link is not null) sb.Append("<a href=\"").Append(Attr(r.Link)).Append("\">");
            string text = Text(r.Text);
            sb.Append(r.Style switch
            {
                RunStyle.Bold => $"<strong>{text}</strong>",
                RunStyle.Italic => $"<em>{text}</em>",
                RunStyle.BoldItalic => $"<strong><em>{text}</em></strong>",
                _ => text,
            });
            if (r.Link is not null) sb.Append("</a>");
        }
    }

    public static string Text(string s)
    {
        if (s.AsSpan().IndexOfAny("&<>") < 0) return s;
        return s.Replace("&", "&amp;", StringComparison.Ordinal).Replace("<", "&lt;", StringComparison.Ordinal)
            .Replace(">", "&gt;", StringComparison.Ordinal);
    }

    private static string Attr(string s) => Text(s).Replace("\"", "&quot;", StringComparison.Ordinal);
}
