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
        ChartFont.Install(File.ReadAllBytes(Path.Combine(fonts, "LiberationSans-Regular.ttf")), File.ReadAllBytes(Path.Combine(fonts, "LiberationSans-Bold.ttf")));
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
    public void Opposing_forces_puts_human_capital_on_the_right_axis()
    {
        var plot = SchoolingCharts.OpposingForces(Results());
        var lines = plot.GetPlottables<ScottPlot.Plottables.Scatter>().ToList();
        Assert.Equal(2, lines.Count);
        Assert.Same(plot.Axes.Right, lines[1].Axes.YAxis);
        Assert.Contains("Human capital", plot.Axes.Right.Label.Text);
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
    public void Png_copy_is_the_brief_chart_at_twice_its_size_and_the_same_every_time()
    {
        var a = ChartRenderer.ToPng(SchoolingCharts.OutputCurve(Results()));
        var b = ChartRenderer.ToPng(SchoolingCharts.OutputCurve(Results()));
        // PNG signature, then the IHDR chunk: width and height as big-endian 32-bit integers (PNG specification, 11.2.2).
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, a[..8]);
        Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(a, 12, 4));
        Assert.Equal(2 * ChartRenderer.Width, System.Buffers.Binary.BinaryPrimitives.ReadInt32BigEndian(a.AsSpan(16)));
        Assert.Equal(2 * ChartRenderer.Height, System.Buffers.Binary.BinaryPrimitives.ReadInt32BigEndian(a.AsSpan(20)));
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
        // Dashed lines are drawn solid for the SVG copy only (Skia's SVG backend has no dashes and would print a
        // warning per line); the plot must come back with its dashes for any later PDF or PNG drawing.
        var plot = SchoolingCharts.OutputCurve(Results());
        float[][] Patterns() => plot.GetPlottables().OfType<IHasLine>().Select(p => p.LineStyle.Pattern.Intervals ?? Array.Empty<float>()).ToArray();
        var before = Patterns();
        Assert.Contains(before, i => i.Length > 0);
        ChartRenderer.ToSvg(plot);
        Assert.Equal(before, Patterns());
    }
}
