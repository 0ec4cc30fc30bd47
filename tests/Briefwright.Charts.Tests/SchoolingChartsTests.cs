using Briefwright.Model.Core;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;
using ScottPlot;

namespace Briefwright.Charts.Tests;

public class SchoolingChartsTests
{
    private static BalancedGrowthResults Results() => BalancedGrowth.Solve(new ModelInputs(
        new Demography(0.01, 6, 65, new RectangularSurvival(80), 0.75),
        new HumanCapital(BracketReturns.HallJones, null),
        new Production(0.2, 1.0 / 3, 0.03, 0.02),
        new[] { new PolicyOption("base", "Base", 11), new PolicyOption("more", "More", 12) },
        "base"));

    static SchoolingChartsTests()
    {
        string fonts = Path.Combine(RepositoryRoot.Path, "fonts");
        ChartFont.Install(
            File.ReadAllBytes(Path.Combine(fonts, "LiberationSans-Regular.ttf")),
            File.ReadAllBytes(Path.Combine(fonts, "LiberationSans-Bold.ttf")));
    }

    [Fact]
    public void Output_curve_marks_every_option_the_optimum_and_the_band()
    {
        var r = Results();
        var plot = SchoolingCharts.OutputCurve(r);
        Assert.Equal(r.Options.Count, plot.GetPlottables<ScottPlot.Plottables.Marker>().Count());
        var line = Assert.Single(plot.GetPlottables<ScottPlot.Plottables.VerticalLine>());
        Assert.Equal(r.Optimum.SchoolingYears, line.X, 12);
        var span = Assert.Single(plot.GetPlottables<ScottPlot.Plottables.HorizontalSpan>());
        Assert.Equal((r.Optimum.Within1Pct[0], r.Optimum.Within1Pct[1]), (span.X1, span.X2));
        Assert.Equal("Years of schooling", plot.Axes.Bottom.Label.Text);
    }

    [Fact]
    public void Opposing_forces_are_two_aligned_panels_without_a_second_y_axis()
    {
        var chart = SchoolingCharts.OpposingForces(Results());
        Assert.Equal(2, chart.Plots.Count);
        Assert.Equal(1.0, chart.Shares.Sum(), 9);
        foreach (var plot in chart.Plots)
        {
            var line = Assert.Single(plot.GetPlottables<ScottPlot.Plottables.Scatter>());
            Assert.True(
                line.Axes.YAxis is null || ReferenceEquals(line.Axes.YAxis, plot.Axes.Left),
                "the line is on the left axis");
            Assert.Equal("", plot.Axes.Right.Label.Text);
        }
        Assert.Contains("Worker share", chart.Plots[0].Axes.Left.Label.Text);
        Assert.Contains("Human capital", chart.Plots[1].Axes.Left.Label.Text);
        // Drawn, the two data areas share their left and right edges.
        ChartRenderer.ToPdf(chart);
        var upper = chart.Plots[0].RenderManager.LastRender.DataRect;
        var lower = chart.Plots[1].RenderManager.LastRender.DataRect;
        Assert.Equal(upper.Left, lower.Left, 3);
        Assert.Equal(upper.Right, lower.Right, 3);
        Assert.True(upper.Bottom <= lower.Top);
    }

    [Fact]
    public void Renders_to_the_same_vector_pdf_bytes_every_time()
    {
        var a = ChartRenderer.ToPdf(SchoolingCharts.OutputCurve(Results()));
        var b = ChartRenderer.ToPdf(SchoolingCharts.OutputCurve(Results()));
        Assert.Equal("%PDF-", System.Text.Encoding.ASCII.GetString(a, 0, 5));
        Assert.Equal(a, b);
    }

    [Fact]
    public void Uses_the_bundled_font_not_a_host_font()
    {
        var pdf = System.Text.Encoding.Latin1.GetString(ChartRenderer.ToPdf(SchoolingCharts.OutputCurve(Results())));
        Assert.Contains("LiberationSans", pdf);
        Assert.DoesNotContain("DejaVu", pdf);
    }

    [Fact]
    public void Png_copy_is_wide_enough_for_a_slide_and_the_same_every_time()
    {
        var a = ChartRenderer.ToPng(SchoolingCharts.OutputCurve(Results()));
        var b = ChartRenderer.ToPng(SchoolingCharts.OutputCurve(Results()));
        // PNG signature, then the IHDR chunk: width and height as big-endian 32-bit integers (PNG specification,
        // 11.2.2).
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, a[..8]);
        Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(a, 12, 4));
        Assert.True(ChartRenderer.PngWidth >= 1600);
        Assert.Equal(ChartRenderer.PngWidth, System.Buffers.Binary.BinaryPrimitives.ReadInt32BigEndian(a.AsSpan(16)));
        Assert.Equal(
            Math.Ceiling(ChartRenderer.Height * (double)ChartRenderer.PngWidth / ChartRenderer.Width),
            System.Buffers.Binary.BinaryPrimitives.ReadInt32BigEndian(a.AsSpan(20)),
            0);
        Assert.Equal(a, b);
    }

    [Fact]
    public void Svg_copy_is_the_same_however_many_charts_the_process_drew_before()
    {
        string first = ChartRenderer.ToSvg(SchoolingCharts.OutputCurve(Results()));
        ChartRenderer.ToSvg(SchoolingCharts.OpposingForces(Results()));
        string again = ChartRenderer.ToSvg(SchoolingCharts.OutputCurve(Results()));
        Assert.Contains("clip-path=\"url(#cl_1)\"", first);
        Assert.Equal(first, again);
    }

    [Fact]
    public void Svg_copy_leaves_the_dashed_lines_of_the_chart_dashed()
    {
        // Dashed lines are drawn solid in a stand-in colour for the SVG copy (Skia's SVG backend has no dashes), then
        // given their colour and a stroke-dasharray; the plot must come back with its dashes and colours.
        var plot = SchoolingCharts.OutputCurve(Results());
        (float[], Color)[] Lines() => plot.GetPlottables().OfType<IHasLine>()
            .Select(p => (p.LineStyle.Pattern.Intervals ?? Array.Empty<float>(), p.LineStyle.Color))
            .ToArray();
        var before = Lines();
        Assert.Contains(before, i => i.Item1.Length > 0);
        string svg = ChartRenderer.ToSvg(plot);
        Assert.Equal(before, Lines());
        // The E* line and its legend sample, both dashed, in the line's own colour; no stand-in colour left.
        var optimum = plot.GetPlottables<ScottPlot.Plottables.VerticalLine>().Single();
        string hex = $"#{optimum.Color.R:X2}{optimum.Color.G:X2}{optimum.Color.B:X2}";
        Assert.True(
            System.Text.RegularExpressions.Regex.Matches(svg, $"stroke=\"{hex}\" stroke-dasharray=").Count >= 2,
            svg.Length.ToString());
        Assert.DoesNotContain("#FE01", svg);
    }

    [Fact]
    public void Copies_carry_the_figure_title_and_source_line()
    {
        var texts = new ChartRenderer.CopyTexts(
            "Output per person against years of schooling",
            "briefwright model, scenario test");
        string svg = ChartRenderer.ToSvg(SchoolingCharts.OutputCurve(Results()), texts);
        Assert.Contains("Output per person against years of schooling", svg);
        Assert.Contains("Source: briefwright model, scenario test", svg);
        var png = ChartRenderer.ToPng(SchoolingCharts.OutputCurve(Results()), texts);
        int height = System.Buffers.Binary.BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20));
        Assert.True(
            height > ChartRenderer.Height * (double)ChartRenderer.PngWidth / ChartRenderer.Width + 40,
            $"{height} px leaves no room for title and source");
    }

    [Fact]
    public void Every_axis_writes_a_true_minus_sign()
    {
        var plot = new Plot();
        ChartRenderer.Style(plot, "x", "y");
        plot.Add.Scatter(new double[] { -3, 0, 3 }, new double[] { -2, 0, 2 });
        ChartRenderer.ToPdf(plot);
        var labels = new IAxis[] { plot.Axes.Bottom, plot.Axes.Left }.SelectMany(a => a.TickGenerator.Ticks)
            .Select(t => t.Label)
            .Where(l => l.Length > 0)
            .ToList();
        Assert.Contains(labels, l => l.StartsWith('\u2212'));
        Assert.DoesNotContain(labels, l => l.Contains('-'));
        Assert.Equal("0", ChartRenderer.Number(-0.0));
        Assert.Equal("\u22122.5", ChartRenderer.Number(-2.5));
    }
}
