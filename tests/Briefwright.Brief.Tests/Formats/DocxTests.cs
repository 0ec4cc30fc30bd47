using Briefwright.Composer.Document;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Validation;
using DocumentFormat.OpenXml.Wordprocessing;
using DW = DocumentFormat.OpenXml.Drawing.Wordprocessing;

namespace Briefwright.Brief.Tests.Formats;

/// <summary>The editable document, checked with the Open XML SDK's own validator and read back.</summary>
public class DocxTests
{
    private static byte[] Bytes => FormatsDemo.File(FormatsDemo.National, "docx");

    [Fact]
    public void Document_passes_the_sdk_validator()
    {
        using var doc = WordprocessingDocument.Open(new MemoryStream(Bytes), false);
        var errors = new OpenXmlValidator(DocumentFormat.OpenXml.FileFormatVersions.Office2019).Validate(doc).ToList();
        Assert.True(
            errors.Count == 0,
            string.Join("\n", errors.Take(20).Select(e => $"{e.Part?.Uri} {e.Path?.XPath}: {e.Description}")));
    }

    [Fact]
    public void Headings_use_heading_styles_with_outline_levels_in_the_order_of_the_brief()
    {
        using var doc = WordprocessingDocument.Open(new MemoryStream(Bytes), false);
        var main = doc.MainDocumentPart!;
        var styles = main.StyleDefinitionsPart!.Styles!.Elements<Style>().ToDictionary(s => s.StyleId!.Value!);
        for (int level = 1; level <= 3; level++)
        {
            var style = styles[$"Heading{level}"];
            Assert.Equal($"heading {level}", style.StyleName!.Val!.Value);
            Assert.Equal(level - 1, style.StyleParagraphProperties!.OutlineLevel!.Val!.Value);
        }
        var headings = main.Document!.Body!.Elements<Paragraph>()
            .Where(p => p.ParagraphProperties?.ParagraphStyleId?.Val?.Value?
                .StartsWith("Heading", StringComparison.Ordinal) == true)
            .Select(p => p.InnerText).ToList();
        var expected = FormatsDemo.National.Markdown.Split('\n').Where(l => l.StartsWith('#'))
            .Select(l => l.TrimStart('#').Trim())
            .ToList();
        Assert.Equal(expected.Count, headings.Count);
        for (int i = 0; i < expected.Count; i++) Assert.EndsWith(expected[i], headings[i]);
        Assert.Equal("1  " + expected[1], headings[1]);
    }

    [Fact]
    public void Tables_are_tables_with_a_repeated_header_row_and_captions()
    {
        using var doc = WordprocessingDocument.Open(new MemoryStream(Bytes), false);
        var body = doc.MainDocumentPart!.Document!.Body!;
        var tables = body.Elements<Table>()
            .Where(t => t.GetFirstChild<TableProperties>()?.TableStyle?.Val?.Value == "BriefTable")
            .ToList();
        int expected = FormatsDemo.National.Markdown.Split('\n')
            .Count(l => l.StartsWith("|---", StringComparison.Ordinal));
        Assert.Equal(expected, tables.Count);
        foreach (var t in tables)
        {
            Assert.NotNull(t.Elements<TableRow>().First().TableRowProperties?.GetFirstChild<TableHeader>());
            var caption = t.PreviousSibling<Paragraph>()!;
            Assert.Equal("Caption", caption.ParagraphProperties!.ParagraphStyleId!.Val!.Value);
            Assert.StartsWith("Table ", caption.InnerText);
            Assert.Contains(
                caption.Descendants<SimpleField>(),
                f => f.Instruction!.Value!.Contains("SEQ Table", StringComparison.Ordinal));
        }
        // The options table reads back as the PDF prints it.
        var options = tables.First(
            t => t.PreviousSibling<Paragraph>()!.InnerText.Contains("by option", StringComparison.Ordinal));
        string text = string.Join(
            "|",
            options.Elements<TableRow>().Skip(1).First().Elements<TableCell>().Select(c => c.InnerText));
        Assert.Matches(@"^Current law, 11 years \(baseline\)\|11\.0\|0\.\d{3}\|", text);
    }

    [Fact]
    public void Charts_are_png_images_with_alternative_text_and_captions()
    {
        using var doc = WordprocessingDocument.Open(new MemoryStream(Bytes), false);
        var main = doc.MainDocumentPart!;
        var drawings = main.Document!.Body!.Descendants<DW.DocProperties>().ToList();
        int figures = FormatsDemo.National.Markdown.Split('\n')
            .Count(l => l.StartsWith("[[figure:", StringComparison.Ordinal));
        Assert.Equal(figures, drawings.Count);
        Assert.Equal(figures, main.ImageParts.Count());
        foreach (var image in main.ImageParts)
        {
            Assert.Equal("image/png", image.ContentType);
            using var s = image.GetStream();
            var head = new byte[8];
            s.ReadExactly(head);
            Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, head);
        }
        foreach (var d in drawings)
        {
            Assert.True(d.Description!.Value!.Length > 40, d.Description.Value);
            var caption = d.Ancestors<Paragraph>().First().PreviousSibling<Paragraph>()!;
            Assert.StartsWith("Figure ", caption.InnerText);
        }
    }

    [Fact]
    public void Styles_carry_the_theme_font_colours_and_language()
    {
        using var doc = WordprocessingDocument.Open(new MemoryStream(Bytes), false);
        var styles = doc.MainDocumentPart!.StyleDefinitionsPart!.Styles!;
        var defaults = styles.DocDefaults!.RunPropertiesDefault!.RunPropertiesBaseStyle!;
        Assert.Equal("Liberation Sans", defaults.RunFonts!.Ascii!.Value);
        Assert.Equal("en-GB", defaults.Languages!.Val!.Value);
        var theme = FormatsDemo.Theme();
        var heading = styles.Elements<Style>().Single(s => s.StyleId == "Heading2");
        Assert.Equal(
            theme.Colours["accent"].TrimStart('#'),
            heading.StyleRunProperties!.Color!.Val!.Value,
            ignoreCase: true);
        Assert.Equal(theme.Colours["text"].TrimStart('#'), defaults.Color!.Val!.Value, ignoreCase: true);
    }

    [Fact]
    public void Text_reads_back_with_the_key_findings_and_the_cautions()
    {
        using var doc = WordprocessingDocument.Open(new MemoryStream(Bytes), false);
        string text = string.Join(
            "\n",
            doc.MainDocumentPart!.Document!.Body!.Descendants<Paragraph>().Select(p => p.InnerText));
        var box = FormatsDemo.National.Markdown.Split('\n').Where(l => l.StartsWith("> - ", StringComparison.Ordinal))
            .Select(l => l[4..].Replace("**", "", StringComparison.Ordinal)).ToList();
        Assert.NotEmpty(box);
        foreach (var finding in box) Assert.Contains(finding, text);
        Assert.Contains("not forecasts", text);
        Assert.Contains(FormatsDemo.National.Markdown.Split('\n')[0].TrimStart('#').Trim(), text);
    }

    [Fact]
    public void Same_brief_gives_the_same_bytes_in_every_format_on_one_thread_or_more()
    {
        var other = FormatsDemo.Build("auroria-national", threads: 1);
        foreach (var f in FormatsDemo.National.Formats)
            Assert.True(f.Bytes.AsSpan().SequenceEqual(FormatsDemo.File(other, f.Suffix)), f.Suffix);
        Assert.Equal(FormatsDemo.National.Pdf, other.Pdf);
    }
}
