using Briefwright.Charts;
using ScottPlot;
using SkiaSharp;

namespace Briefwright.Brief.Tests;

/// <summary>
/// The demo brief's charts, drawn: one style per option across figures, one set of type sizes, axis titles that fit.
/// </summary>
public class ChartConsistencyTests
{
    private static IReadOnlyList<ChartSpec> DemoCharts()
    {
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-national"));
        var specs = BriefBuilder.ChartSpecs(solved);
        ChartSpec.RenderPdf(specs);
        return specs;
    }

    [Fact]
    public void Each_option_has_one_colour_in_every_figure_and_the_headline_chart_uses_it()
    {
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-national"));
        var specs = BriefBuilder.ChartSpecs(solved);
        var labels = solved.Scenario.Inputs.Options.ToDictionary(o => o.Label, o => o.Id);
        var seen = new Dictionary<string, Color>();
        int checkedItems = 0;
        foreach (var spec in specs)
            foreach (var plottable in spec.Plot.Plottables)
            {
                string? legend = plottable switch
                {
                    ScottPlot.Plottables.Scatter s => s.LegendText,
                    ScottPlot.Plottables.Marker m => m.LegendText,
                    _ => null,
                };
                if (legend is null) continue;
                string label = legend.Replace(" (baseline)", "");
                if (!labels.TryGetValue(label, out var id)) continue;
                var colour = plottable is ScottPlot.Plottables.Scatter sc
                    ? sc.Color
                    : ((ScottPlot.Plottables.Marker)plottable).Color;
                if (seen.TryGetValue(id, out var before)) Assert.True(
                    before == colour,
                    $"{spec.Id}: {label} is drawn in {colour}, elsewhere in {before}");
                else seen[id] = colour;
                checkedItems++;
            }
        Assert.Equal(solved.Scenario.Inputs.Options.Count, seen.Count);
        Assert.Equal(seen.Count, seen.Values.Distinct().Count());
        Assert.True(checkedItems > seen.Count, "options appear in more than one figure");
        var headline = specs.Single(s => s.Id == "headline-path").Plot.Plots[0]
            .GetPlottables<ScottPlot.Plottables.Scatter>()
            .Single();
        Assert.Equal(seen[solved.Analysis.HeadlineOptionId], headline.Color);
    }

    [Fact]
    public void Every_chart_uses_the_same_type_sizes()
    {
        foreach (var spec in DemoCharts())
            foreach (var plot in spec.Plot.Plots)
            {
                foreach (var axis in new IAxis[] { plot.Axes.Bottom, plot.Axes.Left })
                {
                    Assert.Equal(ChartRenderer.TickSize, axis.TickLabelStyle.FontSize);
                    if (axis.Label.Text.Length > 0) Assert.Equal(ChartRenderer.TitleSize, axis.Label.FontSize);
                }
                Assert.Equal(ChartRenderer.LegendSize, plot.Legend.FontSize);
                foreach (var bar in plot.Axes.GetPanels().OfType<ScottPlot.Panels.ColorBar>())
                {
                    Assert.Equal(ChartRenderer.TitleSize, bar.LabelStyle.FontSize);
                    Assert.Equal(ChartRenderer.TickSize, bar.Axis.TickLabelStyle.FontSize);
                }
            }
    }

    [Fact]
    public void No_axis_title_is_longer_than_its_axis()
    {
        foreach (var spec in DemoCharts())
            foreach (var plot in spec.Plot.Plots)
            {
                var area = plot.RenderManager.LastRender.DataRect;
                foreach (var (axis, length) in new (IAxis, float)[] {
                    (plot.Axes.Bottom, area.Width),
                    (plot.Axes.Left, area.Height) })
                {
                    if (axis.Label.Text.Length == 0) continue;
                    using var font = new SKFont(
                        Fonts.GetTypeface(ChartFont.Current, axis.Label.Bold, false),
                        axis.Label.FontSize);
                    float width = font.MeasureText(axis.Label.Text);
                    Assert.True(
                        width <= length,
                        $"{spec.Id}: '{axis.Label.Text}' is {width:0} pt long on an axis of {length:0} pt");
                }
            }
    }

    [Fact]
    public void Legends_sit_inside_the_chart_not_below_it()
    {
        foreach (var spec in DemoCharts())
            foreach (var plot in spec.Plot.Plots.Where(p => p.Legend.IsVisible))
                Assert.DoesNotContain(plot.Axes.GetPanels(), p => p is ScottPlot.Panels.LegendPanel);
    }

    [Fact]
    public void The_theme_palette_reaches_the_charts()
    {
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-national"));
        var colours = new[] { "#112233", "#445566", "#778899", "#AA5500" };
        var specs = BriefBuilder.ChartSpecs(solved, chartColours: colours);
        var headline = specs.Single(s => s.Id == "headline-path").Plot.Plots[0]
            .GetPlottables<ScottPlot.Plottables.Scatter>()
            .Single();
        Assert.Equal(Color.FromHex("#112233"), headline.Color);
        var markers = specs.Single(s => s.Id == "output-curve").Plot.Plots[0]
            .GetPlottables<ScottPlot.Plottables.Marker>()
            .Select(m => m.Color)
            .ToHashSet();
        Assert.Equal(colours.Select(Color.FromHex).ToHashSet(), markers);
    }
}
