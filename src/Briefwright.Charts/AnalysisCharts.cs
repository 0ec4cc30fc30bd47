using System.Globalization;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Uncertainty;
using ScottPlot;

namespace Briefwright.Charts;

/// <summary>Charts of the reform over time, sensitivity and uncertainty.</summary>
public static class AnalysisCharts
{
    /// <summary>A shaded band of the headline path between two percentiles of the draws (in percent), in the first
    /// <paramref name="n"/> years.</summary>
    internal static void FanBand(Plot plot, double[] xs, IReadOnlyList<Percentiles> fan, int n,
        Func<Percentiles, double> low, Func<Percentiles, double> high, double alpha, string legend)
    {
        var band = plot.Add.FillY(xs, fan.Take(n).Select(p => 100 * low(p)).ToArray(),
            fan.Take(n).Select(p => 100 * high(p)).ToArray());
        band.FillColor = Palette.Band.WithAlpha(alpha);
        band.LineWidth = 0;
        band.LegendText = legend;
    }

    private static string F(ChartDrawing d, double v, string f = "0.0") => ChartRenderer.Number(d, v, f);

    private static string Pct(ChartDrawing d) => d.Text("number.percent", "%");

    /// <summary>Output per person relative to no reform, by calendar year, one line per option; the headline option's
    /// Monte Carlo band (5–95% and 25–75%), its dip and its break-even year are marked.</summary>
    public static Plot ReformPath(ChartDrawing d, AppraisalResults reform, string headlineId,
        IReadOnlyDictionary<string, string> labels, MonteCarloResults? mc, int? years = null,
        OptionStyles? styles = null)
    {
        styles ??= new OptionStyles(reform.Options.Select(o => o.OptionId));
        var plot = new Plot();
        ChartRenderer.Style(plot, d, d.Text("chart.axis.year", "Year"), d.Text("chart.axis.vs_no_reform",
            "Output per person vs no reform (%)"));
        int n = Math.Min(years ?? 80, reform.HorizonYears) + 1;
        double[] xs = Enumerable.Range(0, n).Select(t => (double)(reform.ReformYear + t)).ToArray();
        if (mc is not null)
        {
            FanBand(plot, xs, mc.HeadlineFan, n, p => p.P5, p => p.P95, 0.16, d.Text("chart.legend.p5_p95",
                "{0}: 5–95% of draws", labels[headlineId]));
            FanBand(plot, xs, mc.HeadlineFan, n, p => p.P25, p => p.P75, 0.3, d.Text("chart.legend.p25_p75",
                "25–75% of draws"));
        }
        var zero = plot.Add.HorizontalLine(0, 1, Palette.Neutral);
        zero.LinePattern = LinePattern.Solid;
        foreach (var o in reform.Options)
        {
            bool headline = o.OptionId == headlineId;
            var style = styles[o.OptionId];
            var line = plot.Add.ScatterLine(xs, o.Path.Gain.Take(n).Select(g => 100 * g).ToArray());
            line.Color = style.Color;
            line.LineWidth = headline ? 2.2f : 1.5f;
            line.LinePattern = style.Pattern;
            line.LegendText = labels[o.OptionId];
            if (!headline) continue;
            if (o.Path.DipYear is { } dy && o.Path.DipDepth is { } depth)
            {
                var dip = plot.Add.Marker(reform.ReformYear + dy, 100 * depth);
                dip.MarkerShape = MarkerShape.FilledTriangleDown;
                dip.MarkerSize = 9;
                dip.Color = Palette.Neutral;
                dip.LegendText = d.Text("chart.legend.dip", "Deepest dip, {0}: {1}", reform.ReformYear + dy,
                    F(d, 100 * depth, "0.00") + Pct(d));
            }
            if (o.PresentValues[0].BreakEvenYear is { } be && be < n)
            {
                var v = plot.Add.VerticalLine(reform.ReformYear + be);
                v.Color = Palette.Neutral;
                v.LinePattern = LinePattern.Dotted;
                v.LineWidth = 1.2f;
                v.LegendText = d.Text("chart.legend.break_even", "Break-even ({0}): {1}",
                    o.PresentValues[0].ScheduleLabel, reform.ReformYear + be);
            }
        }
        plot.Axes.SetLimitsX(xs[0], xs[^1]);
        plot.Axes.Bottom.TickGenerator = ChartRenderer.Ticks(d, "0");
        ChartRenderer.LegendInside(plot, Alignment.UpperLeft);
        return plot;
    }

    /// <summary>
    /// Tornado: the headline option's long-run change with each parameter at the low and high end of its range.
    /// </summary>
    public static Plot Tornado(ChartDrawing d, IReadOnlyList<OptionSwing> rows, double central, string optionLabel)
    {
        // Not options: the two ends of each range are drawn in the neutral tones.
        var plot = new Plot();
        ChartRenderer.Style(plot, d, d.Text("chart.axis.long_run_change", "Long-run change in output per person (%)"),
            "");
        var bars = new List<Bar>();
        var ticks = new List<Tick>();
        for (int i = 0; i < rows.Count; i++)
        {
            var r = rows[i].Row;
            double pos = rows.Count - 1 - i;
            double lo = rows[i].AtLowPct, hi = rows[i].AtHighPct;
            bars.Add(new Bar
            {
                Position = pos, ValueBase = central, Value = lo, FillColor = Palette.NeutralLight, Size = 0.6,
                Orientation = Orientation.Horizontal,
            });
            bars.Add(new Bar
            {
                Position = pos, ValueBase = central, Value = hi, FillColor = Palette.Neutral, Size = 0.6,
                Orientation = Orientation.Horizontal,
            });
            ticks.Add(new Tick(pos, d.Text("parameter." + r.Parameter, r.Label)));
        }
        var plotBars = plot.Add.Bars(bars);
        plotBars.Horizontal = true;
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks.ToArray());
        var c = plot.Add.VerticalLine(central);
        c.Color = Palette.Ink;
        c.LineWidth = 1;
        c.LegendText = d.Text("chart.legend.central", "{0}, central assumptions: {1}", optionLabel,
            F(d, central, "0.00") + Pct(d));
        var lowKey = plot.Add.Marker(double.NaN, double.NaN);
        lowKey.MarkerShape = MarkerShape.FilledSquare;
        lowKey.Color = Palette.NeutralLight;
        lowKey.LegendText = d.Text("chart.legend.low_end", "Parameter at the low end of its range");
        var highKey = plot.Add.Marker(double.NaN, double.NaN);
        highKey.MarkerShape = MarkerShape.FilledSquare;
        highKey.Color = Palette.Neutral;
        highKey.LegendText = d.Text("chart.legend.high_end", "Parameter at the high end of its range");
        // Room below the shortest bars for the legend.
        plot.Axes.SetLimitsY(-3.2, rows.Count - 0.3);
        ChartRenderer.LegendInside(plot, Alignment.LowerRight);
        return plot;
    }

    /// <summary>
    /// Heat map of a grid result (E* or the long-run change) over two parameters; cells that break a model rule are
    /// left blank.
    /// </summary>
    public static Plot Heatmap(ChartDrawing d, GridResult grid, string xLabel, string yLabel, string valueLabel,
        double xScale = 1, double yScale = 1)
    {
        var plot = new Plot();
        ChartRenderer.Style(plot, d, xLabel, yLabel);
        int nx = grid.X.Length, ny = grid.Y.Length;
        var data = new double[ny, nx];
        for (int i = 0; i < nx; i++)
            for (int j = 0; j < ny; j++)
                data[ny - 1 - j, i] = grid.Values[i][j] ?? double.NaN;
        var hm = plot.Add.Heatmap(data);
        hm.Colormap = new ScottPlot.Colormaps.CustomInterpolated(Palette.Sequential);
        var (left, right, bottom, top) = HeatmapEdges(grid, xScale, yScale);
        hm.Rectangle = new CoordinateRect(left, right, bottom, top);
        hm.Smooth = false;
        hm.NaNCellColor = Colors.White;
        plot.Axes.SetLimits(left, right, bottom, top);
        // The data area ends exactly at the outer cell edges, so edge cells are whole.
        plot.Axes.Margins(0, 0);
        var bar = plot.Add.ColorBar(hm, Edge.Right);
        bar.Label = valueLabel;
        ChartRenderer.SetFont(bar.LabelStyle, d.Family);
        ChartRenderer.SetFont(bar.Axis.TickLabelStyle, d.Family);
        bar.LabelStyle.FontSize = ChartRenderer.TitleSize;
        bar.Axis.TickLabelStyle.FontSize = ChartRenderer.TickSize;
        bar.Axis.TickGenerator = ChartRenderer.Ticks(d);
        return plot;
    }

    /// <summary>
    /// The outer edges of a heat map whose cells are centred on the grid values: half a grid step beyond the first and
    /// last value on each axis (one cell per value, each one step wide).
    /// </summary>
    public static (double Left, double Right, double Bottom, double Top) HeatmapEdges(
        GridResult grid, double xScale = 1, double yScale = 1)
    {
        int nx = grid.X.Length, ny = grid.Y.Length;
        double x0 = grid.X[0] * xScale, x1 = grid.X[^1] * xScale, y0 = grid.Y[0] * yScale, y1 = grid.Y[^1] * yScale;
        double dx = nx > 1 ? (x1 - x0) / (nx - 1) : 1, dy = ny > 1 ? (y1 - y0) / (ny - 1) : 1;
        return (x0 - dx / 2, x1 + dx / 2, y0 - dy / 2, y1 + dy / 2);
    }

    /// <summary>
    /// Distribution of the headline option's long-run change over the Monte Carlo draws, with its 5th, 50th and 95th
    /// percentiles.
    /// </summary>
    public static Plot Distribution(
        ChartDrawing d, MonteCarloResults mc, OptionUncertainty option, string optionLabel, OptionStyle? style = null)
    {
        var colour = style?.Color ?? Palette.Options[0];
        var plot = new Plot();
        ChartRenderer.Style(plot, d, d.Text("chart.axis.long_run_change", "Long-run change in output per person (%)"),
            d.Text("chart.axis.share_of_draws", "Share of draws (%)"));
        var sample = mc.HeadlineChangeSample;
        double lo = sample.Min(), hi = sample.Max();
        const int bins = 30;
        double width = (hi - lo) / bins;
        if (width <= 0) width = 1e-6;
        var counts = new double[bins];
        foreach (var v in sample) counts[Math.Min(bins - 1, (int)((v - lo) / width))]++;
        var bars = Enumerable.Range(0, bins).Select(b => new Bar
        {
            Position = lo + (b + 0.5) * width, Value = 100 * counts[b] / sample.Length, Size = width * 0.92,
            FillColor = colour.WithAlpha(0.7),
        }).ToList();
        var histogram = plot.Add.Bars(bars);
        histogram.LegendText = d.Text("chart.legend.share_of_draws", "{0}: share of draws", optionLabel);
        var p = option.LongRunChangePct;
        foreach (var (x, name, pattern) in new[]
                 {
                     (p.P5, d.Text("table.p5", "5th percentile"), LinePattern.Dashed),
                     (p.P50, d.Text("table.median", "Median"), LinePattern.Solid),
                     (p.P95, d.Text("table.p95", "95th percentile"), LinePattern.Dashed),
                 })
        {
            var v = plot.Add.VerticalLine(x);
            v.Color = Palette.Ink;
            v.LinePattern = pattern;
            v.LineWidth = 1.4f;
            v.LegendText = d.Text("chart.legend.percentile", "{0}: {1}", name, F(d, x, "0.00") + Pct(d));
        }
        plot.Axes.SetLimitsY(0, bars.Max(b => b.Value) * 1.15);
        ChartRenderer.LegendInside(plot, Alignment.UpperLeft);
        return plot;
    }
}
