using ScottPlot;

namespace Briefwright.Charts;

/// <summary>
/// Our chart colours, the one place they are defined. Options take their colours from <see cref="Options"/> in
/// scenario order (see <see cref="OptionStyles"/>); everything that is not an option (bands, reference lines, the
/// plain curves) is drawn in the neutral tones, so a colour always means the same option.
/// </summary>
public static class Palette
{
    /// <summary>
    /// Five option colours (indigo, brick, rose, cornflower, ochre) chosen so every pair stays at least 29 CIE76 units
    /// apart under simulated protanopia and deuteranopia and at least 9 units of lightness apart in greyscale
    /// (checked by <c>PaletteTests</c>).
    /// </summary>
    public static readonly Color[] Options =
    {
        Color.FromHex("#1F2D86"), Color.FromHex("#A32E2A"), Color.FromHex("#C95A8A"), Color.FromHex("#78A6E6"),
        Color.FromHex("#D4BE3A"),
    };

    /// <summary>Reference lines and plain curves.</summary>
    public static readonly Color Neutral = Color.FromHex("#4A5059");

    /// <summary>Secondary neutral: the low end of a range, light reference marks.</summary>
    public static readonly Color NeutralLight = Color.FromHex("#A3A9B1");

    /// <summary>Shaded bands (ranges of draws, the band near the maximum).</summary>
    public static readonly Color Band = Color.FromHex("#7D848E");

    public static readonly Color Grid = Color.FromHex("#E3E7EC");
    public static readonly Color Ink = Color.FromHex("#1A1A1A");

    /// <summary>
    /// The heat map's sequential scale, light to dark, in neutral blue-greys so no cell reads as an option.
    /// </summary>
    public static readonly Color[] Sequential =
        { Color.FromHex("#F4F1E6"), Color.FromHex("#A9BCC6"), Color.FromHex("#2E3F4F") };

    /// <summary>Marker shapes that differ as well as colours, so options stay apart when printed in grey.</summary>
    public static readonly MarkerShape[] Shapes =
    {
        MarkerShape.FilledCircle, MarkerShape.FilledSquare, MarkerShape.FilledTriangleUp, MarkerShape.FilledDiamond,
        MarkerShape.OpenCircle, MarkerShape.OpenSquare,
    };

    /// <summary>Line patterns by option, the first solid.</summary>
    public static readonly LinePattern[] Patterns =
    {
        LinePattern.Solid, LinePattern.Dashed, LinePattern.DenselyDashed, LinePattern.Dotted, LinePattern.Solid,
        LinePattern.Dashed,
    };
}

/// <summary>How one option is drawn in every figure of a brief.</summary>
public sealed record OptionStyle(Color Color, MarkerShape Marker, LinePattern Pattern);

/// <summary>
/// The options' styles, assigned once per brief in scenario order: colour from the palette (the theme's
/// <c>chart_colours</c>, else <see cref="Palette.Options"/>), marker shape and line pattern by position, so an option
/// looks the same in every chart, the page-1 chart included.
/// </summary>
public sealed class OptionStyles
{
    private readonly Dictionary<string, OptionStyle> styles = new(StringComparer.Ordinal);

    /// <summary>
    /// Styles for <paramref name="optionIds"/> in order; the options compared come first and the baseline (drawn only
    /// as a marker or a reference) last, so the first option compared gets the first colour and a solid line.
    /// </summary>
    public OptionStyles(IEnumerable<string> optionIds, IReadOnlyList<Color>? palette = null, string? baselineId = null)
    {
        var colours = palette is { Count: > 0 } ? palette : Palette.Options;
        var ordered = optionIds.Where(id => id != baselineId).ToList();
        if (baselineId is not null && optionIds.Contains(baselineId)) ordered.Add(baselineId);
        for (int i = 0; i < ordered.Count; i++)
            styles[ordered[i]] = new OptionStyle(colours[i % colours.Count], Palette.Shapes[i % Palette.Shapes.Length],
                ordered[i] == baselineId ? LinePattern.Dotted : Palette.Patterns[i % Palette.Patterns.Length]);
    }

    /// <summary>Colours written #RRGGBB (a theme's <c>chart_colours</c>).</summary>
    public static IReadOnlyList<Color>? FromHex(IReadOnlyList<string>? hex) =>
        hex is { Count: > 0 } ? hex.Select(Color.FromHex).ToList() : null;

    public OptionStyle this[string optionId] => styles.TryGetValue(optionId, out var s)
        ? s
        : throw new KeyNotFoundException($"No chart style for option '{optionId}'.");

    public IReadOnlyCollection<string> Ids => styles.Keys;
}
