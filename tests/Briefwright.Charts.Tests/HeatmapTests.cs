using Briefwright.Model.Uncertainty;
using ScottPlot;
using SkiaSharp;

namespace Briefwright.Charts.Tests;

/// <summary>
/// The heat map's cells, read back from the drawn pixels: one per grid value, centred on it, edge cells whole.
/// </summary>
public class HeatmapTests
{
    static HeatmapTests()
    {
        string fonts = Path.Combine(RepositoryRoot.Path, "fonts");
        ChartFont.Install(
            File.ReadAllBytes(Path.Combine(fonts, "LiberationSans-Regular.ttf")),
            File.ReadAllBytes(Path.Combine(fonts, "LiberationSans-Bold.ttf")));
    }

    /// <summary>A checkerboard, so any two neighbouring cells differ in colour.</summary>
    private static GridResult Checkerboard(int nx, int ny)
    {
        double[] xs = Enumerable.Range(0, nx).Select(i => 0.01 + 0.005 * i).ToArray();
        double[] ys = Enumerable.Range(0, ny).Select(j => 10.0 + 2 * j).ToArray();
        var values = Enumerable.Range(0, nx).Select(
            i => Enumerable.Range(0, ny).Select(j => (double?)((i + j) % 2 == 0 ? 1.0 : 5.0)).ToArray()).ToArray();
        return new GridResult(new GridSpec("x", xs[0], xs[^1], "y", ys[0], ys[^1], nx, "optimum"), xs, ys, values, 0);
    }

    [Theory]
    [InlineData(9, 9)]
    [InlineData(5, 7)]
    public void Cells_sit_on_their_tick_values_and_the_edge_cells_are_whole(int nx, int ny)
    {
        var grid = Checkerboard(nx, ny);
        var plot = AnalysisCharts.Heatmap(grid, "x (%)", "y", "value", xScale: 100);
        const int scale = 4;
        var png = ChartRenderer.ToPng(plot, pixelWidth: ChartRenderer.Width * scale);
        using var bitmap = SKBitmap.Decode(png);
        double dx = (grid.X[1] - grid.X[0]) * 100, dy = grid.Y[1] - grid.Y[0];
        var area = plot.RenderManager.LastRender.DataRect;
        // Pixel of a coordinate, from the drawn data area and the axis limits (in points, then to pixels).
        var limits = plot.Axes.GetLimits();
        (int X, int Y) Px(double x, double y) => (
            (int)Math.Round(scale * (area.Left + (x - limits.Left) / (limits.Right - limits.Left) * area.Width)),
            (int)Math.Round(scale * (area.Bottom - (y - limits.Bottom) / (limits.Top - limits.Bottom) * area.Height)));
        SKColor At(double x, double y) { var p = Px(x, y); return bitmap.GetPixel(p.X, p.Y); }

        // The data area ends at the outer cell edges: half a step beyond the first and last values.
        Assert.Equal(grid.X[0] * 100 - dx / 2, limits.Left, 9);
        Assert.Equal(grid.X[^1] * 100 + dx / 2, limits.Right, 9);
        Assert.Equal(grid.Y[0] - dy / 2, limits.Bottom, 9);
        Assert.Equal(grid.Y[^1] + dy / 2, limits.Top, 9);
        for (int i = 0; i < nx; i++)
            for (int j = 0; j < ny; j++)
            {
                double x = grid.X[i] * 100, y = grid.Y[j];
                var centre = At(x, y);
                // The whole cell, edge cells included, has the centre's colour (0.4 of a step each way)...
                foreach (var (ox, oy) in new[] {
                    (-0.4, 0.0),
                    (0.4, 0.0),
                    (0.0, -0.4),
                    (0.0, 0.4),
                    (-0.4, -0.4),
                    (0.4, 0.4) })
                    Assert.True(
                        At(x + ox * dx, y + oy * dy) == centre,
                        $"cell ({i}, {j}) is not whole or not centred at offset ({ox}, {oy})");
                // ...and the neighbour's colour starts past the half step.
                if (i + 1 < nx) Assert.True(
                    At(x + 0.6 * dx, y) != centre,
                    $"cell ({i}, {j}) runs into its right neighbour");
                if (j + 1 < ny) Assert.True(At(x, y + 0.6 * dy) != centre, $"cell ({i}, {j}) runs into the cell above");
            }
    }
}
