namespace Briefwright.Charts;

/// <summary>
/// A chart ready to place: page <see cref="Page"/> (1-based) of a vector PDF of <see cref="WidthPt"/> × <see cref="HeightPt"/>
/// points that holds every chart of the brief, so the chart font is embedded once; its texts; and (when annex files are
/// wanted) the same chart as SVG and PNG.
/// </summary>
public sealed record RenderedChart(string Id, byte[] Pdf, int Page, double WidthPt, double HeightPt, string Caption, string AltText, string Source)
{
    public string? Svg { get; init; }
    public byte[]? Png { get; init; }
}

/// <summary>A chart before rendering: the plot and the texts that go with it.</summary>
public sealed record ChartSpec(string Id, ScottPlot.Plot Plot, string Caption, string AltText, string Source)
{
    /// <summary>Renders all charts into one multi-page PDF (one embedded font for all of them).</summary>
    public static IReadOnlyList<RenderedChart> RenderAll(IReadOnlyList<ChartSpec> specs, bool withImages)
    {
        byte[] pdf = ChartRenderer.ToPdf(specs.Select(s => s.Plot).ToList());
        return specs.Select((s, i) => new RenderedChart(s.Id, pdf, i + 1, ChartRenderer.Width, ChartRenderer.Height, s.Caption, s.AltText, s.Source)
        {
            Svg = withImages ? ChartRenderer.ToSvg(s.Plot) : null,
            Png = withImages ? ChartRenderer.ToPng(s.Plot) : null,
        }).ToList();
    }
}
