using System.Globalization;
using Briefwright.Model.Results;
using ScottPlot;

namespace Briefwright.Charts;

/// <summary>Charts of the balanced-growth comparison over schooling length.</summary>
public static class SchoolingCharts
{
    private static string F(double v, string f = "0.0") => v.ToString(f, CultureInfo.InvariantCulture);

    /// <summary>Output per person against years of schooling, with each option, E* and the band within 1% of the maximum.</summary>
    public static Plot OutputCurve(BalancedGrowthResults results)
    {
        var plot = new Plot();
        ChartRenderer.Style(plot, "Years of schooling", "Output per person (index)");
        var band = plot.Add.HorizontalSpan(results.Optimum.Within1Pct[0], results.Optimum.Within1Pct[1]);
        band.FillStyle.Color = Palette.Band;
        band.LineStyle.Width = 0;
        band.LegendText = "Within 1% of the maximum";

        var xs = results.SchoolingCurve.Select(p => p.SchoolingYears).ToArray();
        var ys = results.SchoolingCurve.Select(p => p.OutputPerPerson).ToArray();
        var curve = plot.Add.ScatterLine(xs, ys);
        curve.Color = Palette.Primary;
        curve.LineWidth = 2;
        curve.LegendText = "Output per person";

        var optimum = plot.Add.VerticalLine(results.Optimum.SchoolingYears);
        optimum.Color = Palette.Primary;
        optimum.LinePattern = LinePattern.Dashed;
        optimum.LineWidth = 1.2f;
        optimum.LegendText = $"E* = {F(results.Optimum.SchoolingYears)} years";

        for (int i = 0; i < results.Options.Count; i++)
        {
            var o = results.Options[i];
            var marker = plot.Add.Marker(o.SchoolingYears, o.OutputPerPerson);
            marker.MarkerShape = Palette.Shapes[i % Palette.Shapes.Length];
            marker.MarkerSize = 8;
            marker.Color = i == 0 || o.IsBaseline ? Palette.Contrast : Palette.Series[(i + 1) % Palette.Series.Length];
            marker.LegendText = o.Label + (o.IsBaseline ? " (baseline)" : "");
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
        ChartRenderer.Style(plot, "Years of schooling", "Worker share (workers per person)");
        var xs = results.SchoolingCurve.Select(p => p.SchoolingYears).ToArray();
        var share = plot.Add.ScatterLine(xs, results.SchoolingCurve.Select(p => p.WorkerShare).ToArray());
        share.Color = Palette.Primary;
        share.LineWidth = 2;
        share.LegendText = "Worker share (left axis)";

        var h = plot.Add.ScatterLine(xs, results.SchoolingCurve.Select(p => p.HumanCapitalPerWorker).ToArray());
        h.Color = Palette.Contrast;
        h.LineWidth = 2;
        h.LinePattern = LinePattern.Dashed;
        h.LegendText = "Human capital per worker (right axis)";
        h.Axes.YAxis = plot.Axes.Right;
        plot.Axes.Right.Label.Text = "Human capital per worker";
        plot.Axes.Right.Label.FontSize = 10;

        var baseline = results.Options.First(o => o.IsBaseline);
        var line = plot.Add.VerticalLine(baseline.SchoolingYears);
        line.Color = Palette.Neutral;
        line.LinePattern = LinePattern.Dotted;
        line.LegendText = $"Baseline, {F(baseline.SchoolingYears)} years";
        plot.Axes.SetLimitsX(0, xs[^1]);
        plot.Axes.SetLimitsY(0, results.SchoolingCurve.Max(p => p.WorkerShare) * 1.1, plot.Axes.Left);
        plot.Axes.SetLimitsY(0, results.SchoolingCurve.Max(p => p.HumanCapitalPerWorker) * 1.1, plot.Axes.Right);
        ChartRenderer.LegendBelow(plot);
        return plot;
    }
}
