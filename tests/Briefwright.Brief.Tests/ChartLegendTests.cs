using SkiaSharp;

namespace Briefwright.Brief.Tests;

public class ChartLegendTests
{
    [Theory]
    [InlineData("reform-path")]
    [InlineData("output-curve")]
    [InlineData("opposing-forces")]
    [InlineData("tornado")]
    [InlineData("distribution")]
    public void Legend_under_the_chart_is_drawn_whole(string chart)
    {
        // The legend panel reserves space from a measurement of the legend; when it reserved too little, the last
        // entries and the frame ran off the bottom of the chart. A whole legend leaves the chart's bottom rows blank.
        // A fresh plot each time: the first drawing of a plot is the one that used to go wrong.
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-national"));
        BriefBuilder.InstallChartFont();
        var plot = chart switch
        {
            "output-curve" => Charts.SchoolingCharts.OutputCurve(solved.BalancedGrowth),
            "opposing-forces" => Charts.SchoolingCharts.OpposingForces(solved.BalancedGrowth),
            _ => AnalysisChartSet.Specs(solved, "test").Single(c => c.Id == chart).Plot,
        };
        var png = Charts.ChartRenderer.ToPng(plot);
        using var bitmap = SKBitmap.Decode(png);
        for (int y = bitmap.Height - 4; y < bitmap.Height; y++)
            for (int x = 0; x < bitmap.Width; x++)
                Assert.True(bitmap.GetPixel(x, y) == SKColors.White, $"{chart}: pixel ({x}, {y}) is {bitmap.GetPixel(x, y)}, not white");
    }
}
