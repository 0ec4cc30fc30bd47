using System.Globalization;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Uncertainty;
using ScottPlot;

namespace Briefwright.Charts;

/// <summary>
/// Page 1's chart: the headline option's output per person against no reform, year by year, with the 5–95% band of
/// the Monte Carlo draws when there are any. One line and one band, so that it reads at a glance.
/// </summary>
public static class HeadlinePathChart
{
    /// <summary>Years shown: the first 80 after the reform, or the whole horizon if shorter.</summary>
    public const int Years = 80;

    public static Plot Build(ReformPath path, string label, MonteCarloResults? mc, OptionStyle? style = null)
    {
        style ??= new OptionStyles([path.OptionId])[path.OptionId];
        var plot = new Plot();
        ChartRenderer.Style(plot, ChartWords.Text("chart.axis.year", "Year"), ChartWords.Text("chart.axis.vs_no_reform", "Output per person vs no reform (%)"));
        int n = Math.Min(Years, path.Horizon) + 1;
        double[] xs = Enumerable.Range(0, n).Select(t => (double)(path.ReformYear + t)).ToArray();
        if (mc is not null)
            AnalysisCharts.FanBand(plot, xs, mc.HeadlineFan, n, p => p.P5, p => p.P95, 0.16, ChartWords.Text("chart.legend.band_90", "90% of model runs with uncertain assumptions"));
        var zero = plot.Add.HorizontalLine(0, 1, Palette.Neutral);
        zero.LinePattern = LinePattern.Solid;
        var line = plot.Add.ScatterLine(xs, path.Gain.Take(n).Select(g => 100 * g).ToArray());
        line.Color = style.Color;
        line.LinePattern = style.Pattern;
        line.LineWidth = 2.2f;
        line.LegendText = label;
        plot.Axes.SetLimitsX(xs[0], xs[^1]);
        plot.Axes.Bottom.TickGenerator = ChartRenderer.Ticks("0");
        ChartRenderer.LegendInside(plot, Alignment.UpperLeft);
        return plot;
    }
}
