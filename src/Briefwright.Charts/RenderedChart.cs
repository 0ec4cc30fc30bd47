namespace Briefwright.Charts;

/// <summary>
/// A chart ready to place: a one-page vector PDF of <see cref="WidthPt"/> × <see cref="HeightPt"/> points, its texts,
/// and (when annex files are wanted) the same chart as SVG and PNG.
/// </summary>
public sealed record RenderedChart(string Id, byte[] Pdf, double WidthPt, double HeightPt, string Caption, string AltText, string Source)
{
    public string? Svg { get; init; }
    public byte[]? Png { get; init; }

    public static RenderedChart From(string id, ScottPlot.Plot plot, string caption, string altText, string source, bool withImages) =>
        new(id, ChartRenderer.ToPdf(plot), ChartRenderer.Width, ChartRenderer.Height, caption, altText, source)
        {
            Svg = withImages ? ChartRenderer.ToSvg(plot) : null,
            Png = withImages ? ChartRenderer.ToPng(plot) : null,
        };
}
