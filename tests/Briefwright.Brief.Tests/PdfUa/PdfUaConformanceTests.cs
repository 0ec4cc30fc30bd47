using System.Text;
using System.Text.RegularExpressions;
using Briefwright.Composer;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using SkiaSharp;

namespace Briefwright.Brief.Tests.PdfUa;

/// <summary>
/// PDF/UA-1 (ISO 14289-1) conformance of every demo brief and of stress briefs, checked by <see cref="PdfUaChecker"/>
/// through qpdf against the Matterhorn Protocol's machine-checkable failure conditions; and proof that the check fails
/// when a tagging feature is taken out of a conforming file.
/// </summary>
public class PdfUaConformanceTests
{
    public static TheoryData<string> DemoBriefs
        => new() { "auroria-national", "auroria-eastmark", "auroria-northport", "auroria-silverdale" };

    private static string Report(IEnumerable<Finding> findings) => string.Join("\n", findings);

    [Theory]
    [MemberData(nameof(DemoBriefs))]
    public void Demo_brief_passes_every_machine_check(string name)
    {
        var findings = PdfUaChecker.Check(Demo.Build(name).Pdf);
        Assert.True(findings.Count == 0, Report(findings));
    }

    [Theory]
    [InlineData(PaperSize.A4)]
    [InlineData(PaperSize.Letter)]
    public void Stress_brief_passes_every_machine_check(PaperSize paper)
    {
        var pdf = DocumentComposer.WritePdf(StressBrief(paper)).Bytes;
        var findings = PdfUaChecker.Check(pdf);
        Assert.True(findings.Count == 0, Report(findings));
        Assert.Contains("/Subtype/Link", Encoding.Latin1.GetString(pdf)); // the links are there to be checked
    }

    [Fact]
    public void A_header_cell_without_scope_fails_15_003()
    {
        byte[] pdf = Demo.Build("auroria-national").Pdf;
        byte[] broken = ReplaceFirst(pdf, "/Scope/Column", new string(' ', "/Scope/Column".Length));
        Assert.Empty(PdfUaChecker.Check(pdf));
        var findings = PdfUaChecker.Check(broken);
        Assert.Equal(["15-003"], findings.Select(f => f.Checkpoint));
    }

    [Fact]
    public void Missing_pdfua_identification_fails_06_002()
    {
        byte[] broken = ReplaceFirst(Demo.Build("auroria-national").Pdf, "<pdfuaid:part>1<", "<pdfuaid:part>2<");
        Assert.Contains(PdfUaChecker.Check(broken), f => f.Checkpoint == "06-002");
    }

    [Fact]
    public void A_figure_without_alternative_text_fails_13_004()
    {
        byte[] broken = ReplaceFirst(Demo.Build("auroria-national").Pdf, "/Alt(", "/Xlt(");
        Assert.Contains(PdfUaChecker.Check(broken), f => f.Checkpoint == "13-004");
    }

    [Fact]
    public void A_figure_without_bounding_box_fails()
    {
        byte[] broken = ReplaceFirst(Demo.Build("auroria-national").Pdf, "/O/Layout/BBox", "/O/Layout/XBox");
        Assert.Contains(PdfUaChecker.Check(broken), f => f.Checkpoint == "ISO 32000-1 14.8.5.4.3");
    }

    [Fact]
    public void Link_annotations_without_tab_order_or_contents_fail_28_008_and_28_012()
    {
        byte[] pdf = DocumentComposer.WritePdf(StressBrief(PaperSize.A4)).Bytes;
        Assert.Contains(PdfUaChecker.Check(ReplaceFirst(pdf, "/Tabs/S", "/Xabs/S")), f => f.Checkpoint == "28-008");
        string text = Encoding.Latin1.GetString(pdf);
        var contents = Regex.Match(text, @"/Contents\((?:[^()\\]|\\.)*\)");
        Assert.True(contents.Success);
        byte[] noContents = ReplaceFirst(
            pdf,
            contents.Value,
            "/Contents()" + new string(' ', contents.Length - "/Contents()".Length));
        Assert.Contains(PdfUaChecker.Check(noContents), f => f.Checkpoint == "28-012");
    }

    [Fact]
    public void A_link_outside_a_link_element_fails_28_011()
    {
        byte[] pdf = DocumentComposer.WritePdf(StressBrief(PaperSize.A4)).Bytes;
        byte[] broken = ReplaceFirst(pdf, "/S/Link", "/S/Span");
        Assert.Contains(PdfUaChecker.Check(broken), f => f.Checkpoint == "28-011");
    }

    [Fact]
    public void An_untagged_pdf_fails_01_005_and_the_metadata_checks()
    {
        BundledFonts.Install();
        using var doc = new PdfSharp.Pdf.PdfDocument();
        var page = doc.AddPage();
        using (var g = PdfSharp.Drawing.XGraphics.FromPdfPage(page))
            g.DrawString(
                "Untagged",
                new PdfSharp.Drawing.XFont(BundledFonts.Family, 12),
                PdfSharp.Drawing.XBrushes.Black,
                50,
                50);
        using var stream = new MemoryStream();
        doc.Save(stream);
        var checkpoints = PdfUaChecker.Check(stream.ToArray()).Select(f => f.Checkpoint).ToList();
        Assert.Contains("01-005", checkpoints);
        Assert.Contains("06-002", checkpoints);
    }

    [Theory]
    [InlineData("BT /F0 12 Tf (x) Tj ET", "01-005")]
    [InlineData("/P <</MCID 0>> BDC 0 0 5 5 re f /Artifact BMC 0 0 m 5 5 l S EMC EMC", "01-003")]
    [InlineData("/Artifact BMC /P <</MCID 0>> BDC BT (x) Tj ET EMC EMC", "01-004")]
    [InlineData("/P <</MCID 0>> BDC BT (x) Tj ET", "ISO 32000-1 14.6")]
    public void Content_scan_finds_each_marked_content_fault(string content, string checkpoint)
    {
        var scan = PdfUaChecker.ScanContent(Encoding.ASCII.GetBytes(content));
        Assert.Contains(scan.Findings, f => f.Checkpoint == checkpoint);
    }

    [Fact]
    public void Content_scan_accepts_tagged_content_artifacts_and_strings_that_look_like_operators()
    {
        var scan = PdfUaChecker.ScanContent(Encoding.ASCII.GetBytes(
            "/Artifact BMC 0 0 5 5 re f EMC /P <</MCID 0>> BDC BT (EMC Tj \\) BDC) Tj ET EMC /Figure <</MCID 1>> BDC " +
            "q /Fm0 Do Q EMC"));
        Assert.Empty(scan.Findings);
        Assert.Equal([0, 1], scan.Mcids);
    }

    private static byte[] ReplaceFirst(byte[] pdf, string find, string with)
    {
        Assert.Equal(find.Length, with.Length); // same length: cross-reference offsets stay valid
        string text = Encoding.Latin1.GetString(pdf);
        int at = text.IndexOf(find, StringComparison.Ordinal);
        Assert.True(at >= 0, $"'{find}' not found");
        return Encoding.Latin1.GetBytes(string.Concat(text.AsSpan(0, at), with, text.AsSpan(at + find.Length)));
    }

    /// <summary>
    /// Every block kind at once, with links in paragraphs and list items, a table that runs over two pages, a
    /// paragraph split by a page break, a shaded box, a logo and a chart with its own background (invented content).
    /// </summary>
    public static BriefDocument StressBrief(PaperSize paper)
    {
        var blocks = new List<Block>
        {
            new HeadingBlock(1, "Stress brief for the accessibility check (invented)"),
            new ParagraphBlock(
                [new TextRun("An invented document for the Republic of Auroria.", RunStyle.Italic)],
                ParagraphRole.Subtitle),
            new BoxBlock("Key findings", [
                new ParagraphBlock(
                    [new TextRun("Results are model illustrations, not forecasts; official statistics prevail.")]),
                new ListBlock([[new TextRun("First finding with a "), new TextRun(
                    "method note",
                    Link: "https://example.org/auroria/method")], [new TextRun("Second finding.")]], false),
            ]),
            new HeadingBlock(2, "Question"),
            new ParagraphBlock([
                new TextRun("The question is set out in the "), new TextRun(
                    "terms of reference",
                    RunStyle.Bold,
                    "https://example.org/auroria/terms"),
                new TextRun(" and answered below; see also https://example.org/auroria.", RunStyle.Regular),
            ]),
            new HeadingBlock(3, "Detail"),
            new ListBlock(Enumerable.Range(1, 5)
                .Select(i => (IReadOnlyList<TextRun>)[new TextRun($"Ordered point {i}.")])
                .ToList(), true),
            new TableBlock(["Year", "Output per person", "Worker share", "Note"],
                Enumerable.Range(2026, 70)
                    .Select(y => (IReadOnlyList<string>)[$"{y}", $"{100 + (y - 2026) * 0.7:F1}",
                        $"{0.42 - (y - 2026) * 0.0005:F3}", y % 7 == 0 ? "census year (invented)" : ""])
                    .ToList(),
                [CellAlign.Left, CellAlign.Right, CellAlign.Right, CellAlign.Left],
                "An invented long table",
                "Invented for the test."),
            new FigureBlock(
                "stress",
                ChartPdf(),
                1,
                470,
                290,
                "An invented chart with a shaded background",
                "Invented.",
                "Bar chart of three invented values rising from 2 to 6."),
            new ParagraphBlock([new TextRun(string.Join(" ", Enumerable.Repeat(
                "A long paragraph that runs over the page break to test continued structure elements.",
                40)))]),
            new PageBreakBlock(),
            new HeadingBlock(2, "Annex"),
            new ParagraphBlock([new TextRun("Last page.")], ParagraphRole.Note),
        };
        var info = new DocumentInfo(
            "Stress brief (invented)",
            "Stress",
            "Test author (invented)",
            "Accessibility check",
            "test",
            "en-GB",
            new DateOnly(2026, 11, 30),
            "Edition 1",
            "Invented document for tests.")
        {
            Logo = Logo(),
        };
        return new BriefDocument(info, blocks, paper);
    }

    private static (byte[] Png, int Width, int Height) Logo()
    {
        byte[] png = File.ReadAllBytes(Path.Combine(Demo.Root, "briefs-demo", "auroria-institute-logo.png"));
        int Read(int at) => (png[at] << 24) | (png[at + 1] << 16) | (png[at + 2] << 8) | png[at + 3];
        return (png, Read(16), Read(20)); // IHDR width and height
    }

    /// <summary>
    /// A one-page vector chart drawn with Skia, as the chart library does: a background, bars and a label.
    /// </summary>
    private static byte[] ChartPdf()
    {
        using var stream = new MemoryStream();
        using (var doc = SKDocument.CreatePdf(stream, SKDocumentPdfMetadata.Default))
        {
            var canvas = doc.BeginPage(470, 290);
            using var fill = new SKPaint { Color = new SKColor(0xF4, 0xF4, 0xF4) };
            canvas.DrawRect(0, 0, 470, 290, fill);
            using var bar = new SKPaint { Color = new SKColor(0x1F, 0x4E, 0x79) };
            for (int i = 0; i < 3; i++) canvas.DrawRect(60 + i * 120, 250 - (i + 1) * 60, 80, (i + 1) * 60, bar);
            doc.EndPage();
        }
        return stream.ToArray();
    }
}
