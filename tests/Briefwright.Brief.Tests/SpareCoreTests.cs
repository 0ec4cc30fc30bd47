namespace Briefwright.Brief.Tests;

public class SpareCoreTests
{
    /// <summary>As the command line's runner does: each piece on the thread pool, chart copies on every core.</summary>
    private sealed class Spare : WorkRunner
    {
        public static int Started;

        public override Task<T> Start<T>(Func<T> work)
        {
            Interlocked.Increment(ref Started);
            return Task.Run(work);
        }

        public override int Threads => Environment.ProcessorCount;
    }

    [Fact]
    public void A_brief_composed_on_several_threads_is_byte_identical_to_one_composed_on_one()
    {
        // With more than one thread the results data, the filled template and the chart copies are made on spare
        // cores while the charts and the PDF are laid out; a batch building several briefs at once uses one thread
        // per brief. Both must give the same files, byte for byte.
        var solved = ScenarioSolver.Solve(Demo.Load("auroria-national"));
        var one = BriefBuilder.Compose(
            solved,
            StandardTemplate.Template,
            BuildOptions.Default with { ChartImages = true, ModelThreads = 1 });
        var many = BriefBuilder.Compose(
            solved,
            StandardTemplate.Template,
            BuildOptions.Default with { ChartImages = true, Runner = new Spare() });
        Assert.True(Spare.Started >= 2, "the pieces ran on the spare runner");
        Assert.Equal(one.Pdf, many.Pdf);
        Assert.Equal(one.ResultsJson, many.ResultsJson);
        Assert.Equal(one.Markdown, many.Markdown);
        Assert.Equal(one.Annex.Select(a => a.Suffix), many.Annex.Select(a => a.Suffix));
        Assert.Contains(many.Annex, a => a.Suffix.EndsWith(".png", StringComparison.Ordinal));
        Assert.Contains(many.Annex, a => a.Suffix.EndsWith(".svg", StringComparison.Ordinal));
        foreach (var (a, b) in one.Annex.Zip(many.Annex)) Assert.True(
            a.Bytes.AsSpan().SequenceEqual(b.Bytes),
            a.Suffix);
    }

    [Fact]
    public async Task Briefs_in_other_languages_and_fonts_built_at_once_are_byte_identical_to_ones_built_in_turn()
    {
        // Each brief brings its own language, fonts, measurer and chart drawing: nothing of one may reach the other. A
        // French brief in the bundled font and an English one in a theme's fonts (the bundled faces in another order,
        // so another family with other chart typefaces), built one after the other, then both at once, each with the
        // spare-core runner as well, must give the same files.
        string Font(string face) => Path.Combine(Demo.Root, "fonts", $"LiberationSans-{face}.ttf");
        var theme = (File.ReadAllBytes(Font("Italic")), File.ReadAllBytes(Font("BoldItalic")),
            File.ReadAllBytes(Font("Regular")), File.ReadAllBytes(Font("Bold")));
        var french = ScenarioSolver.Solve(Demo.Load("auroria-valdoree"), 1);
        var english = ScenarioSolver.Solve(Demo.Load("auroria-national"), 1);
        var options = BuildOptions.Default with
        {
            ChartImages = true, ModelThreads = 1,
            Formats = Brief.Formats.OutputFormat.Pdf | Brief.Formats.OutputFormat.Html,
        };
        BuiltBrief French(WorkRunner runner) => BriefBuilder.Compose(french, StandardTemplate.Template,
            options with { Runner = runner });
        BuiltBrief English(WorkRunner runner) =>
            BriefBuilder.Compose(english, StandardTemplate.Template, options with { Runner = runner, Fonts = theme });

        var inTurn = new[] { French(WorkRunner.Sequential), English(WorkRunner.Sequential) };
        using var start = new Barrier(2);
        var atOnce = await Task.WhenAll(
            Task.Run(() => { start.SignalAndWait(); return French(new Spare()); }),
            Task.Run(() => { start.SignalAndWait(); return English(new Spare()); }));

        Assert.NotEqual(inTurn[0].Pdf, inTurn[1].Pdf);
        foreach (var (a, b) in inTurn.Zip(atOnce))
        {
            Assert.Equal(a.Pdf, b.Pdf);
            Assert.Equal(a.Markdown, b.Markdown);
            Assert.Equal(a.Annex.Select(x => x.Suffix), b.Annex.Select(x => x.Suffix));
            foreach (var (x, y) in a.Annex.Zip(b.Annex)) Assert.True(x.Bytes.AsSpan().SequenceEqual(y.Bytes), x.Suffix);
            Assert.Equal(a.Formats.Select(x => x.Suffix), b.Formats.Select(x => x.Suffix));
            foreach (var (x, y) in a.Formats.Zip(b.Formats))
                Assert.True(x.Bytes.AsSpan().SequenceEqual(y.Bytes), x.Suffix);
        }
    }
}
