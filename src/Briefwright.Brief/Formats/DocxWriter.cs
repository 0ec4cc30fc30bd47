using System.Globalization;
using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Wordprocessing;
using A = DocumentFormat.OpenXml.Drawing;
using DW = DocumentFormat.OpenXml.Drawing.Wordprocessing;
using PIC = DocumentFormat.OpenXml.Drawing.Pictures;
using RunStyle = Briefwright.Composer.Document.RunStyle;
using WordRunStyle = DocumentFormat.OpenXml.Wordprocessing.RunStyle;

namespace Briefwright.Brief.Formats;

/// <summary>
/// The brief as an editable document for clearance rounds: the title and numbered sections as real heading styles (so
/// a word processor's navigation lists them), tables as tables with a repeated header row, charts as PNG images with
/// their alternative text, captions in the caption style with sequence numbers, and the theme's font and colours as
/// the document's styles. Same content, same bytes: relationship ids are fixed, dates are the brief's.
/// </summary>
public sealed class DocxWriter : IBriefWriter
{
    public string Suffix => "docx";

    private const long EmuPerPoint = 12700;

    public byte[] Write(BriefContent content)
    {
        var doc = content.Document;
        var theme = content.Theme;
        using var stream = new MemoryStream();
        using (var word = WordprocessingDocument.Create(stream, WordprocessingDocumentType.Document))
        {
            var main = word.AddNewPart<MainDocumentPart>("application/vnd.openxmlformats-officedocument.wordprocessingml.document.main+xml", "rId1");
            var styles = main.AddNewPart<StyleDefinitionsPart>("rIdStyles");
            styles.Styles = Styles(theme, doc.FontFamily ?? "Liberation Sans", doc.Info.Language);
            var builder = new Builder(main, content);
            var body = new Body();
            if (doc.Info.Marker is { } marker)
                body.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "Marker" }), new Run(new Text(marker))));
            foreach (var block in doc.Blocks) builder.Add(body, block);
            body.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "Note" }),
                new Run(new Text($"Scenario {content.Solved.Scenario.Brief.Id} · {doc.Info.Edition} · input hash {content.Solved.Scenario.InputHash} · briefwright {ToolInfo.Version}"))));
            var numbering = main.AddNewPart<NumberingDefinitionsPart>("rIdNumbering");
            numbering.Numbering = builder.Numbering();
            var footer = main.AddNewPart<FooterPart>("rIdFooter");
            footer.Footer = new Footer(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "Footer" }),
                new Run(new Text(doc.Info.FooterNote + " · page ") { Space = SpaceProcessingModeValues.Preserve }),
                new SimpleField(new Run(new Text("1"))) { Instruction = " PAGE " }));
            bool letter = doc.Paper == PaperSize.Letter;
            body.Append(new SectionProperties(
                new FooterReference { Type = HeaderFooterValues.Default, Id = "rIdFooter" },
                new PageSize { Width = letter ? 12240U : 11906U, Height = letter ? 15840U : 16838U },
                new PageMargin
                {
                    Top = Twips(theme.MarginTop), Bottom = Twips(theme.MarginBottom), Left = (uint)Twips(theme.MarginLeft), Right = (uint)Twips(theme.MarginRight),
                    Header = 567, Footer = 567, Gutter = 0,
                }));
            main.Document = new Document(body);
            ZipStamp.CoreProperties(word, doc.Info.Title, doc.Info.Author, doc.Info.Date);
        }
        return ZipStamp.Restamp(stream.ToArray(), content.Document.Info.Date);
    }

    private static int Twips(double points) => (int)Math.Round(points * 20);

    private sealed class Builder(MainDocumentPart main, BriefContent content)
    {
        private readonly Dictionary<string, Charts.RenderedChart> charts = content.Charts.ToDictionary(c => c.Id, StringComparer.Ordinal);
        private readonly Dictionary<string, string> links = new(StringComparer.Ordinal);
        private readonly List<int> orderedLists = [];
        private int section, subsection, tables, figures, images;

        public void Add(OpenXmlElement parent, Block block)
        {
            switch (block)
            {
                case HeadingBlock h:
                    string number = "";
                    if (h.Level == 2) { section++; subsection = 0; number = $"{section}  "; }
                    else if (h.Level == 3) { subsection++; number = $"{section}.{subsection}  "; }
                    string style = h.Level switch { 1 => "Heading1", 2 => "Heading2", _ => "Heading3" };
                    parent.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = style }), new Run(Text(number + h.Text))));
                    break;
                case ParagraphBlock p:
                    parent.Append(Para(p.Role switch { ParagraphRole.Note => "Note", ParagraphRole.Meta => "Note", ParagraphRole.Subtitle => "Subtitle", _ => null }, p.Runs));
                    break;
                case ListBlock l:
                    int num = 1;
                    if (l.Ordered) { orderedLists.Add(orderedLists.Count + 2); num = orderedLists[^1]; }
                    foreach (var item in l.Items)
                    {
                        var para = Para("ListParagraph", item);
                        para.ParagraphProperties!.Append(new NumberingProperties(new NumberingLevelReference { Val = 0 }, new NumberingId { Val = num }));
                        parent.Append(para);
                    }
                    break;
                case TableBlock t:
                    Table(parent, t);
                    break;
                case FigureBlock f:
                    Figure(parent, f);
                    break;
                case BoxBlock b:
                    Box(parent, b);
                    break;
                case PageBreakBlock:
                    parent.Append(new Paragraph(new Run(new Break { Type = BreakValues.Page })));
                    break;
            }
        }

        private Paragraph Para(string? style, IReadOnlyList<TextRun> runs)
        {
            var para = new Paragraph(new ParagraphProperties(style is null ? new ParagraphStyleId { Val = "Normal" } : new ParagraphStyleId { Val = style }));
            foreach (var r in runs)
            {
                var run = new Run();
                if (r.Style != RunStyle.Regular)
                {
                    var props = new RunProperties();
                    if (r.Style is RunStyle.Bold or RunStyle.BoldItalic) props.Append(new Bold());
                    if (r.Style is RunStyle.Italic or RunStyle.BoldItalic) props.Append(new Italic());
                    run.Append(props);
                }
                run.Append(Text(r.Text));
                if (r.Link is { } link && Uri.TryCreate(link, UriKind.Absolute, out var uri))
                {
                    if (!links.TryGetValue(link, out var id))
                    {
                        id = $"rIdLink{links.Count + 1}";
                        main.AddHyperlinkRelationship(uri, true, id);
                        links[link] = id;
                    }
                    run.RunProperties ??= new RunProperties();
                    run.RunProperties.PrependChild(new WordRunStyle { Val = "Hyperlink" });
                    para.Append(new Hyperlink(run) { Id = id });
                }
                else para.Append(run);
            }
            return para;
        }

        private static Text Text(string s) => new(s) { Space = SpaceProcessingModeValues.Preserve };

        /// <summary>"Table 3. caption" with the number as a sequence field, so a word processor renumbers it.</summary>
        private static Paragraph Caption(string kind, int number, string caption) => new(
            new ParagraphProperties(new ParagraphStyleId { Val = "Caption" }, new KeepNext()),
            new Run(Text(kind + " ")),
            new SimpleField(new Run(new Text(number.ToString(CultureInfo.InvariantCulture)))) { Instruction = $" SEQ {kind} \\* ARABIC " },
            new Run(Text(". " + caption)));

        private static Paragraph Source(string source) => new(new ParagraphProperties(new ParagraphStyleId { Val = "Note" }),
            new Run(new RunProperties(new Italic()), Text("Source: ")), new Run(Text(source)));

        private void Table(OpenXmlElement parent, TableBlock t)
        {
            tables++;
            if (t.Caption is not null) parent.Append(Caption("Table", tables, t.Caption));
            var table = new Table(new TableProperties(
                new TableStyle { Val = "BriefTable" },
                new TableWidth { Type = TableWidthUnitValues.Pct, Width = "5000" },
                new TableLook { FirstRow = true, FirstColumn = true, NoHorizontalBand = false, NoVerticalBand = true, LastRow = false, LastColumn = false },
                new TableCaption { Val = t.Caption ?? $"Table {tables}" }));
            var grid = new TableGrid();
            for (int c = 0; c < t.Header.Count; c++) grid.Append(new GridColumn());
            table.Append(grid);
            table.Append(Row(t, t.Header, header: true));
            foreach (var row in t.Rows) table.Append(Row(t, row, header: false));
            parent.Append(table);
            if (t.Source is not null) parent.Append(Source(t.Source));
        }

        private static TableRow Row(TableBlock t, IReadOnlyList<string> cells, bool header)
        {
            var row = new TableRow();
            if (header) row.Append(new TableRowProperties(new TableHeader(), new CantSplit()));
            for (int c = 0; c < cells.Count; c++)
            {
                var align = c < t.Align.Count ? t.Align[c] : CellAlign.Left;
                var props = new ParagraphProperties(new ParagraphStyleId { Val = "TableText" });
                if (align != CellAlign.Left) props.Append(new Justification { Val = align == CellAlign.Right ? JustificationValues.Right : JustificationValues.Center });
                var run = new Run(Text(cells[c]));
                if (header) run.PrependChild(new RunProperties(new Bold()));
                row.Append(new TableCell(new Paragraph(props, run)));
            }
            return row;
        }

        private void Figure(OpenXmlElement parent, FigureBlock f)
        {
            figures++;
            parent.Append(Caption("Figure", figures, f.Caption));
            if (charts.GetValueOrDefault(f.Id)?.Png is { } png)
            {
                images++;
                string rid = $"rIdImage{images}";
                var part = main.AddNewPart<ImagePart>("image/png", rid);
                using (var s = new MemoryStream(png)) part.FeedData(s);
                long cx = (long)(f.WidthPt * EmuPerPoint), cy = (long)(f.HeightPt * EmuPerPoint);
                var inline = new DW.Inline(
                    new DW.Extent { Cx = cx, Cy = cy },
                    new DW.EffectExtent { LeftEdge = 0, TopEdge = 0, RightEdge = 0, BottomEdge = 0 },
                    new DW.DocProperties { Id = (uint)images, Name = $"Figure {figures}", Description = f.AltText, Title = f.Caption },
                    new DW.NonVisualGraphicFrameDrawingProperties(new A.GraphicFrameLocks { NoChangeAspect = true }),
                    new A.Graphic(new A.GraphicData(
                        new PIC.Picture(
                            new PIC.NonVisualPictureProperties(
                                new PIC.NonVisualDrawingProperties { Id = (uint)images, Name = $"fig-{f.Id}.png", Description = f.AltText },
                                new PIC.NonVisualPictureDrawingProperties()),
                            new PIC.BlipFill(new A.Blip { Embed = rid }, new A.Stretch(new A.FillRectangle())),
                            new PIC.ShapeProperties(
                                new A.Transform2D(new A.Offset { X = 0, Y = 0 }, new A.Extents { Cx = cx, Cy = cy }),
                                new A.PresetGeometry(new A.AdjustValueList()) { Preset = A.ShapeTypeValues.Rectangle })))
                    { Uri = "http://schemas.openxmlformats.org/drawingml/2006/picture" }))
                { DistanceFromTop = 0, DistanceFromBottom = 0, DistanceFromLeft = 0, DistanceFromRight = 0 };
                parent.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "Figure" }, new KeepNext()), new Run(new Drawing(inline))));
            }
            else parent.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "Note" }), new Run(Text(f.AltText))));
            if (f.Source is not null) parent.Append(Source(f.Source));
        }

        /// <summary>A shaded box (key findings): a one-cell table shaded in the theme's box colour.</summary>
        private void Box(OpenXmlElement parent, BoxBlock b)
        {
            var cell = new TableCell(new TableCellProperties(new Shading { Val = ShadingPatternValues.Clear, Color = "auto", Fill = Hex(content.Theme.BoxFill) }));
            if (b.Title is not null) cell.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "BoxTitle" }), new Run(Text(b.Title))));
            foreach (var inner in b.Content) Add(cell, inner);
            if (!cell.Elements<Paragraph>().Any() && !cell.Elements<Table>().Any()) cell.Append(new Paragraph());
            if (cell.LastChild is Table) cell.Append(new Paragraph());
            parent.Append(new Table(
                new TableProperties(
                    new TableWidth { Type = TableWidthUnitValues.Pct, Width = "5000" },
                    new TableBorders(new LeftBorder { Val = BorderValues.Single, Size = 24, Color = Hex(content.Theme.Accent) }),
                    new TableLayout { Type = TableLayoutValues.Fixed },
                    new TableCaption { Val = b.Title ?? "Box" }),
                new TableGrid(new GridColumn()),
                new TableRow(new TableRowProperties(new CantSplit()), cell)));
            parent.Append(new Paragraph(new ParagraphProperties(new ParagraphStyleId { Val = "Normal" })));
        }

        /// <summary>Bullets (number 1) and one numbering per ordered list, each starting at 1.</summary>
        public Numbering Numbering()
        {
            var numbering = new Numbering(
                new AbstractNum(new Level(
                    new NumberingFormat { Val = NumberFormatValues.Bullet }, new LevelText { Val = "•" },
                    new PreviousParagraphProperties(new Indentation { Left = "360", Hanging = "240" })) { LevelIndex = 0 }) { AbstractNumberId = 1 },
                new AbstractNum(new Level(
                    new StartNumberingValue { Val = 1 }, new NumberingFormat { Val = NumberFormatValues.Decimal }, new LevelText { Val = "%1." },
                    new PreviousParagraphProperties(new Indentation { Left = "360", Hanging = "300" })) { LevelIndex = 0 }) { AbstractNumberId = 2 },
                new NumberingInstance(new AbstractNumId { Val = 1 }) { NumberID = 1 });
            foreach (int id in orderedLists)
                numbering.Append(new NumberingInstance(new AbstractNumId { Val = 2 },
                    new LevelOverride(new StartOverrideNumberingValue { Val = 1 }) { LevelIndex = 0 }) { NumberID = id });
            return numbering;
        }
    }

    private static string Hex(Rgb c) => $"{c.R:X2}{c.G:X2}{c.B:X2}";

    /// <summary>The theme as styles: font and colours, the brief's type sizes (half-points), headings with outline levels.</summary>
    private static Styles Styles(Theme theme, string font, string language)
    {
        string text = Hex(theme.Text), accent = Hex(theme.Accent), muted = Hex(theme.Muted);
        int Half(double pt) => (int)Math.Round(pt * 2);
        Style Para(string id, string name, string? basedOn, OpenXmlElement[] para, OpenXmlElement[] run, bool primary = true)
        {
            var style = new Style { Type = StyleValues.Paragraph, StyleId = id };
            style.Append(new StyleName { Val = name });
            if (basedOn is not null) style.Append(new BasedOn { Val = basedOn });
            style.Append(new NextParagraphStyle { Val = "Normal" });
            if (primary) style.Append(new PrimaryStyle());
            style.Append(new StyleParagraphProperties(para));
            style.Append(new StyleRunProperties(run));
            return style;
        }
        Style Heading(int level, double size) => Para($"Heading{level}", $"heading {level}", "Normal",
            [new KeepNext(), new KeepLines(), new SpacingBetweenLines { Before = level == 1 ? "0" : level == 2 ? "320" : "200", After = "80" }, new OutlineLevel { Val = level - 1 }],
            [new Bold(), new Color { Val = accent }, new FontSize { Val = Half(size).ToString(CultureInfo.InvariantCulture) }]);
        var line = ((int)Math.Round(240 * theme.LineFactor)).ToString(CultureInfo.InvariantCulture);
        return new Styles(
            new DocDefaults(
                new RunPropertiesDefault(new RunPropertiesBaseStyle(
                    new RunFonts { Ascii = font, HighAnsi = font, ComplexScript = font, EastAsia = font },
                    new Color { Val = text },
                    new FontSize { Val = Half(theme.BodySize).ToString(CultureInfo.InvariantCulture) },
                    new Languages { Val = language })),
                new ParagraphPropertiesDefault(new ParagraphPropertiesBaseStyle(new SpacingBetweenLines { After = "120", Line = line, LineRule = LineSpacingRuleValues.Auto }))),
            new Style(new StyleName { Val = "Normal" }, new PrimaryStyle()) { Type = StyleValues.Paragraph, StyleId = "Normal", Default = true },
            Heading(1, 20), Heading(2, 13.5), Heading(3, 11),
            Para("Subtitle", "Subtitle", "Normal", [], [new Color { Val = muted }, new FontSize { Val = Half(12.5).ToString(CultureInfo.InvariantCulture) }]),
            Para("Caption", "caption", "Normal", [new KeepNext(), new SpacingBetweenLines { Before = "200", After = "60" }],
                [new Bold(), new FontSize { Val = Half(theme.CaptionSize).ToString(CultureInfo.InvariantCulture) }]),
            Para("Note", "Source note", "Normal", [], [new Color { Val = muted }, new FontSize { Val = Half(theme.CaptionSize).ToString(CultureInfo.InvariantCulture) }]),
            Para("Figure", "Figure", "Normal", [new KeepNext(), new SpacingBetweenLines { After = "40" }], []),
            Para("TableText", "Table text", "Normal", [new SpacingBetweenLines { Before = "20", After = "20", Line = "240", LineRule = LineSpacingRuleValues.Auto }],
                [new FontSize { Val = Half(theme.TableSize).ToString(CultureInfo.InvariantCulture) }]),
            Para("ListParagraph", "List Paragraph", "Normal", [new Indentation { Left = "360" }, new ContextualSpacing()], []),
            Para("BoxTitle", "Box title", "Normal", [new KeepNext()], [new Bold(), new Color { Val = accent }, new FontSize { Val = Half(11).ToString(CultureInfo.InvariantCulture) }]),
            Para("Marker", "Draft marker", "Normal", [new Justification { Val = JustificationValues.Right }], [new Bold(), new Color { Val = "A4161A" }]),
            Para("Footer", "footer", "Normal", [], [new Color { Val = muted }, new FontSize { Val = "16" }], primary: false),
            new Style(new StyleName { Val = "Hyperlink" }, new StyleRunProperties(new Color { Val = accent }, new Underline { Val = UnderlineValues.Single })) { Type = StyleValues.Character, StyleId = "Hyperlink" },
            new Style(
                new StyleName { Val = "Brief table" },
                new StyleTableProperties(new TableBorders(
                    new TopBorder { Val = BorderValues.Single, Size = 4, Color = Hex(theme.Rule) },
                    new BottomBorder { Val = BorderValues.Single, Size = 4, Color = Hex(theme.Rule) },
                    new InsideHorizontalBorder { Val = BorderValues.Single, Size = 4, Color = Hex(theme.Rule) }),
                    new TableCellMarginDefault(new TopMargin { Width = "30", Type = TableWidthUnitValues.Dxa }, new BottomMargin { Width = "30", Type = TableWidthUnitValues.Dxa })),
                new TableStyleProperties(new TableStyleConditionalFormattingTableCellProperties(
                    new Shading { Val = ShadingPatternValues.Clear, Color = "auto", Fill = Hex(theme.HeaderFill) })) { Type = TableStyleOverrideValues.FirstRow })
            { Type = StyleValues.Table, StyleId = "BriefTable" });
    }
}
