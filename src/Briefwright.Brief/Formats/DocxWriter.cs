using System.Globalization;
using System.Text;
using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;

namespace Briefwright.Brief.Formats;

/// <summary>
/// The brief as an editable document for clearance rounds: the title and numbered sections as real heading styles (so
/// a word processor's navigation lists them), tables as tables with a repeated header row, charts as PNG images with
/// their alternative text, captions in the caption style with sequence numbers, and the theme's font and colours as
/// the document's styles (WordprocessingML, ECMA-376 Part 1). Same content, same bytes: relationship ids are fixed,
/// dates are the brief's (see <see cref="OfficePackage"/>).
/// </summary>
public sealed class DocxWriter : IBriefWriter
{
    public string Suffix => "docx";

    private const long EmuPerPoint = 12700;
    private const string W = "http://schemas.openxmlformats.org/wordprocessingml/2006/main";

    private const string Rel = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/";
    private const string Doc = "/word/document.xml";


    public byte[] Write(BriefContent content)
    {
        // A text of the brief's language (templates/languages/*.texts), by key.
        string T(string key) => content.Language.Format(key);
        var doc = content.Document;
        var theme = content.Theme;
        var package = new OfficePackage(doc.Info.Date);
        package.Relate("/", "rId1", Rel + "officeDocument", Doc);
        var builder = new Builder(package, content);
        var body = new StringBuilder(256 * 1024);
        if (doc.Info.Marker is { } marker) body.Append(Para("Marker", Run(marker)));
        foreach (var block in doc.Blocks) builder.Add(body, block);
        body.Append(Para("Note", Run($"{T("output.scenario")} {content.Solved.Scenario.Brief.Id} · " +
            $"{doc.Info.Edition} · {T("output.input_hash")} {content.Solved.Scenario.InputHash} · briefwright " +
            $"{ToolInfo.Version}")));
        bool letter = doc.Paper == PaperSize.Letter;
        body.Append("<w:sectPr><w:footerReference w:type=\"default\" r:id=\"rIdFooter\"/>")
            .Append($"<w:pgSz w:w=\"{(letter ? 12240 : 11906)}\" w:h=\"{(letter ? 15840 : 16838)}\"/>")
            .Append($"<w:pgMar w:top=\"{Twips(theme.MarginTop)}\" w:right=\"{Twips(theme.MarginRight)}\" " +
                $"w:bottom=\"{Twips(theme.MarginBottom)}\" w:left=\"{Twips(theme.MarginLeft)}\" w:header=\"567\" " +
                "w:footer=\"567\" w:gutter=\"0\"/>")
            .Append("</w:sectPr>");
        // The main part first, then the parts it refers to, in a fixed order.
        package.AddXml(Doc, "application/vnd.openxmlformats-officedocument.wordprocessingml.document.main+xml",
            $"<w:document xmlns:w=\"{W}\" xmlns:r=\"{OfficePackage.RelationshipsNs}\" " +
            "xmlns:wp=\"http://schemas.openxmlformats.org/drawingml/2006/wordprocessingDrawing\" " +
            "xmlns:a=\"http://schemas.openxmlformats.org/drawingml/2006/main\" " +
            "xmlns:pic=\"http://schemas.openxmlformats.org/drawingml/2006/picture\">" +
            $"<w:body>{body}</w:body></w:document>");
        package.Relate(Doc, "rIdStyles", Rel + "styles", "/word/styles.xml");
        package.AddXml("/word/styles.xml", "application/vnd.openxmlformats-officedocument.wordprocessingml.styles+xml",
            Styles(theme, doc.FontFamily ?? "Liberation Sans", doc.Info.Language));
        package.Relate(Doc, "rIdNumbering", Rel + "numbering", "/word/numbering.xml");
        package.AddXml("/word/numbering.xml",
            "application/vnd.openxmlformats-officedocument.wordprocessingml.numbering+xml", builder.Numbering());
        package.Relate(Doc, "rIdFooter", Rel + "footer", "/word/footer1.xml");
        package.AddXml("/word/footer1.xml", "application/vnd.openxmlformats-officedocument.wordprocessingml.footer+xml",
            $"<w:ftr xmlns:w=\"{W}\">" + Para("Footer", Run(doc.Info.FooterNote + " · " + T("output.page") + " ")
                + "<w:fldSimple w:instr=\" PAGE \">" + Run("1") + "</w:fldSimple>") + "</w:ftr>");
        builder.AddImages();
        package.CoreProperties(doc.Info.Title, doc.Info.Author);
        return package.ToBytes();
    }

    private static int Twips(double points) => (int)Math.Round(points * 20);

    private static string X(string text) => OfficePackage.Escape(text);

    /// <summary>A run of text, with bold or italic properties when given.</summary>
    private static string Run(string text, bool bold = false, bool italic = false, string? style = null)
    {
        string props = (style is null ? "" : $"<w:rStyle w:val=\"{style}\"/>") + (bold ? "<w:b/>" : "")
            + (italic ? "<w:i/>" : "");
        return "<w:r>" + (props.Length > 0 ? $"<w:rPr>{props}</w:rPr>" : "")
            + $"<w:t xml:space=\"preserve\">{X(text)}</w:t></w:r>";
    }

    private static string Para(string style, string runs, string extraProps = "") =>
        $"<w:p><w:pPr><w:pStyle w:val=\"{style}\"/>{extraProps}</w:pPr>{runs}</w:p>";

    private sealed class Builder(OfficePackage package, BriefContent content)
    {
        private readonly Dictionary<string, Charts.RenderedChart> charts = content.Charts
            .ToDictionary(c => c.Id, StringComparer.Ordinal);
        private readonly Dictionary<string, string> links = new(StringComparer.Ordinal);
        private readonly List<int> orderedLists = [];
        private readonly List<(string Name, byte[] Png)> pictures = [];
        private int section, subsection, tables, figures, images;

        public void Add(StringBuilder sb, Block block)
        {
            switch (block)
            {
                case HeadingBlock h:
                    string number = "";
                    if (h.Level == 2) { section++; subsection = 0; number = $"{section}  "; }
                    else if (h.Level == 3) { subsection++; number = $"{section}.{subsection}  "; }
                    string style = h.Level switch { 1 => "Heading1", 2 => "Heading2", _ => "Heading3" };
                    sb.Append(Para(style, Run(number + h.Text)));
                    break;
                case ParagraphBlock p:
                    string role = p.Role switch
                    {
                        ParagraphRole.Note or ParagraphRole.Meta => "Note", ParagraphRole.Subtitle => "Subtitle",
                        _ => "Normal",
                    };
                    sb.Append(Para(role, Runs(p.Runs)));
                    break;
                case ListBlock l:
                    int num = 1;
                    if (l.Ordered) { orderedLists.Add(orderedLists.Count + 2); num = orderedLists[^1]; }
                    foreach (var item in l.Items)
                        sb.Append(Para("ListParagraph", Runs(item),
                            $"<w:numPr><w:ilvl w:val=\"0\"/><w:numId w:val=\"{num}\"/></w:numPr>"));
                    break;
                case TableBlock t:
                    Table(sb, t);
                    break;
                case FigureBlock f:
                    Figure(sb, f);
                    break;
                case BoxBlock b:
                    Box(sb, b);
                    break;
                case PageBreakBlock:
                    sb.Append("<w:p><w:r><w:br w:type=\"page\"/></w:r></w:p>");
                    break;
            }
        }

        private string Runs(IReadOnlyList<TextRun> runs)
        {
            var sb = new StringBuilder();
            foreach (var r in runs)
            {
                bool bold = r.Style is RunStyle.Bold or RunStyle.BoldItalic,
                    italic = r.Style is RunStyle.Italic or RunStyle.BoldItalic;
                if (r.Link is { } link && Uri.TryCreate(link, UriKind.Absolute, out var uri))
                {
                    if (!links.TryGetValue(link, out var id))
                    {
                        id = $"rIdLink{links.Count + 1}";
                        package.Relate(Doc, id, Rel + "hyperlink", uri.AbsoluteUri, external: true);
                        links[link] = id;
                    }
                    sb.Append($"<w:hyperlink r:id=\"{id}\">").Append(Run(r.Text, bold, italic, "Hyperlink"))
                        .Append("</w:hyperlink>");
                }
                else sb.Append(Run(r.Text, bold, italic));
            }
            return sb.ToString();
        }

        /// <summary>"Table 3. caption" with the number as a sequence field, so a word processor renumbers it.</summary>
        /// <remarks>The words around the number are the brief's label (<paramref name="label"/>, "Figure {0}." in
        /// English).</remarks>
        private static string Caption(string kind, string label, int number, string caption)
        {
            int at = label.IndexOf("{0}", StringComparison.Ordinal);
            string before = at < 0 ? label + " " : label[..at], after = at < 0 ? "" : label[(at + 3)..];
            return Para("Caption",
                Run(before) + $"<w:fldSimple w:instr=\" SEQ {kind} \\* ARABIC \">"
                    + Run(number.ToString(CultureInfo.InvariantCulture)) + "</w:fldSimple>"
                    + Run(after + " " + caption),
                "<w:keepNext/>");
        }

        private string Source(string source)
            => Para("Note", Run(content.Theme.SourceLabel, italic: true) + Run(source));

        private void Table(StringBuilder sb, TableBlock t)
        {
            tables++;
            if (t.Caption is not null) sb.Append(Caption("Table", content.Theme.TableLabel, tables, t.Caption));
            sb.Append("<w:tbl><w:tblPr><w:tblStyle w:val=\"BriefTable\"/><w:tblW w:w=\"5000\" w:type=\"pct\"/>")
              .Append("<w:tblLook w:firstRow=\"1\" w:lastRow=\"0\" w:firstColumn=\"1\" w:lastColumn=\"0\" " +
                  "w:noHBand=\"0\" w:noVBand=\"1\"/>")
              .Append($"<w:tblCaption w:val=\"{X(t.Caption ?? $"Table {tables}")}\"/></w:tblPr><w:tblGrid>");
            for (int c = 0; c < t.Header.Count; c++) sb.Append("<w:gridCol/>");
            sb.Append("</w:tblGrid>");
            Row(sb, t, t.Header, header: true);
            foreach (var row in t.Rows) Row(sb, t, row, header: false);
            sb.Append("</w:tbl>");
            if (t.Source is not null) sb.Append(Source(t.Source));
        }

        private static void Row(StringBuilder sb, TableBlock t, IReadOnlyList<string> cells, bool header)
        {
            sb.Append("<w:tr>");
            if (header) sb.Append("<w:trPr><w:cantSplit/><w:tblHeader/></w:trPr>");
            for (int c = 0; c < cells.Count; c++)
            {
                var align = c < t.Align.Count ? t.Align[c] : CellAlign.Left;
                string jc = align switch
                {
                    CellAlign.Right => "<w:jc w:val=\"right\"/>",
                    CellAlign.Center => "<w:jc w:val=\"center\"/>",
                    _ => "",
                };
                sb.Append("<w:tc>").Append(Para("TableText", Run(cells[c], bold: header), jc)).Append("</w:tc>");
            }
            sb.Append("</w:tr>");
        }

        private void Figure(StringBuilder sb, FigureBlock f)
        {
            figures++;
            sb.Append(Caption("Figure", content.Theme.FigureLabel, figures, f.Caption));
            if (charts.GetValueOrDefault(f.Id)?.Png is { } png)
            {
                images++;
                string rid = $"rIdImage{images}";
                string name = $"/word/media/image{images}.png";
                package.Relate(Doc, rid, Rel + "image", name);
                pictures.Add((name, png));
                long cx = (long)(f.WidthPt * EmuPerPoint), cy = (long)(f.HeightPt * EmuPerPoint);
                string alt = X(f.AltText);
                sb.Append(Para("Figure",
                    "<w:r><w:drawing><wp:inline distT=\"0\" distB=\"0\" distL=\"0\" distR=\"0\">" +
                    $"<wp:extent cx=\"{cx}\" cy=\"{cy}\"/><wp:effectExtent l=\"0\" t=\"0\" r=\"0\" b=\"0\"/>" +
                    $"<wp:docPr id=\"{images}\" name=\"Figure {figures}\" descr=\"{alt}\" title=\"{X(f.Caption)}\"/>" +
                    "<wp:cNvGraphicFramePr><a:graphicFrameLocks noChangeAspect=\"1\"/></wp:cNvGraphicFramePr>" +
                    "<a:graphic><a:graphicData " +
                    "uri=\"http://schemas.openxmlformats.org/drawingml/2006/picture\"><pic:pic>" +
                    $"<pic:nvPicPr><pic:cNvPr id=\"{images}\" name=\"{X($"fig-{f.Id}.png")}\" " +
                    $"descr=\"{alt}\"/><pic:cNvPicPr/></pic:nvPicPr>" +
                    $"<pic:blipFill><a:blip r:embed=\"{rid}\"/><a:stretch><a:fillRect/></a:stretch></pic:blipFill>" +
                    $"<pic:spPr><a:xfrm><a:off x=\"0\" y=\"0\"/><a:ext cx=\"{cx}\" cy=\"{cy}\"/></a:xfrm><a:prstGeom " +
                    "prst=\"rect\"><a:avLst/></a:prstGeom></pic:spPr>" +
                    "</pic:pic></a:graphicData></a:graphic></wp:inline></w:drawing></w:r>",
                    "<w:keepNext/>"));
            }
            else sb.Append(Para("Note", Run(f.AltText)));
            if (f.Source is not null) sb.Append(Source(f.Source));
        }

        /// <summary>A shaded box (key findings): a one-cell table shaded in the theme's box colour.</summary>
        private void Box(StringBuilder sb, BoxBlock b)
        {
            var cell = new StringBuilder();
            if (b.Title is not null) cell.Append(Para("BoxTitle", Run(b.Title)));
            foreach (var inner in b.Content) Add(cell, inner);
            string inside = cell.ToString();
            // A table cell must end with a paragraph.
            if (inside.Length == 0 || inside.EndsWith("</w:tbl>", StringComparison.Ordinal)) inside += "<w:p/>";
            sb.Append("<w:tbl><w:tblPr><w:tblW w:w=\"5000\" w:type=\"pct\"/>")
              .Append("<w:tblBorders><w:left w:val=\"single\" w:sz=\"24\" w:space=\"0\" " +
                  $"w:color=\"{Hex(content.Theme.Accent)}\"/></w:tblBorders>")
              .Append("<w:tblLayout w:type=\"fixed\"/><w:tblCaption " +
                  $"w:val=\"{X(b.Title ?? "Box")}\"/></w:tblPr><w:tblGrid><w:gridCol/></w:tblGrid>")
              .Append("<w:tr><w:trPr><w:cantSplit/></w:trPr><w:tc><w:tcPr><w:shd w:val=\"clear\" w:color=\"auto\" " +
                  $"w:fill=\"{Hex(content.Theme.BoxFill)}\"/></w:tcPr>")
              .Append(inside).Append("</w:tc></w:tr></w:tbl>")
              .Append("<w:p><w:pPr><w:pStyle w:val=\"Normal\"/></w:pPr></w:p>");
        }

        /// <summary>The charts' PNG files, after the parts that refer to them.</summary>
        public void AddImages()
        {
            foreach (var (name, png) in pictures) package.Add(name, "image/png", png);
        }

        /// <summary>Bullets (number 1) and one numbering per ordered list, each starting at 1.</summary>
        public string Numbering()
        {
            var sb = new StringBuilder($"<w:numbering xmlns:w=\"{W}\">");
            sb.Append("<w:abstractNum w:abstractNumId=\"1\"><w:lvl w:ilvl=\"0\"><w:numFmt " +
                "w:val=\"bullet\"/><w:lvlText w:val=\"•\"/>")
              .Append("<w:pPr><w:ind w:left=\"360\" w:hanging=\"240\"/></w:pPr></w:lvl></w:abstractNum>")
              .Append("<w:abstractNum w:abstractNumId=\"2\"><w:lvl w:ilvl=\"0\"><w:start w:val=\"1\"/><w:numFmt " +
                  "w:val=\"decimal\"/><w:lvlText w:val=\"%1.\"/>")
              .Append("<w:pPr><w:ind w:left=\"360\" w:hanging=\"300\"/></w:pPr></w:lvl></w:abstractNum>")
              .Append("<w:num w:numId=\"1\"><w:abstractNumId w:val=\"1\"/></w:num>");
            foreach (int id in orderedLists)
                sb.Append($"<w:num w:numId=\"{id}\"><w:abstractNumId w:val=\"2\"/><w:lvlOverride " +
                    "w:ilvl=\"0\"><w:startOverride w:val=\"1\"/></w:lvlOverride></w:num>");
            return sb.Append("</w:numbering>").ToString();
        }
    }

    private static string Hex(Rgb c) => $"{c.R:X2}{c.G:X2}{c.B:X2}";

    /// <summary>
    /// The theme as styles: font and colours, the brief's type sizes (half-points), headings with outline levels.
    /// </summary>
    private static string Styles(Theme theme, string font, string language)
    {
        string text = Hex(theme.Text), accent = Hex(theme.Accent), muted = Hex(theme.Muted), rule = Hex(theme.Rule);
        static string Half(double pt) => ((int)Math.Round(pt * 2)).ToString(CultureInfo.InvariantCulture);
        static string Style(string id, string name, string para, string run, bool primary = true) =>
            $"<w:style w:type=\"paragraph\" w:styleId=\"{id}\"><w:name w:val=\"{name}\"/><w:basedOn " +
            "w:val=\"Normal\"/><w:next w:val=\"Normal\"/>" +
            (primary ? "<w:qFormat/>" : "") + $"<w:pPr>{para}</w:pPr><w:rPr>{run}</w:rPr></w:style>";
        static string Heading(int level, double size, string accent) => Style($"Heading{level}", $"heading {level}",
            $"<w:keepNext/><w:keepLines/><w:spacing w:before=\"{(level == 1 ? 0 : level == 2 ? 320 : 200)}\" " +
            $"w:after=\"80\"/><w:outlineLvl w:val=\"{level - 1}\"/>",
            $"<w:b/><w:color w:val=\"{accent}\"/><w:sz w:val=\"{Half(size)}\"/>");
        string line = ((int)Math.Round(240 * theme.LineFactor)).ToString(CultureInfo.InvariantCulture);
        string f = X(font);
        return $"<w:styles xmlns:w=\"{W}\">" +
            $"<w:docDefaults><w:rPrDefault><w:rPr><w:rFonts w:ascii=\"{f}\" w:eastAsia=\"{f}\" w:hAnsi=\"{f}\" " +
            $"w:cs=\"{f}\"/><w:color w:val=\"{text}\"/>" +
            $"<w:sz w:val=\"{Half(theme.BodySize)}\"/><w:lang w:val=\"{X(language)}\"/></w:rPr></w:rPrDefault>" +
            $"<w:pPrDefault><w:pPr><w:spacing w:after=\"120\" w:line=\"{line}\" " +
            "w:lineRule=\"auto\"/></w:pPr></w:pPrDefault></w:docDefaults>" +
            "<w:style w:type=\"paragraph\" w:default=\"1\" w:styleId=\"Normal\"><w:name " +
            "w:val=\"Normal\"/><w:qFormat/></w:style>" +
            Heading(1, 20, accent) + Heading(2, 13.5, accent) + Heading(3, 11, accent) +
            Style("Subtitle", "Subtitle", "", $"<w:color w:val=\"{muted}\"/><w:sz w:val=\"{Half(12.5)}\"/>") +
            Style("Caption", "caption", "<w:keepNext/><w:spacing w:before=\"200\" w:after=\"60\"/>",
                $"<w:b/><w:sz w:val=\"{Half(theme.CaptionSize)}\"/>") +
            Style("Note", "Source note", "",
                $"<w:color w:val=\"{muted}\"/><w:sz w:val=\"{Half(theme.CaptionSize)}\"/>") +
            Style("Figure", "Figure", "<w:keepNext/><w:spacing w:after=\"40\"/>", "") +
            Style("TableText", "Table text",
                "<w:spacing w:before=\"20\" w:after=\"20\" w:line=\"240\" w:lineRule=\"auto\"/>",
                $"<w:sz w:val=\"{Half(theme.TableSize)}\"/>") +
            Style("ListParagraph", "List Paragraph", "<w:ind w:left=\"360\"/><w:contextualSpacing/>", "") +
            Style("BoxTitle", "Box title", "<w:keepNext/>",
                $"<w:b/><w:color w:val=\"{accent}\"/><w:sz w:val=\"{Half(11)}\"/>") +
            Style("Marker", "Draft marker", "<w:jc w:val=\"right\"/>", "<w:b/><w:color w:val=\"A4161A\"/>") +
            Style("Footer", "footer", "", $"<w:color w:val=\"{muted}\"/><w:sz w:val=\"16\"/>", primary: false) +
            "<w:style w:type=\"character\" w:styleId=\"Hyperlink\"><w:name w:val=\"Hyperlink\"/><w:rPr><w:color " +
            $"w:val=\"{accent}\"/><w:u w:val=\"single\"/></w:rPr></w:style>" +
            "<w:style w:type=\"table\" w:styleId=\"BriefTable\"><w:name w:val=\"Brief table\"/>" +
            "<w:tblPr><w:tblBorders>" +
            $"<w:top w:val=\"single\" w:sz=\"4\" w:space=\"0\" w:color=\"{rule}\"/><w:bottom w:val=\"single\" " +
            $"w:sz=\"4\" w:space=\"0\" w:color=\"{rule}\"/>" +
            $"<w:insideH w:val=\"single\" w:sz=\"4\" w:space=\"0\" w:color=\"{rule}\"/></w:tblBorders>" +
            "<w:tblCellMar><w:top w:w=\"30\" w:type=\"dxa\"/><w:bottom w:w=\"30\" " +
            "w:type=\"dxa\"/></w:tblCellMar></w:tblPr>" +
            "<w:tblStylePr w:type=\"firstRow\"><w:tcPr><w:shd w:val=\"clear\" w:color=\"auto\" " +
            $"w:fill=\"{Hex(theme.HeaderFill)}\"/></w:tcPr></w:tblStylePr></w:style>" +
            "</w:styles>";
    }
}
