using System.Diagnostics;
using Briefwright.Brief;
using Briefwright.Brief.Annex;
using Briefwright.Composer;
using Briefwright.Composer.Document;
using Briefwright.Composer.Markdown;
using Briefwright.Model.Core;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Benchmarks;

/// <summary>
/// A stopwatch harness: warm up until tiered compilation has settled, then report the best and median of timed batches.
/// </summary>
public static class Harness
{
    public static void Run()
    {
        var m = new ModelBenchmarks();
        m.Setup();
        Console.WriteLine("model");
        Time("  solve a scenario (balanced growth + optimum)", 20, () => m.SolveBalancedGrowth());
        Time("  reform path (150 years)", 50, () => m.ReformPath());
        Time("  Monte Carlo, 10,000 draws with reform paths", 3, () => m.MonteCarlo10k());
        var b = new BriefBenchmarks();
        b.Setup();
        Console.WriteLine("briefs, in process (warm)");
        Time("  demo brief: lay out and write (model solved)", 10, () => b.ComposeDemoBrief());
        Time("  demo brief: model and composition", 10, () => b.BuildDemoBrief());
        Time("  regional brief (200 draws): model and composition", 10, () => b.BuildLightBrief());
        Stages(b);
    }

    /// <summary>Each stage of the demo brief on its own, to see where the time goes.</summary>
    private static void Stages(BriefBenchmarks b)
    {
        var scenario = b.Scenario;
        var inputs = scenario.Inputs;
        var settings = scenario.Analysis;
        double guess = BalancedGrowth.Solve(inputs).Optimum.SchoolingYears;
        Console.WriteLine("demo brief by stage");
        Time("  balanced growth + optimum", 10, () => BalancedGrowth.Solve(inputs));
        Time("  reform paths + appraisal", 10, () => Appraisal.Run(inputs, settings.Reform, settings.Discounts, guess));
        Time("  tornado", 10, () => Sensitivity.Tornado(inputs, settings, guess));
        Time("  grids", 10, () => settings.Grids.Select(g => Sensitivity.Grid(inputs, settings, g, guess)).ToList());
        Time("  Monte Carlo (2,000 draws)", 5, () => MonteCarlo.Run(inputs, settings, guess));
        Time("  whole model (with Sobol indices)", 5, () => ScenarioSolver.Solve(scenario));
        var solved = ScenarioSolver.Solve(scenario);
        Time("  six charts", 10, () => BriefBuilder.RenderCharts(solved));
        var charts = BriefBuilder.RenderCharts(solved);
        Time("  six charts with SVG and PNG copies (annex)", 5,
            () => BriefBuilder.RenderCharts(solved, withImages: true));
        var plot = Charts.SchoolingCharts.OutputCurve(BriefBuilder.ChartDrawingFor(solved.Scenario),
            solved.BalancedGrowth);
        Time("    one chart as PNG", 5, () => Charts.ChartRenderer.ToPng(plot));
        Time("    one chart as SVG", 5, () => Charts.ChartRenderer.ToSvg(plot));
        Time("  results JSON", 10,
            () => ResultsJson.Write(ResultsDocument.From(scenario, solved.BalancedGrowth, solved.Analysis)));
        Time("  fill template", 10, () => BriefBuilder.FillTemplate(solved, charts, StandardTemplate.Template));
        string markdown = BriefBuilder.FillTemplate(solved, charts, StandardTemplate.Template);
        var figures = charts.ToDictionary(
            c => c.Id,
            c => new FigureBlock(c.Id, c.Pdf, c.Page, c.WidthPt, c.HeightPt, c.Caption, c.Source, c.AltText));
        Time("  read Markdown", 10, () => MarkdownReader.Read(markdown, figures));
        var info = new DocumentInfo("t", "t", "a", "s", "k", "en-GB", scenario.Brief.Date, "Edition 1", "footer");
        var doc = new BriefDocument(info, MarkdownReader.Read(markdown, figures));
        Time("  layout", 10,
            () => DocumentComposer.Layout(doc, Composer.Layout.Theme.For(doc.Paper), new RenderSession().Measurer));
        Time("  layout + write PDF", 10, () => DocumentComposer.WritePdf(doc));
        Time("  annex files", 10, () => AnnexFiles.Build(solved, charts));
    }

    /// <summary>
    /// The demo scenario's model inputs and analysis settings, with the optimum that starts each draw's search.
    /// </summary>
    private static (BriefBenchmarks Demo, Model.Inputs.ModelInputs Inputs, AnalysisSettings Settings, double Guess)
        DemoModel()
    {
        var b = new BriefBenchmarks();
        b.Setup();
        var inputs = b.Scenario.Inputs;
        return (b, inputs, b.Scenario.Analysis, BalancedGrowth.Solve(inputs).Optimum.SchoolingYears);
    }

    /// <summary>One Monte Carlo draw of the demo, piece by piece.</summary>
    public static void Draw()
    {
        var (_, inputs, settings, guess) = DemoModel();
        var alternatives = inputs.Options.Where(o => o.Id != inputs.BaselineId).ToList();
        double[] u = { 0.3, 0.6, 0.4, 0.55, 0.45 };
        Time("apply a draw to the inputs", 50, () => MonteCarlo.Apply(inputs, settings.MonteCarlo!.Parameters, u));
        Time("population integral", 50, () => new ReformSimulator.Cache(true).Population(inputs));
        Time("population + four options' outputs", 50, () =>
        {
            var c = new ReformSimulator.Cache(true);
            foreach (var o in inputs.Options) c.OutputPerPerson(inputs, o);
        });
        Time("the same + three reform paths", 50, () =>
        {
            var c = new ReformSimulator.Cache(true);
            foreach (var o in inputs.Options) c.OutputPerPerson(inputs, o);
            foreach (var o in alternatives) ReformSimulator.Simulate(inputs, o, settings.Reform, c);
        });
        var shared = new ReformSimulator.Cache(true);
        foreach (var o in alternatives) ReformSimulator.Simulate(inputs, o, settings.Reform, shared);
        Time("one reform path, tables and outputs already cached", 50, () =>
            ReformSimulator.Simulate(inputs, alternatives[0], settings.Reform, shared));
        var path = ReformSimulator.Simulate(inputs, alternatives[0], settings.Reform);
        Time("one present value", 50,
            () => PresentValue.Compute(path, settings.Headline, inputs.Production.TechnologyGrowth));
        Time("local optimum search", 50, () => OptimumSearch.LocalFrom(inputs.DemographyFor(inputs.Baseline),
            inputs.HumanCapital, guess, new ReformSimulator.Cache(true).Population(inputs), fast: true));
        Time("whole draw (key results)", 50, () => KeyResultsEvaluator.Evaluate(inputs, settings, guess,
            headlinePath: new double[settings.Reform.HorizonYears + 1]));
    }

    /// <summary>What one Monte Carlo draw and the demo's whole Monte Carlo allocate, by type (sampled).</summary>
    public static void Allocations()
    {
        var (_, inputs, settings, guess) = DemoModel();
        AllocationSampler.Report("one draw (key results)", 20_000, () => KeyResultsEvaluator.Evaluate(inputs, settings,
            guess, headlinePath: new double[settings.Reform.HorizonYears + 1]));
        AllocationSampler.Report("Monte Carlo (2,000 draws, one thread)", 10,
            () => MonteCarlo.Run(inputs, settings, guess, 1));
    }

    /// <summary>The demo's whole model, repeated, with allocation and collection counts.</summary>
    public static void ProfileModel(int n)
    {
        var b = new BriefBenchmarks();
        b.Setup();
        long bytes = GC.GetTotalAllocatedBytes(true);
        int gcs = GC.CollectionCount(0);
        var watch = Stopwatch.StartNew();
        for (int i = 0; i < n; i++) ScenarioSolver.Solve(b.Scenario);
        Console.WriteLine($"{watch.Elapsed.TotalMilliseconds / n:0.0} ms, " +
            $"{(GC.GetTotalAllocatedBytes(true) - bytes) / n / 1e6:0.0} MB allocated and " +
            $"{(GC.CollectionCount(0) - gcs) / (double)n:0.0} gen-0 collections per solve");
    }

    public static void Time(string what, int runs, Action action)
    {
        // Warm up long enough for tiered compilation to replace the first, unoptimised code (it waits ~100 ms).
        var warm = Stopwatch.StartNew();
        int calls = 0;
        for (; calls < 2000 && (calls < 3 || warm.ElapsedMilliseconds < 500); calls++) action();
        // Time batches of at least ~2 ms: reading the clock costs microseconds on some virtual machines.
        int batch = Math.Max(1, (int)Math.Ceiling(2.0 / Math.Max(1e-6, warm.Elapsed.TotalMilliseconds / calls)));
        var times = new List<double>();
        for (int i = 0; i < runs; i++)
        {
            var sw = Stopwatch.StartNew();
            for (int k = 0; k < batch; k++) action();
            times.Add(sw.Elapsed.TotalMilliseconds / batch);
        }
        times.Sort();
        // Bytes allocated by one call on this thread (work a call hands to other threads is not counted).
        long before = GC.GetAllocatedBytesForCurrentThread();
        action();
        long bytes = GC.GetAllocatedBytesForCurrentThread() - before;
        bool micro = times[0] < 1;
        double scale = micro ? 1000 : 1;
        string unit = micro ? "µs" : "ms";
        Console.WriteLine($"{what,-56} best {times[0] * scale,8:0.0} {unit}   median " +
            $"{times[times.Count / 2] * scale,8:0.0} {unit}   {bytes / 1024.0,8:0.0} KB allocated   ({runs} runs)");
    }
}

/// <summary>Samples what a piece of work allocates (the runtime reports a type about every 100 KB allocated).</summary>
public sealed class AllocationSampler : System.Diagnostics.Tracing.EventListener
{
    private readonly System.Collections.Concurrent.ConcurrentDictionary<string, long> bytes = new();

    protected override void OnEventSourceCreated(System.Diagnostics.Tracing.EventSource source)
    {
        if (source.Name == "Microsoft-Windows-DotNETRuntime")
            EnableEvents(source, System.Diagnostics.Tracing.EventLevel.Verbose,
                (System.Diagnostics.Tracing.EventKeywords)0x1);
    }

    protected override void OnEventWritten(System.Diagnostics.Tracing.EventWrittenEventArgs e)
    {
        if (e.EventName is null || !e.EventName.StartsWith("GCAllocationTick", StringComparison.Ordinal)
            || e.Payload is null) return;
        int typeName = e.PayloadNames!.IndexOf("TypeName");
        int amount = e.PayloadNames.IndexOf("AllocationAmount64");
        if (typeName < 0 || amount < 0) return;
        bytes.AddOrUpdate((string)e.Payload[typeName]!, Convert.ToInt64(e.Payload[amount]),
            (_, b) => b + Convert.ToInt64(e.Payload[amount]));
    }

    /// <summary>
    /// Runs <paramref name="work"/> <paramref name="times"/> times and prints the sampled types, largest first.
    /// </summary>
    public static void Report(string what, int times, Action work)
    {
        work();
        using var sampler = new AllocationSampler();
        long before = GC.GetTotalAllocatedBytes(true);
        for (int i = 0; i < times; i++) work();
        long total = GC.GetTotalAllocatedBytes(true) - before;
        Thread.Sleep(500); // events arrive on a dispatcher thread
        Console.WriteLine($"{what}: {total / (double)times / 1024:0.0} KB allocated per run; sampled types:");
        long sampled = sampler.bytes.Values.Sum();
        foreach (var (type, b) in sampler.bytes.OrderByDescending(kv => kv.Value).Take(25))
            Console.WriteLine($"  {100.0 * b / sampled,5:0.0}%  {type}");
    }
}
