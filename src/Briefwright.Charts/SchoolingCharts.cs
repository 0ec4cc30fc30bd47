using System.Globalization;
using Briefwright.Model.Results;
using ScottPlot;

namespace Briefwright.Charts;

/// <summary>Charts of the balanced-growth comparison over schooling length.</summary>
public static class SchoolingCharts
{
    private static string F(double v, string f = "0.0") => ChartWords.Number(v, f);

    /// <summary>Output per person against years of schooling, with each option, E* and the band within 1% of the maximum.</summary>
    public static Plot OutputCurve(BalancedGrowthResults results)
    {
        var plot = new Plot();
        ChartRenderer.Style(plot, ChartWords.Text("chart.axis.years_of_schooling", "Years of schooling"), ChartWords.Text("chart.axis.output_index", "Output per person (index)"));
        var band = plot.Add.HorizontalSpan(results.Optimum.Within1Pct[0], results.Optimum.Within1Pct[1]);
        band.FillStyle.Color = Palette.Band;
        band.LineStyle.Width = 0;
        band.LegendText = ChartWords.Text("chart.legend.within_1pct", "Within 1% of the maximum");

        var xs = results.SchoolingCurve.Select(p => p.SchoolingYears).ToArray();
        var ys = results.SchoolingCurve.Select(p => p.OutputPerPerson).ToArray();
        var curve = plot.Add.ScatterLine(xs, ys);
        curve.Color = Palette.Primary;
        curve.LineWidth = 2;
        curve.LegendText = ChartWords.Text("chart.legend.output", "Output per person");

        var optimum = plot.Add.VerticalLine(results.Optimum.SchoolingYears);
        optimum.Color = Palette.Primary;
        optimum.LinePattern = LinePattern.Dashed;
        optimum.LineWidth = 1.2f;
        optimum.LegendText = ChartWords.Text("chart.legend.optimum", "E* = {0} years", F(results.Optimum.SchoolingYears));

        for (int i = 0; i < results.Options.Count; i++)
        {
            var o = results.Options[i];
            var marker = plot.Add.Marker(o.SchoolingYears, o.OutputPerPerson);
            marker.MarkerShape = Palette.Shapes[i % Palette.Shapes.Length];
            marker.MarkerSize = 8;
            marker.Color = i == 0 || o.IsBaseline ? Palette.Contrast : Palette.Series[(i + 1) % Palette.Series.Length];
            marker.LegendText = o.Label + (o.IsBaseline ? ChartWords.Text("table.baseline_suffix", " (baseline)") : "");
        }
        plot.Axes.SetLimitsY(0, ys.Max() * 1.08);
        plot.Axes.SetLimitsX(0, xs[^1]);
        ChartRenderer.LegendBelow(plot);
        return plot;
    }

    /// <summary>The two opposing forces: the worker share falls and human capital per worker rises with schooling.</summary>
    public static Plot OpposingForces(BalancedGrowthResults results)
    {
        var plot = new Plot();
        ChartRenderer.Style(plot, ChartWords.Text("chart.axis.years_of_schooling", "Years of schooling"), ChartWords.Text("chart.axis.worker_share", "Worker share (workers per person)"));
        var xs = results.SchoolingCurve.Select(p => p.SchoolingYears).ToArray();
        var share = plot.Add.ScatterLine(xs, results.SchoolingCurve.Select(p => p.WorkerShare).ToArray());
        share.Color = Palette.Primary;
        share.LineWidth = 2;
        share.LegendText = ChartWords.Text("chart.legend.worker_share", "Worker share (left axis)");

        var h = plot.Add.ScatterLine(xs, results.SchoolingCurve.Select(p => p.HumanCapitalPerWorker).ToArray());
        h.Color = Palette.Contrast;
        h.LineWidth = 2;
        h.LinePattern = LinePattern.Dashed;
        h.LegendText = ChartWords.Text("chart.legend.human_capital", "Human capital per worker (right axis)");
        h.Axes.YAxis = plot.Axes.Right;
        plot.Axes.Right.Label.Text = ChartWords.Text("chart.axis.human_capital", "Human capital per worker");
        plot.Axes.Right.Label.FontSize = 10;

        var baseline = results.Options.First(o => o.IsBaseline);
        var line = plot.Add.VerticalLine(baseline.SchoolingYears);
        line.Color = Palette.Neutral;
        line.LinePattern = LinePattern.Dotted;
        line.LegendText = ChartWords.Text("chart.legend.baseline", "Baseline, {0} years", F(baseline.SchoolingYears));
        plot.Axes.SetLimitsX(0, xs[^1]);
        plot.Axes.SetLimitsY(0, results.SchoolingCurve.Max(p => p.WorkerShare) * 1.1, plot.Axes.Left);
        plot.Axes.SetLimitsY(0, results.SchoolingCurve.Max(p => p.HumanCapitalPerWorker) * 1.1, plot.Axes.Right);
        ChartRenderer.LegendBelow(plot);
        return plot;
    }
}
