using Briefwright.Composer.Layout;
using PdfSharp.Drawing;
using PdfSharp.Pdf;
using PdfSharp.UniversalAccessibility;

namespace Briefwright.Composer.Drawing;

/// <summary>
/// Draws into a tagged PDF (PDF/UA-1) with PDFsharp: structure elements, artifacts, outline entries and links.
/// Header cells carry their scope, figures their alternative text and a bounding box in page space, and each link
/// annotation sits in a Link structure element beside the text it covers, with a text alternative.
/// </summary>
public sealed class PdfSurface : IDrawingSurface
{
    private readonly PdfDocument document;
    private readonly PdfTextMeasurer measurer;
    private readonly StructureBuilder structure;
    private readonly Dictionary<byte[], XPdfForm> forms = new(ReferenceEqualityComparer.Instance);
    private readonly Dictionary<Rgb, XSolidBrush> brushes = new();
    private readonly List<(int Level, string Title, PdfPage Page, double Y)> outline = new();
    private PdfPage? page;
    private XGraphics? gfx;

    public PdfSurface(PdfDocument document, PdfTextMeasurer measurer)
    {
        this.document = document;
        this.measurer = measurer;
        structure = UAManager.ForDocument(document).StructureBuilder;
    }

    private XGraphics G =>
        gfx ?? throw new InvalidOperationException("Draw calls must come between BeginPage and EndPage.");

    public void BeginPage(int pageIndex, double width, double height)
    {
        page = document.AddPage();
        page.Width = XUnit.FromPoint(width);
        page.Height = XUnit.FromPoint(height);
        gfx = XGraphics.FromPdfPage(page);
    }

    public void EndPage()
    {
        // A structure element may continue on the next page (a table or paragraph that runs over), but its marked
        // content must be closed in this page's content stream.
        structure.EndMarkedContentsWithId();
        gfx?.Dispose();
        gfx = null;
    }

    public void BeginTag(StructTag tag, string? altText = null, Box? bounds = null)
    {
        switch (tag)
        {
            case StructTag.Figure:
            case StructTag.Formula:
                // PDFsharp writes the rectangle as given; the layout attribute BBox is in page space (y up).
                var b = bounds ?? new Box(0, 0, 0, 0);
                double pageHeight = page!.Height.Point;
                structure.BeginElement(
                    tag == StructTag.Figure ? PdfIllustrationElementTag.Figure : PdfIllustrationElementTag.Formula,
                    altText ?? "",
                    new XRect(b.X, pageHeight - b.Y - b.Height, b.Width, b.Height));
                break;
            case StructTag.Caption:
                // PDFsharp files Caption among grouping elements, which mark no content: text drawn in one would be
                // neither tagged nor an artifact. A caption holds its text directly, so it is opened as block-level.
                structure.BeginBlockLevelElement("Caption");
                break;
            case StructTag.Div:
                structure.BeginElement(PdfGroupingElementTag.Division);
                break;
            default:
                structure.BeginElement(tag switch
                {
                    StructTag.H1 => PdfBlockLevelElementTag.Heading1,
                    StructTag.H2 => PdfBlockLevelElementTag.Heading2,
                    StructTag.H3 => PdfBlockLevelElementTag.Heading3,
                    StructTag.L => PdfBlockLevelElementTag.List,
                    StructTag.LI => PdfBlockLevelElementTag.ListItem,
                    StructTag.Lbl => PdfBlockLevelElementTag.Label,
                    StructTag.LBody => PdfBlockLevelElementTag.ListBody,
                    StructTag.Table => PdfBlockLevelElementTag.Table,
                    StructTag.TR => PdfBlockLevelElementTag.TableRow,
                    StructTag.TH or StructTag.THRow => PdfBlockLevelElementTag.TableHeaderCell,
                    StructTag.TD => PdfBlockLevelElementTag.TableDataCell,
                    _ => PdfBlockLevelElementTag.Paragraph,
                });
                if (tag is StructTag.TH or StructTag.THRow)
                {
                    // Table attributes: a header cell applies to its column (header row) or its row (first column).
                    var attributes = structure.CurrentStructureElement.TableAttributes;
                    attributes.Elements.SetName("/Scope", tag == StructTag.TH ? "/Column" : "/Row");
                }
                break;
        }
    }

    public void EndTag() => structure.End();

    public void BeginArtifact() => structure.BeginArtifact();

    public void EndArtifact() => structure.End();

    public void Text(string text, double x, double baseline, FontSpec font, Rgb color) =>
        G.DrawString(text, measurer.Font(font), Brush(color), x, baseline, XStringFormats.BaseLineLeft);

    private XSolidBrush Brush(Rgb c)
    {
        if (!brushes.TryGetValue(c, out var brush))
            brushes[c] = brush = new XSolidBrush(XColor.FromArgb(c.R, c.G, c.B));
        return brush;
    }

    public void FillRect(Box box, Rgb color) =>
        G.DrawRectangle(Brush(color), box.X, box.Y, box.Width, box.Height);

    public void Line(double x1, double y1, double x2, double y2, Rgb color, double width) =>
        G.DrawLine(new XPen(XColor.FromArgb(color.R, color.G, color.B), width), x1, y1, x2, y2);

    /// <summary>
    /// One form per source PDF, its page chosen per figure: PDFsharp then imports the objects the pages share
    /// (the chart font) once.
    /// </summary>
    public void Figure(string id, byte[] pdf, int page, Box box)
    {
        if (!forms.TryGetValue(pdf, out var form))
        {
            form = XPdfForm.FromStream(new MemoryStream(pdf));
            forms[pdf] = form;
        }
        form.PageNumber = page;
        G.DrawImage(form, box.X, box.Y, box.Width, box.Height);
    }

    /// <summary>
    /// Opens a Link structure element holding the annotation (by object reference) and, until
    /// <see cref="EndLink"/>, the text drawn over it. The annotation's Contents is its text alternative. PDFsharp adds
    /// the annotation to the page and sets the page's tab order to the structure order.
    /// </summary>
    public void BeginLink(Box box, string url, string text)
    {
        double h = page!.Height.Point;
        var rect = new PdfRectangle(
            new XPoint(box.X, h - box.Y - box.Height), new XPoint(box.X + box.Width, h - box.Y));
        var link = PdfSharp.Pdf.Annotations.PdfLinkAnnotation.CreateWebLink(rect, url);
        // Optional entries PDFsharp fills from the clock and a random GUID: left out, so the bytes depend on content
        // only.
        link.Elements.Remove("/NM");
        link.Elements.Remove("/M");
        structure.BeginElement(link, LinkAlternative(text, url));
    }

    public void EndLink() => structure.End();

    /// <summary>What a screen reader announces for a link: its words and where it leads.</summary>
    public static string LinkAlternative(string text, string url)
    {
        string words = text.Trim();
        return words.Length == 0 || words == url ? $"Link to {url}" : $"{words} (link to {url})";
    }

    public void Image(byte[] png, Box box)
    {
        using var image = XImage.FromStream(new MemoryStream(png));
        G.DrawImage(image, box.X, box.Y, box.Width, box.Height);
    }

    public void Outline(int level, string title, double y) => outline.Add((level, title, page!, y));

    /// <summary>Writes the collected headings as the document outline (bookmarks), nested by level.</summary>
    public void WriteOutline()
    {
        PdfOutline? top = null, second = null;
        foreach (var (level, title, p, _) in outline)
        {
            if (level <= 1 || top is null) { top = document.Outlines.Add(title, p, true); second = null; }
            else if (level == 2 || second is null) second = top.Outlines.Add(title, p, true);
            else second.Outlines.Add(title, p, true);
        }
    }
}
