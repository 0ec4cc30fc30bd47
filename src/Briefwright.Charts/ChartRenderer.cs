using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts;

/// <summary>Applies the house style to a plot and renders it as vector PDF.</summary>
public static partial class ChartRenderer
{
    public const int Width = 470;
    public const int Height = 290;

    /// <summary>Type sizes shared by every chart: axis titles, tick labels (colour bars too) and legends.</summary>
    public const float TitleSize = 10, TickSize = 9, LegendSize = 8.5f;

    /// <summary>The brief's minus sign (U+2212), used on every axis in place of the hyphen.</summary>
    public const char Minus = '\u2212';

    /// <summary>
    /// The house style, in <paramref name="drawing"/>'s font: set on every text of the plot itself (axis titles, ticks,
    /// legend), never through ScottPlot's process-wide default font, so that briefs drawn at the same time in other
    /// fonts cannot change this plot.
    /// </summary>
    public static void Style(Plot plot, ChartDrawing drawing, string xLabel, string yLabel)
    {
        SetFont(plot, drawing.Family);
        plot.XLabel(xLabel, TitleSize);
        plot.YLabel(yLabel, TitleSize);
        foreach (var axis in new IAxis[] { plot.Axes.Bottom, plot.Axes.Left, plot.Axes.Right })
        {
            axis.TickLabelStyle.FontSize = TickSize;
            axis.TickGenerator = Ticks(drawing);
        }
        plot.Grid.MajorLineColor = Palette.Grid;
        plot.FigureBackground.Color = Colors.White;
        plot.DataBackground.Color = Colors.White;
        plot.Axes.Color(Palette.Ink);
        plot.Legend.FontSize = LegendSize;
        plot.Legend.OutlineColor = Palette.Grid;
        // Long enough for a dash pattern to show in the legend sample as it does on the line.
        plot.Legend.SymbolWidth = 30;
    }

    /// <summary>
    /// The family on the plot's title, axis titles, tick labels and legend, set on the plot itself. ScottPlot's own
    /// way (<c>plot.Font.Set</c>) also writes process-wide defaults (<c>Fonts.Default</c>,
    /// <c>Fonts.DefaultFontStyle</c>) that every text made later in the process starts from, so a brief drawn at the
    /// same time would change this one's legend; those defaults are never written here. Labels get the regular face,
    /// as <c>plot.Font.Set</c> gave them; the legend's items, made when it is drawn, get the family's regular face by
    /// name.
    /// </summary>
    private static void SetFont(Plot plot, string family)
    {
        SetFont(plot.Axes.Title.Label, family);
        foreach (var axis in plot.Axes.GetAxes())
        {
            SetFont(axis.Label, family);
            SetFont(axis.TickLabelStyle, family);
        }
        plot.Legend.FontName = family;
    }

    /// <summary>The family's regular face on one text of a plot.</summary>
    internal static void SetFont(LabelStyle label, string family)
    {
        label.FontName = family;
        label.Font = Fonts.GetTypeface(family, FontWeight.Normal, FontSlant.Upright, FontSpacing.Normal);
    }

    /// <summary>Automatic ticks labelled with a true minus sign, the brief's decimal mark, and
    /// <paramref name="format"/> when given.</summary>
    public static ScottPlot.TickGenerators.NumericAutomatic Ticks(ChartDrawing drawing, string? format = null)
    {
        string? mark = drawing.Words.DecimalMark;
        return new() { LabelFormatter = v => Number(v, format, mark) };
    }

    /// <summary>A tick label: invariant digits, the brief's decimal mark, the minus sign U+2212, no "−0".</summary>
    public static string Number(ChartDrawing drawing, double v, string? format = null) =>
        Number(v, format, drawing.Words.DecimalMark);

    private static string Number(double v, string? format, string? mark)
    {
        if (Math.Abs(v) < 1e-12) v = 0;
        string text = v.ToString(format ?? "0.##########", System.Globalization.CultureInfo.InvariantCulture);
        if (text == "-0") text = "0";
        // The brief language's decimal mark (a comma in French, Spanish and German); the point stays otherwise.
        if (mark is not null) text = text.Replace(".", mark, StringComparison.Ordinal);
        return text.Replace('-', Minus);
    }

    /// <summary>A compact legend inside the data area, in the corner the chart leaves empty.</summary>
    public static void LegendInside(Plot plot, Alignment corner)
    {
        plot.ShowLegend(corner);
        plot.Legend.Orientation = Orientation.Vertical;
        plot.Legend.BackgroundColor = Colors.White;
        plot.Legend.ShadowColor = Colors.Transparent;
        plot.Legend.Padding = new PixelPadding(4);
        plot.Legend.Margin = new PixelPadding(4);
    }

    /// <summary>
    /// Draws the panels of a chart into the rectangle from (0, <paramref name="top"/>) of the given size.
    /// </summary>
    public static void Draw(SKCanvas canvas, ChartPanels chart, float width, float height, float top = 0)
    {
        float y = top;
        for (int i = 0; i < chart.Plots.Count; i++)
        {
            float h = (float)(height * chart.Shares[i]);
            chart.Plots[i].Render(canvas, new PixelRect(0, width, y + h, y));
            y += h;
        }
    }

    public static byte[] ToPdf(ChartPanels chart, int width = Width, int height = Height) =>
        ToPdf(new[] { chart }, width, height);

    /// <summary>One page per chart, in order. Skia embeds each font once per document, so charts share it.</summary>
    public static byte[] ToPdf(IReadOnlyList<ChartPanels> charts, int width = Width, int height = Height)
    {
        using var output = new MemoryStream();
        using (var stream = new SKManagedWStream(output))
        {
            var metadata = SKDocumentPdfMetadata.Default;
            metadata.RasterDpi = 72;
            metadata.Creator = "briefwright";
            metadata.Producer = "briefwright";
            using var document = SKDocument.CreatePdf(stream, metadata);
            foreach (var chart in charts)
            {
                var canvas = document.BeginPage(width, height);
                Draw(canvas, chart, width, height);
                document.EndPage();
            }
            document.Close();
        }
        return output.ToArray();
    }

    /// <summary>A tiny chart in <paramref name="drawing"/>'s font, as PDF: it goes through every step a brief's charts
    /// take (typefaces, subsetting, layout, PDF), for a caller that wants the library started before a brief needs
    /// it.</summary>
    public static byte[] SamplePdf(ChartDrawing drawing)
    {
        var plot = new Plot();
        Style(plot, drawing, "x", "y");
        var line = plot.Add.ScatterLine(new double[] { 0, 1, 2 }, new double[] { 1, 3, 2 });
        line.LegendText = "sample";
        return ToPdf(plot);
    }

    /// <summary>The width of the PNG copies in pixels: enough for a full-width slide.</summary>
    public const int PngWidth = 1600;

    /// <summary>A figure's title above a copy and its source line below, in <paramref name="Family"/> (the chart's
    /// font: <see cref="ChartDrawing.Family"/>).</summary>
    public sealed record CopyTexts(string Title, string Source, string Family);

    private const float CopyMargin = 10, CopyTitleSize = 11, CopySourceSize = 8;

    /// <summary>
    /// The lines of the title wrapped to the copy's width, and the heights above and below the chart.
    /// </summary>
    private static (List<string> Lines, float Above, float Below) CopyLayout(CopyTexts? texts, float width)
    {
        if (texts is null) return (new List<string>(), 0, 0);
        using var font = new SKFont(Fonts.GetTypeface(texts.Family, true, false), CopyTitleSize);
        var lines = new List<string>();
        string line = "";
        foreach (var word in texts.Title.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            string next = line.Length == 0 ? word : line + " " + word;
            if (line.Length > 0 && font.MeasureText(next) > width - 2 * CopyMargin) { lines.Add(line); line = word; }
            else line = next;
        }
        if (line.Length > 0) lines.Add(line);
        return (lines, CopyMargin + lines.Count * CopyTitleSize * 1.3f + 4, CopySourceSize * 1.3f + CopyMargin);
    }

    /// <summary>A copy: white page, title, the chart, and the source line, at scale 1 in points.</summary>
    private static void DrawCopy(SKCanvas canvas, ChartPanels chart, CopyTexts? texts,
        (List<string> Lines, float Above, float Below) layout, int width, int height)
    {
        canvas.Clear(SKColors.White);
        if (texts is not null)
        {
            using var paint = new SKPaint { IsAntialias = true, Color = new SKColor(0x1A, 0x1A, 0x1A) };
            using var bold = new SKFont(Fonts.GetTypeface(texts.Family, true, false), CopyTitleSize);
            for (int i = 0; i < layout.Lines.Count; i++)
                canvas.DrawText(layout.Lines[i], CopyMargin, CopyMargin + CopyTitleSize + i * CopyTitleSize * 1.3f,
                    SKTextAlign.Left, bold, paint);
            using var regular = new SKFont(Fonts.GetTypeface(texts.Family, false, false), CopySourceSize);
            paint.Color = new SKColor(0x55, 0x5B, 0x66);
            canvas.DrawText("Source: " + texts.Source, CopyMargin, layout.Above + height + CopySourceSize + 2,
                SKTextAlign.Left, regular, paint);
        }
        Draw(canvas, chart, width, height, layout.Above);
    }

    /// <summary>
    /// The chart as a PNG <see cref="PngWidth"/> pixels wide, with its title and source line when given. PNG rows are
    /// filtered with "up" and deflated at zlib level 1: larger files than the encoder's default, written many times
    /// faster (the default made chart copies most of a batch's time).
    /// </summary>
    public static byte[] ToPng(ChartPanels chart, CopyTexts? texts = null, int width = Width, int height = Height,
        int pixelWidth = PngWidth)
    {
        var layout = CopyLayout(texts, width);
        float scale = (float)pixelWidth / width;
        // Opaque pixels (the copy has a white page): the encoder writes RGB, a quarter less to filter and deflate,
        // which with the "up" filter at zlib level 1 encodes three times faster than RGBA (measured on the demo
        // charts).
        var info = new SKImageInfo(pixelWidth, (int)Math.Ceiling((height + layout.Above + layout.Below) * scale),
            SKColorType.Rgb888x, SKAlphaType.Opaque);
        using var surface = SKSurface.Create(info);
        surface.Canvas.Scale(scale);
        DrawCopy(surface.Canvas, chart, texts, layout, width, height);
        using var pixels = surface.PeekPixels();
        using var data = pixels.Encode(new SKPngEncoderOptions(SKPngEncoderFilterFlags.Up, 1))
            ?? throw new InvalidOperationException("The chart could not be encoded as PNG.");
        return data.ToArray();
    }

    /// <summary>
    /// The chart as SVG, with its title and source line when given. Skia's SVG backend has no dashes (it draws them
    /// solid and warns on the console): each dashed line is drawn solid in a stand-in colour of its own, and the
    /// stand-in is replaced by the real colour with a <c>stroke-dasharray</c>, legend samples included. Skia numbers
    /// clip paths and images from a counter shared by the whole process, so ids are renumbered in order of appearance
    /// to keep files identical.
    /// </summary>
    public static string ToSvg(ChartPanels chart, CopyTexts? texts = null, int width = Width, int height = Height)
    {
        var dashed = chart.Plottables.OfType<IHasLine>().Where(p => p.LineStyle.Pattern.Intervals is { Length: > 0 })
            .Select(p => (Plottable: p, p.LineStyle.Pattern, p.LineStyle.Color)).ToList();
        var layout = CopyLayout(texts, width);
        string svg;
        try
        {
            for (int i = 0; i < dashed.Count; i++)
            {
                dashed[i].Plottable.LineStyle.Pattern = LinePattern.Solid;
                dashed[i].Plottable.LineStyle.Color = StandIn(i).WithAlpha(dashed[i].Color.A / 255.0);
            }
            using var stream = new SKDynamicMemoryWStream();
            using (var canvas = SKSvgCanvas.Create(
                new SKRect(0, 0, width, height + layout.Above + layout.Below), stream))
                DrawCopy(canvas, chart, texts, layout, width, height);
            using var data = stream.DetachAsData();
            svg = System.Text.Encoding.UTF8.GetString(data.AsSpan());
        }
        finally
        {
            foreach (var d in dashed)
            {
                d.Plottable.LineStyle.Pattern = d.Pattern;
                d.Plottable.LineStyle.Color = d.Color;
            }
        }
        for (int i = 0; i < dashed.Count; i++)
        {
            var c = dashed[i].Color;
            string dash = string.Join(" ", dashed[i].Pattern.Intervals!
                .Select(v => v.ToString("0.##", System.Globalization.CultureInfo.InvariantCulture)));
            svg = svg.Replace($"stroke=\"{Hex(StandIn(i))}\"", $"stroke=\"{Hex(c)}\" stroke-dasharray=\"{dash}\"");
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

    /// <summary>A colour no chart uses, one per dashed line of a chart.</summary>
    private static Color StandIn(int i) => new(0xFE, 0x01, (byte)(0x10 + i));

    private static string Hex(Color c) => $"#{c.R:X2}{c.G:X2}{c.B:X2}";

    [System.Text.RegularExpressions.GeneratedRegex(@"\b(cl|img)_([0-9a-f]+)\b")]
    private static partial System.Text.RegularExpressions.Regex SvgId();
}
