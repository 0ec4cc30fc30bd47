using Briefwright.Composer.Drawing;

namespace Briefwright.Composer;

/// <summary>
/// What one build lays out and draws text with: its font family and a text measurer of its own (its own measuring
/// context and width cache, which live as long as the session). The caller creates one per brief and passes it down;
/// briefs built in parallel each measure in their own session and never wait for one another.
/// </summary>
public sealed class RenderSession(string? fontFamily = null)
{
    private PdfTextMeasurer? measurer;

    /// <summary>The family registered with <see cref="BundledFonts.Register"/>, or the bundled one.</summary>
    public string Family { get; } = fontFamily ?? BundledFonts.Family;

    /// <summary>The session's measurer, made when first asked for (it opens a measuring context).</summary>
    public PdfTextMeasurer Measurer => measurer ??= new PdfTextMeasurer(Family);
}
