using ScottPlot;

namespace Briefwright.Charts;

/// <summary>
/// Our chart colours: a dark blue and a burnt orange carry the main contrast (distinguishable with the common
/// colour-vision deficiencies and in greyscale by lightness), with a teal, a plum and a grey for further series.
/// </summary>
public static class Palette
{
    public static readonly Color Primary = Color.FromHex("#1F4E79");
    public static readonly Color Contrast = Color.FromHex("#C8611A");
    public static readonly Color Third = Color.FromHex("#2B8C7E");
    public static readonly Color Fourth = Color.FromHex("#7A4F8F");
    public static readonly Color Neutral = Color.FromHex("#6B7280");
    public static readonly Color Band = Color.FromHex("#1F4E79").WithAlpha(0.13);
    public static readonly Color Grid = Color.FromHex("#E3E7EC");
    public static readonly Color Ink = Color.FromHex("#1A1A1A");

    public static readonly Color[] Series = { Primary, Contrast, Third, Fourth, Neutral };

    /// <summary>Marker shapes that differ as well as colours, so series stay apart when printed in grey.</summary>
    public static readonly MarkerShape[] Shapes = { MarkerShape.FilledCircle, MarkerShape.FilledSquare, MarkerShape.FilledTriangleUp, MarkerShape.FilledDiamond, MarkerShape.OpenCircle };
}
