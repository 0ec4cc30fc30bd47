using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts;

/// <summary>
/// Serves the brief's body font to ScottPlot from bytes (no host fonts). ScottPlot caches typefaces by name,
/// so the resolver registers one fixed family name per process.
/// </summary>
public sealed class ChartFont : ScottPlot.IFontResolver
{
    public const string Family = "Briefwright Chart Sans";
    private static readonly object Gate = new();
    private static ChartFont? installed;
    private readonly SKTypeface regular;
    private readonly SKTypeface bold;

    private ChartFont(byte[] regularTtf, byte[] boldTtf)
    {
        regular = SKTypeface.FromData(SKData.CreateCopy(FontSubsetter.Subset(regularTtf, FontSubsetter.ChartCharacters)));
        bold = SKTypeface.FromData(SKData.CreateCopy(FontSubsetter.Subset(boldTtf, FontSubsetter.ChartCharacters)));
    }

    public static void Install(byte[] regularTtf, byte[] boldTtf)
    {
        lock (Gate)
        {
            if (installed is not null) return;
            installed = new ChartFont(regularTtf, boldTtf);
            Fonts.FontResolvers.Insert(0, installed);
            Fonts.Default = Family;
        }
    }

    public SKTypeface? CreateTypeface(string fontName, FontWeight weight, FontSlant slant, FontSpacing spacing) =>
        fontName == Family ? (weight >= FontWeight.SemiBold ? bold : regular) : null;

    public SKTypeface? CreateTypeface(string fontName, bool bold, bool italic) =>
        fontName == Family ? (bold ? this.bold : regular) : null;
}
