using System.Globalization;
using Briefwright.Model.Results;
using ScottPlot;

namespace Briefwright.Charts;

/// <summary>Charts of the balanced-growth comparison over schooling length.</summary>
public static class SchoolingCharts
{
    private static string F(ChartDrawing d, double v, string f = "0.0") => ChartRenderer.Number(d, v, f);

    /// <summary>
    /// Output per person against years of schooling, with each option, E* and the band within 1% of the maximum.
    /// </summary>
    public static Plot OutputCurve(ChartDrawing d, BalancedGrowthResults results, OptionStyles? styles = null)
    {
        styles ??= new OptionStyles(results.Options.Select(o => o.Id));
        var plot = new Plot();
        ChartRenderer.Style(plot, d, d.Text("chart.axis.years_of_schooling", "Years of schooling"),
            d.Text("chart.axis.output_index", "Output per person (index)"));
        var band = plot.Add.HorizontalSpan(results.Optimum.Within1Pct[0], results.Optimum.Within1Pct[1]);
        band.FillStyle.Color = Palette.Band.WithAlpha(0.18);
        band.LineStyle.Width = 0;
        band.LegendText = d.Text("chart.legend.within_1pct", "Within 1% of the maximum");

        var xs = results.SchoolingCurve.Select(p => p.SchoolingYears).ToArray();
        var ys = results.SchoolingCurve.Select(p => p.OutputPerPerson).ToArray();
        var curve = plot.Add.ScatterLine(xs, ys);
        curve.Color = Palette.Neutral;
        curve.LineWidth = 2;
        curve.LegendText = d.Text("chart.legend.output", "Output per person");

        var optimum = plot.Add.VerticalLine(results.Optimum.SchoolingYears);
        optimum.Color = Palette.Neutral;
        optimum.LinePattern = LinePattern.Dashed;
        optimum.LineWidth = 1.2f;
        optimum.LegendText = d.Text("chart.legend.optimum", "E* = {0} years", F(d, results.Optimum.SchoolingYears));

        foreach (var o in results.Options)
        {
            var style = styles[o.Id];
            var marker = plot.Add.Marker(o.SchoolingYears, o.OutputPerPerson);
            marker.MarkerShape = style.Marker;
            marker.MarkerSize = 8;
            marker.Color = style.Color;
            marker.MarkerLineWidth = 1.5f;
            marker.LegendText = o.Label + (o.IsBaseline ? d.Text("table.baseline_suffix", " (baseline)") : "");
        }
        plot.Axes.SetLimitsY(0, ys.Max() * 1.08);
        plot.Axes.SetLimitsX(0, xs[^1]);
        ChartRenderer.LegendInside(plot, Alignment.LowerRight);
        return plot;
    }

    /// <summary>Share of the height of the upper panel of <see cref="OpposingForces"/>.</summary>
    private const double UpperShare = 0.47;

    /// <summary>
    /// The two opposing forces in two aligned panels over the same schooling axis (no second y-axis): above, the
    /// worker share falls; below, human capital per worker rises. The baseline option is marked in both.
    /// </summary>
    public static ChartPanels OpposingForces(ChartDrawing d, BalancedGrowthResults results, OptionStyles? styles = null)
    {
        styles ??= new OptionStyles(results.Options.Select(o => o.Id));
        var xs = results.SchoolingCurve.Select(p => p.SchoolingYears).ToArray();
        var baseline = results.Options.First(o => o.IsBaseline);
        var style = styles[baseline.Id];
        // The same padding for both panels, so their data areas share left and right edges.
        var upper = Panel(d, "", d.Text("chart.axis.worker_share", "Worker share"), xs,
            results.SchoolingCurve.Select(p => p.WorkerShare).ToArray(),
            d.Text("chart.legend.worker_share", "Workers per person"), new PixelPadding(58, 12, 22, 8));
        var lower = Panel(d, d.Text("chart.axis.years_of_schooling", "Years of schooling"),
            d.Text("chart.axis.human_capital", "Human capital"), xs,
            results.SchoolingCurve.Select(p => p.HumanCapitalPerWorker).ToArray(),
            d.Text("chart.legend.human_capital", "Human capital per worker"), new PixelPadding(58, 12, 40, 8));
        foreach (var (plot, legend) in new[] { (upper, true), (lower, false) })
        {
            var line = plot.Add.VerticalLine(baseline.SchoolingYears);
            line.Color = style.Color;
            line.LinePattern = LinePattern.Dotted;
            line.LineWidth = 1.4f;
            if (legend) line.LegendText = baseline.Label + d.Text("table.baseline_suffix", " (baseline)");
        }
        ChartRenderer.LegendInside(upper, Alignment.UpperRight);
        ChartRenderer.LegendInside(lower, Alignment.UpperLeft);
        return new ChartPanels(new[] { upper, lower }, new[] { UpperShare, 1 - UpperShare });
    }

    private static Plot Panel(ChartDrawing d, string xLabel, string yLabel, double[] xs, double[] ys, string legend,
        PixelPadding padding)
    {
        var plot = new Plot();
        ChartRenderer.Style(plot, d, xLabel, yLabel);
        var line = plot.Add.ScatterLine(xs, ys);
        line.Color = Palette.Neutral;
        line.LineWidth = 2;
        line.LegendText = legend;
        plot.Axes.SetLimitsX(0, xs[^1]);
        plot.Axes.SetLimitsY(0, ys.Max() * 1.1);
        plot.Layout.Fixed(padding);
        return plot;
    }
}
