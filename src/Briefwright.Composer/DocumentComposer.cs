using System.Globalization;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Composer.Layout;
using PdfSharp.Pdf;
using PdfSharp.UniversalAccessibility;

namespace Briefwright.Composer;

/// <summary>A written PDF and its number of pages.</summary>
public sealed record ComposedPdf(byte[] Bytes, int PageCount);

/// <summary>Lays out a brief and writes it as a tagged PDF with outline, metadata, running header and footer.</summary>
public sealed class DocumentComposer
{
    /// <summary>Measure stage and pagination, without drawing: pages of placed atoms.</summary>
    public static IReadOnlyList<IReadOnlyList<Placement>> Layout(
        BriefDocument brief, Theme theme, ITextMeasurer measurer) =>
        Paginator.Paginate(new Planner(theme, measurer).Plan(brief.Blocks), theme.ContentHeight);

    /// <summary>
    /// Draws laid-out pages on any surface, with running header and footer as artifacts. A paragraph, list or table
    /// that runs over a page stays one structure element; a table's header row repeated on the continued page is
    /// drawn as an artifact, so the structure holds it once.
    /// </summary>
    public static void Draw(
        BriefDocument brief, Theme theme, IReadOnlyList<IReadOnlyList<Placement>> pages, IDrawingSurface surface,
        ITextMeasurer measurer)
    {
        object? group = null;
        var drawn = new HashSet<Atom>(ReferenceEqualityComparer.Instance);
        for (int p = 0; p < pages.Count; p++)
        {
            surface.BeginPage(p, theme.PageWidth, theme.PageHeight);
            DrawRunningParts(brief.Info, theme, p, pages.Count, surface, measurer);
            var placed = pages[p];
            for (int k = 0; k < placed.Count; k++)
            {
                var (atom, y) = placed[k];
                if (!drawn.Add(atom))
                {
                    // Drawn before: a table's header row repeated where the table continues.
                    surface.BeginArtifact();
                    atom.Draw(new ArtifactSurface(surface), theme, theme.MarginLeft, theme.MarginTop + y);
                    surface.EndArtifact();
                    continue;
                }
                if (atom.Group != group)
                {
                    if (group is not null) surface.EndTag();
                    group = atom.Group;
                    if (group is not null) surface.BeginTag(atom.GroupTag);
                }
                atom.Draw(surface, theme, theme.MarginLeft, theme.MarginTop + y);
            }
            if (group is not null && (p + 1 == pages.Count || FirstContent(pages[p + 1], drawn)?.Group != group))
            {
                surface.EndTag();
                group = null;
            }
            surface.EndPage();
        }
    }

    /// <summary>The first atom of a page that is not a repeat of one drawn before.</summary>
    private static Atom? FirstContent(IReadOnlyList<Placement> placed, HashSet<Atom> drawn) =>
        placed.Select(x => x.Atom).FirstOrDefault(a => !drawn.Contains(a));

    private static void DrawRunningParts(
        DocumentInfo info, Theme theme, int page, int pageCount, IDrawingSurface surface, ITextMeasurer measurer)
    {
        var font = new FontSpec(RunStyle.Regular, 8);
        double right = theme.PageWidth - theme.MarginRight;
        double headerY = theme.MarginTop - 30;
        double footerY = theme.PageHeight - theme.MarginBottom + 30;
        string date = info.DateText ?? info.Date.ToString("d MMMM yyyy", CultureInfo.InvariantCulture);
        string pageText = info.PageLabel
            .Replace("{0}", (page + 1).ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal)
            .Replace("{1}", pageCount.ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal);
        string headerRight = $"{date} · {info.Edition}";
        surface.BeginArtifact();
        if (page == 0 && info.Logo is { } logo)
        {
            double h = 24, w = h * logo.Width / logo.Height;
            surface.Image(logo.Png, new Box(theme.MarginLeft, headerY - 19, w, h));
        }
        else surface.Text(info.ShortTitle, theme.MarginLeft, headerY, font, theme.Muted);
        surface.Text(headerRight, right - measurer.Width(headerRight, font), headerY, font, theme.Muted);
        if (info.Marker is { } marker)
        {
            var bold = new FontSpec(RunStyle.Bold, 9);
            // Above the running header, centred, so that it never runs into a long short title.
            surface.Text(marker, (theme.MarginLeft + right - measurer.Width(marker, bold)) / 2, headerY - 14, bold,
                new Rgb(0xB0, 0x2A, 0x1E));
        }
        surface.Line(theme.MarginLeft, headerY + 5, right, headerY + 5, theme.Rule, 0.5);
        surface.Line(theme.MarginLeft, footerY - 10, right, footerY - 10, theme.Rule, 0.5);
        surface.Text(info.FooterNote, theme.MarginLeft, footerY, font, theme.Muted);
        surface.Text(pageText, right - measurer.Width(pageText, font), footerY, font, theme.Muted);
        surface.EndArtifact();
    }

    /// <summary>
    /// Deflates the page content streams with .NET's zlib (PDFsharp's own compressor leaves them without their final
    /// block when the document is tagged, which qpdf reports). Deterministic for the same content.
    /// </summary>
    private static void CompressContentStreams(PdfDocument document)
    {
        foreach (var page in document.Pages)
            foreach (var item in page.Contents.Elements)
            {
                var dict = item is PdfSharp.Pdf.Advanced.PdfReference r
                    ? r.Value as PdfDictionary
                    : item as PdfDictionary;
                if (dict?.Stream is null || dict.Elements.ContainsKey("/Filter")) continue;
                using var packed = new MemoryStream();
                using (var z = new System.IO.Compression.ZLibStream(
                    packed, System.IO.Compression.CompressionLevel.SmallestSize, leaveOpen: true))
                    z.Write(dict.Stream.Value);
                dict.Stream.Value = packed.ToArray();
                dict.Elements["/Filter"] = new PdfName("/FlateDecode");
            }
    }

    /// <summary>The whole brief as PDF bytes; the same document gives the same bytes.</summary>
    /// <param name="session">The build's render session (its fonts and measurer); a new one in the bundled fonts when
    /// null, which a document set in a theme's fonts cannot use.</param>
    public static ComposedPdf WritePdf(BriefDocument brief, RenderSession? session = null)
    {
        var theme = brief.Theme ?? Theme.For(brief.Paper);
        session ??= brief.FontFamily is null ? new RenderSession()
            : throw new ArgumentNullException(nameof(session),
                "A document in a theme's fonts needs their render session.");
        var measurer = session.Measurer;
        var pages = Layout(brief, theme, measurer);

        using var document = new PdfDocument();
        var info = brief.Info;
        var when = info.Date.ToDateTime(TimeOnly.MinValue, DateTimeKind.Utc);
        document.Info.Title = info.Title;
        document.Info.Author = info.Author;
        document.Info.Subject = info.Subject;
        document.Info.Keywords = info.Keywords;
        document.Info.Creator = "briefwright";
        document.Info.CreationDate = when;
        document.Info.ModificationDate = when;
        document.Language = info.Language;
        document.ViewerPreferences.DisplayDocTitle = true;
        document.PageMode = PdfPageMode.UseOutlines;
        // PDFsharp 6.2.4 leaves page content streams without their final deflate block when tagging is on
        // (qpdf: "input stream is complete but output may still be valid"); write them uncompressed.
        document.Options.CompressContentStreams = false;
        var surface = new PdfSurface(document, measurer);
        UAManager.ForDocument(document).SetDocumentLanguage(info.Language);

        Draw(brief, theme, pages, surface, measurer);
        surface.WriteOutline();

        CompressContentStreams(document);
        using var stream = new MemoryStream();
        document.Save(stream, false);
        return new ComposedPdf(ReproducibleBytes.Fix(stream.ToArray(), info.Date), pages.Count);
    }
}
