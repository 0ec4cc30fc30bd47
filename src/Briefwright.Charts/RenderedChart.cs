namespace Briefwright.Charts;

/// <summary>
/// A chart ready to place: page <see cref="Page"/> (1-based) of a vector PDF of <see cref="WidthPt"/> ×
/// <see cref="HeightPt"/> points that holds every chart of the brief, so the chart font is embedded once; its texts;
/// and (when annex files are wanted) the same chart as SVG and PNG.
/// </summary>
public sealed record RenderedChart(
    string Id, byte[] Pdf, int Page, double WidthPt, double HeightPt, string Caption, string AltText, string Source)
{
    public string? Svg { get; init; }
    public byte[]? Png { get; init; }
}

/// <summary>A chart before rendering: the plot and the texts that go with it.</summary>
public sealed record ChartSpec(string Id, ChartPanels Plot, string Caption, string AltText, string Source)
{
    /// <summary>Renders all charts into one multi-page PDF (one embedded font for all of them), and SVG and PNG copies
    /// (their title and source in <paramref name="drawing"/>'s font) if asked.</summary>
    public static IReadOnlyList<RenderedChart> RenderAll(IReadOnlyList<ChartSpec> specs, ChartDrawing drawing,
        bool withImages)
    {
        var charts = RenderPdf(specs);
        return withImages ? AddImages(charts, specs, drawing) : charts;
    }

    /// <summary>Renders all charts into one multi-page PDF (one embedded font for all of them).</summary>
    public static IReadOnlyList<RenderedChart> RenderPdf(IReadOnlyList<ChartSpec> specs)
    {
        byte[] pdf = ChartRenderer.ToPdf(specs.Select(s => s.Plot).ToList());
        return specs.Select((s, i) => new RenderedChart(s.Id, pdf, i + 1, ChartRenderer.Width, ChartRenderer.Height,
            s.Caption, s.AltText, s.Source)).ToList();
    }

    /// <summary>
    /// The same charts with their SVG and PNG copies, drawn from <paramref name="specs"/> (in the same order), on up to
    /// <paramref name="threads"/> threads: each chart is drawn by one thread, so the copies do not depend on the count.
    /// Their titles and source lines are written in <paramref name="drawing"/>'s font.
    /// </summary>
    public static IReadOnlyList<RenderedChart> AddImages(
        IReadOnlyList<RenderedChart> charts, IReadOnlyList<ChartSpec> specs, ChartDrawing drawing, int threads = 1)
    {
        var copies = new RenderedChart[charts.Count];
        Parallel.For(0, charts.Count, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(1, threads) },
            i =>
            {
                var texts = new ChartRenderer.CopyTexts(specs[i].Caption, specs[i].Source, drawing.Family);
                copies[i] = charts[i] with
                {
                    Svg = ChartRenderer.ToSvg(specs[i].Plot, texts), Png = ChartRenderer.ToPng(specs[i].Plot, texts),
                };
            });
        return copies;
    }
}
