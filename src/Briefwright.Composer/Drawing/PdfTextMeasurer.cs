using System.Collections.Concurrent;
using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;
using PdfSharp.Drawing;

namespace Briefwright.Composer.Drawing;

/// <summary>Measures text with PDFsharp's metrics for the bundled fonts, so layout matches what is drawn.</summary>
public sealed class PdfTextMeasurer : ITextMeasurer
{
    private readonly ConcurrentDictionary<FontSpec, XFont> fonts = new();
    private readonly ConcurrentDictionary<(string, FontSpec), double> widths = new();
    private readonly XGraphics context;
    private readonly object gate = new();

    private readonly string family;

    public PdfTextMeasurer(string family = BundledFonts.Family)
    {
        this.family = family;
        BundledFonts.Install();
        context = XGraphics.CreateMeasureContext(new XSize(2000, 2000), XGraphicsUnit.Point, XPageDirection.Downwards);
    }

    public XFont Font(FontSpec spec) => fonts.GetOrAdd(spec, s => new XFont(family, s.Size, s.Style switch
    {
        RunStyle.Bold => XFontStyleEx.Bold,
        RunStyle.Italic => XFontStyleEx.Italic,
        RunStyle.BoldItalic => XFontStyleEx.BoldItalic,
        _ => XFontStyleEx.Regular,
    }, new XPdfFontOptions(PdfSharp.Pdf.PdfFontEncoding.Unicode)));

    public double Width(string text, FontSpec font)
    {
        if (text.Length == 0) return 0;
        return widths.GetOrAdd((text, font), key =>
        {
            lock (gate) return context.MeasureString(key.Item1, Font(key.Item2)).Width;
        });
    }

    public double Ascent(FontSpec font)
    {
        var metrics = Font(font).Metrics;
        return font.Size * metrics.Ascent / metrics.UnitsPerEm;
    }
}
