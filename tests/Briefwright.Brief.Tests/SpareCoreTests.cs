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
}
