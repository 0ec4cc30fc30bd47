using Briefwright.Composer.Drawing;

namespace Briefwright.Composer;

/// <summary>
/// What one build lays out and draws text with: its fonts (a theme's <see cref="FontFaces"/>, or the bundled ones) and
/// a text measurer of its own (its own measuring context and width cache, which live as long as the session). The
/// caller creates one per brief and passes it down; briefs built in parallel each measure in their own session and
/// never wait for one another.
/// </summary>
public sealed class RenderSession
{
    private PdfTextMeasurer? measurer;

    /// <summary>A session in the bundled fonts, or in <paramref name="fonts"/> (made known to PDFsharp here).</summary>
    public RenderSession(FontFaces? fonts = null)
    {
        Fonts = fonts;
        if (fonts is not null) PdfFontResolver.Register(fonts);
        Family = fonts?.Family ?? BundledFonts.Family;
    }

    /// <summary>The theme's fonts; null for the bundled ones.</summary>
    public FontFaces? Fonts { get; }

    /// <summary>The family the brief's text is set in.</summary>
    public string Family { get; }

    /// <summary>The session's measurer, made when first asked for (it opens a measuring context).</summary>
    public PdfTextMeasurer Measurer => measurer ??= new PdfTextMeasurer(Family);
}
