using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts;

/// <summary>Applies the house style to a plot and renders it as vector PDF.</summary>
public static class ChartRenderer
{
    public const int Width = 470;
    public const int Height = 290;

    public static void Style(Plot plot, string xLabel, string yLabel)
    {
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

    public static byte[] ToPng(Plot plot, int width = Width * 2, int height = Height * 2) =>
        plot.GetImageBytes(width, height, ImageFormat.Png);

    public static string ToSvg(Plot plot, int width = Width, int height = Height) => plot.GetSvgXml(width, height);
}
