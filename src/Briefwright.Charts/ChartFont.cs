using System.Collections.Concurrent;
using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts;

/// <summary>
/// A font charts are drawn in, from TrueType bytes (no host fonts): made by the caller for one brief and carried in
/// its <see cref="ChartDrawing"/>. Its <see cref="Family"/> name is derived from the bytes (and, for a
/// <see cref="Variant"/>, from the extra characters), so the same name always stands for the same typefaces, whichever
/// brief made it first.
/// </summary>
public sealed class ChartFont
{
    private readonly byte[] regular, bold;

    private ChartFont(string family, byte[] regular, byte[] bold)
    {
        Family = family;
        this.regular = regular;
        this.bold = bold;
    }

    /// <summary>The name ScottPlot knows this font by.</summary>
    public string Family { get; }

    /// <summary>The font of these TrueType files, cut to <see cref="FontSubsetter.ChartCharacters"/>.</summary>
    public static ChartFont FromBytes(byte[] regularTtf, byte[] boldTtf)
    {
        string family = "Briefwright Chart " + Sha256Hex.OfAll([regularTtf, boldTtf], lengthPrefixed: true)[..16];
        ChartFontResolver.Register(family, () => (Typeface(regularTtf), Typeface(boldTtf)));
        return new ChartFont(family, regularTtf, boldTtf);
    }

    /// <summary>
    /// The font to draw charts in when their texts use <paramref name="characters"/>: this one when they all lie in
    /// <see cref="FontSubsetter.ChartCharacters"/>, else a variant of it cut to those ranges plus every other character
    /// used, whatever its script. Characters the font does not carry are left out here; <c>GlyphCheck</c> refuses them
    /// before any chart is drawn.
    /// </summary>
    public ChartFont Variant(IEnumerable<int> characters)
    {
        var extra = characters.Where(c => c >= 0x20 && !FontSubsetter.IsChartCharacter(c)).Distinct().Order().ToList();
        if (extra.Count == 0) return this;
        string name = Family + " " + Sha256Hex.Of(string.Join(",", extra))[..12];
        ChartFontResolver.Register(name, () => (Typeface(regular, extra), Typeface(bold, extra)));
        return new ChartFont(name, regular, bold);
    }

    private static SKTypeface Typeface(byte[] ttf, IReadOnlyCollection<int>? extra = null)
    {
        var ranges = extra is null
            ? FontSubsetter.ChartCharacters
            : FontSubsetter.ChartCharacters.Concat(extra.Select(c => (c, c))).ToArray();
        return SKTypeface.FromData(SKData.CreateCopy(FontSubsetter.Subset(ttf, ranges)));
    }
}

/// <summary>
/// The one piece of process-wide state in the chart library, because ScottPlot keeps its font resolvers in a static
/// list (<c>Fonts.FontResolvers</c>) and draws text by family name: an append-only, thread-safe table from a family
/// name to its typefaces. Every name is derived from the font bytes (<see cref="ChartFont"/>), so an entry never
/// changes meaning once added, and briefs drawn at the same time cannot see each other's choices: which font a chart
/// uses is set on the plot itself from its brief's <see cref="ChartDrawing"/>.
/// </summary>
internal sealed class ChartFontResolver : IFontResolver
{
    private static readonly ConcurrentDictionary<string, Lazy<(SKTypeface Regular, SKTypeface Bold)>> Families = new();
    private static readonly Lazy<ChartFontResolver> Installed = new(() =>
    {
        var resolver = new ChartFontResolver();
        Fonts.FontResolvers.Insert(0, resolver);
        return resolver;
    });

    /// <summary>Adds <paramref name="family"/> (once; its typefaces are made when first used) and installs the
    /// resolver.</summary>
    public static void Register(string family, Func<(SKTypeface Regular, SKTypeface Bold)> typefaces)
    {
        Families.TryAdd(family, new Lazy<(SKTypeface, SKTypeface)>(typefaces));
        _ = Installed.Value;
    }

    public SKTypeface? CreateTypeface(string fontName, FontWeight weight, FontSlant slant, FontSpacing spacing) =>
        Families.TryGetValue(fontName, out var f)
            ? (weight >= FontWeight.SemiBold ? f.Value.Bold : f.Value.Regular) : null;

    public SKTypeface? CreateTypeface(string fontName, bool bold, bool italic) =>
        Families.TryGetValue(fontName, out var f) ? (bold ? f.Value.Bold : f.Value.Regular) : null;
}
