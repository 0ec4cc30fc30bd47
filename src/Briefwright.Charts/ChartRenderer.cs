using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts;

/// <summary>Applies the house style to a plot and renders it as vector PDF.</summary>
public static partial class ChartRenderer
{
    public const int Width = 470;
    public const int Height = 290;

    public static void Style(Plot plot, string xLabel, string yLabel)
    {
        // ScottPlot remembers the typeface a family name first resolved to: drawing before the bundled font is
        // installed would fix a host font for the whole process, so that is refused outright.
        if (!ChartFont.IsInstalled)
            throw new InvalidOperationException("The chart font is not installed: call ChartFont.Install before building charts.");
        plot.Font.Set(ChartFont.Current);
        plot.XLabel(xLabel, 10);
        plot.YLabel(yLabel, 10);
        plot.Axes.Bottom.TickLabelStyle.FontSize = 9;
        plot.Axes.Left.TickLabelStyle.FontSize = 9;
        plot.Axes.Right.TickLabelStyle.FontSize = 9;
        plot.Grid.MajorLineColor = Palette.Grid;
        plot.FigureBackground.Color = Colors.White;
        plot.DataBackground.Color = Colors.White;
        plot.Axes.Color(Palette.Ink);
        plot.Legend.FontSize = 8.5f;
        plot.Legend.OutlineColor = Palette.Grid;
        if (ChartWords.DecimalMark is { } mark)
        {
            // Numbers on the axes in the brief's format (a decimal comma); the point stays when the language uses it.
            string Localised(double v) => Math.Round(v, 10).ToString("0.##########", System.Globalization.CultureInfo.InvariantCulture).Replace(".", mark, StringComparison.Ordinal).Replace("-", "−", StringComparison.Ordinal);
            plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericAutomatic { LabelFormatter = Localised };
            plot.Axes.Right.TickGenerator = new ScottPlot.TickGenerators.NumericAutomatic { LabelFormatter = Localised };
            plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericAutomatic { LabelFormatter = Localised };
        }
    }

    /// <summary>
    /// The legend under the plot, its entries flowing left to right and wrapping into rows: a single column of long
    /// entries would not fit under a chart of this height.
    /// </summary>
    public static void LegendBelow(Plot plot)
    {
        var panel = plot.ShowLegend(Edge.Bottom);
        panel.Legend.Orientation = Orientation.Horizontal;
        panel.Legend.TightHorizontalWrapping = true;
        FitLegend(panel.Legend, Width);
    }

    /// <summary>
    /// The legend panel reserves the height of the legend's last drawing (or of an unconstrained one): lay the legend
    /// out once at the chart's width so that the reserved height is that of the wrapped rows actually drawn.
    /// </summary>
    private static void FitLegend(Legend legend, int width)
    {
        // Laid out and "drawn" on a canvas without pixels: only the measurement it leaves behind is wanted.
        using var canvas = new SKNoDrawCanvas(width, 400);
        using var paint = Paint.NewDisposablePaint();
        legend.Render(canvas, paint, new PixelRect(0, width - 90, 0, 400), Alignment.UpperCenter);
    }

    public static byte[] ToPdf(Plot plot, int width = Width, int height = Height) => ToPdf(new[] { plot }, width, height);

    /// <summary>One page per plot, in order. Skia embeds each font once per document, so charts share it.</summary>
    public static byte[] ToPdf(IReadOnlyList<Plot> plots, int width = Width, int height = Height)
    {
        using var output = new MemoryStream();
        using (var stream = new SKManagedWStream(output))
        {
            var metadata = SKDocumentPdfMetadata.Default;
            metadata.RasterDpi = 72;
            metadata.Creator = "briefwright";
            metadata.Producer = "briefwright";
            using var document = SKDocument.CreatePdf(stream, metadata);
            foreach (var plot in plots)
            {
                var canvas = document.BeginPage(width, height);
                plot.Render(canvas, width, height);
                document.EndPage();
            }
            document.Close();
        }
        return output.ToArray();
    }

    /// <summary>
    /// The chart as it appears in the brief, rendered at <paramref name="scale"/> times its size (crisp on screens
    /// and slides). PNG rows are filtered with "up" and deflated at zlib level 3: about 20% larger files than the
    /// encoder's default, written eight times faster (the default made chart copies most of a batch's time).
    /// </summary>
    public static byte[] ToPng(Plot plot, int width = Width, int height = Height, int scale = 2)
    {
        var info = new SKImageInfo(width * scale, height * scale, SKColorType.Rgba8888, SKAlphaType.Premul);
        using var surface = SKSurface.Create(info);
        double before = plot.ScaleFactor;
        try
        {
            plot.ScaleFactor = scale;
            plot.Render(surface.Canvas, info.Width, info.Height);
        }
        finally
        {
            plot.ScaleFactor = before;
        }
        using var pixels = surface.PeekPixels();
        using var data = pixels.Encode(new SKPngEncoderOptions(SKPngEncoderFilterFlags.Up, 3))
            ?? throw new InvalidOperationException("The chart could not be encoded as PNG.");
        return data.ToArray();
    }

    /// <summary>
    /// The chart as SVG. Skia numbers clip paths and images from a counter shared by the whole process, so the same
    /// chart would get other ids after other charts; ids are renumbered in order of appearance to keep files identical.
    /// </summary>
    public static string ToSvg(Plot plot, int width = Width, int height = Height)
    {
        // Skia's SVG backend has no dashes: it draws dashed lines solid and prints a warning on the console for
        // each. Drawing them solid on purpose gives the same SVG without the noise; PDF and PNG keep the dashes.
        var dashed = plot.GetPlottables().OfType<IHasLine>().Where(p => p.LineStyle.Pattern.Intervals is { Length: > 0 }).Select(p => (Plottable: p, p.LineStyle.Pattern)).ToList();
        string svg;
        try
        {
            foreach (var d in dashed) d.Plottable.LineStyle.Pattern = LinePattern.Solid;
            svg = plot.GetSvgXml(width, height);
        }
        finally
        {
            foreach (var d in dashed) d.Plottable.LineStyle.Pattern = d.Pattern;
        }
        var ids = new Dictionary<string, string>(StringComparer.Ordinal);
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        return SvgId().Replace(svg, m =>
        {
            if (!ids.TryGetValue(m.Value, out var id))
            {
                string kind = m.Groups[1].Value;
                counts[kind] = counts.GetValueOrDefault(kind) + 1;
                ids[m.Value] = id = $"{kind}_{counts[kind]}";
            }
            return id;
        });
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"\b(cl|img)_([0-9a-f]+)\b")]
    private static partial System.Text.RegularExpressions.Regex SvgId();
}
