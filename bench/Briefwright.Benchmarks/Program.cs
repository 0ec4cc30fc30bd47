using System.Diagnostics;
using BenchmarkDotNet.Running;
using Briefwright.Benchmarks;

// `dotnet run -c Release -- quick` runs the timed harness (a few seconds); anything else goes to BenchmarkDotNet.
if (args.Length > 0 && args[0] == "profile-model")
{
    // A loop for a sampling profiler (dotnet-trace): the demo's whole model, repeated.
    var brief = new BriefBenchmarks();
    brief.Setup();
    int n = int.Parse(args.ElementAtOrDefault(1) ?? "20");
    long bytes = GC.GetTotalAllocatedBytes(true);
    int gcs = GC.CollectionCount(0);
    var watch = Stopwatch.StartNew();
    for (int i = 0; i < n; i++) Briefwright.Brief.ScenarioSolver.Solve(brief.Scenario);
    Console.WriteLine($"{watch.Elapsed.TotalMilliseconds / n:0.0} ms, {(GC.GetTotalAllocatedBytes(true) - bytes) / n / 1e6:0.0} MB allocated and {(GC.CollectionCount(0) - gcs) / (double)n:0.0} gen-0 collections per solve; GC pause {GC.GetTotalPauseDuration().TotalMilliseconds / n:0.0} ms");
    return;
}
if (args.Length > 0 && args[0] == "profile-paths")
{
    var b = new BriefBenchmarks();
    b.Setup();
    var inputs = b.Scenario.Inputs;
    var alts = inputs.Options.Where(o => o.Id != inputs.BaselineId).ToList();
    for (int r = 0; r < 100_000; r++)
    {
        var c = new Briefwright.Model.Dynamics.ReformSimulator.Cache(true);
        foreach (var o in alts) Briefwright.Model.Dynamics.ReformSimulator.Simulate(inputs, o, b.Scenario.Analysis.Reform, c);
    }
    return;
}
if (args.Length > 0 && args[0] == "dynamic")
{
    var b = new BriefBenchmarks();
    b.Setup();
    using var listener = new JitListener();
    for (int i = 0; i < 3; i++) Briefwright.Brief.BriefBuilder.Build(b.Light, Briefwright.Brief.StandardTemplate.Template);
    foreach (var (name, count) in listener.Names.GroupBy(n => n).Select(g => (g.Key, g.Count())).OrderByDescending(x => x.Item2).Take(30))
        Console.WriteLine($"{count,6} {name}");
    return;
}
if (args.Length > 0 && args[0] == "draw")
{
    var b = new BriefBenchmarks();
    b.Setup();
    var inputs = b.Scenario.Inputs;
    var settings = b.Scenario.Analysis;
    var spec = settings.MonteCarlo!;
    double guess = Briefwright.Model.Core.BalancedGrowth.Solve(inputs).Optimum.SchoolingYears;
    var alts = inputs.Options.Where(o => o.Id != inputs.BaselineId).ToList();
    double[] u = { 0.3, 0.6, 0.4, 0.55, 0.45 };
    var kernel = Briefwright.Model.Numerics.TiltedKernel.For(inputs.Demography.Survival, 0)!;
    Harness.Time("kernel integral 0-110 (3-point)", 50, () => kernel.Integrate(0, 110, -0.01, inputs.Demography.Survival.Breakpoints, true));
    Harness.Time("kernel lookup", 50, () => Briefwright.Model.Numerics.TiltedKernel.For(inputs.Demography.Survival, 0));
    Harness.Time("apply draw", 50, () => Briefwright.Model.Uncertainty.MonteCarlo.Apply(inputs, spec.Parameters, u));
    Harness.Time("population", 50, () => new Briefwright.Model.Dynamics.ReformSimulator.Cache(true).Population(inputs));
    Harness.Time("population+4 outputs", 50, () => { var c = new Briefwright.Model.Dynamics.ReformSimulator.Cache(true); foreach (var o in inputs.Options) c.OutputPerPerson(inputs, o); });
    Harness.Time("3 paths (cache with outputs)", 50, () => { var c = new Briefwright.Model.Dynamics.ReformSimulator.Cache(true); foreach (var o in inputs.Options) c.OutputPerPerson(inputs, o); foreach (var o in alts) Briefwright.Model.Dynamics.ReformSimulator.Simulate(inputs, o, settings.Reform, c); });
    var path = Briefwright.Model.Dynamics.ReformSimulator.Simulate(inputs, alts[0], settings.Reform);
    Harness.Time("1 PV", 50, () => Briefwright.Model.Dynamics.PresentValue.Compute(path, settings.Headline, inputs.Production.TechnologyGrowth));
    Harness.Time("local optimum (fast)", 50, () => Briefwright.Model.Core.OptimumSearch.LocalFrom(inputs.DemographyFor(inputs.Baseline), inputs.HumanCapital, guess, new Briefwright.Model.Dynamics.ReformSimulator.Cache(true).Population(inputs), fast: true));
    Harness.Time("evaluate", 50, () => Briefwright.Model.Uncertainty.KeyResultsEvaluator.Evaluate(inputs, settings, guess, true));
    return;
}
if (args.Length > 0 && args[0] == "quick")
{
    Harness.Run(args.Skip(1).ToArray());
    return;
}
BenchmarkSwitcher.FromAssembly(typeof(ModelBenchmarks).Assembly).Run(args);

namespace Briefwright.Benchmarks
{
    /// <summary>A plain stopwatch harness: warm up once, then report the best and median of several runs.</summary>
    public static class Harness
    {
        public static void Run(string[] only)
        {
            var b = new ModelBenchmarks();
            b.Setup();
            Time("solve (balanced growth + optimum)", 20, () => b.SolveBalancedGrowth());
            Time("reform path (150 years)", 50, () => b.ReformPath());
            Time("local optimum search (one draw)", 200, () => b.LocalOptimum());
            Time("key results (one draw)", 200, () => b.KeyResultsOneDraw());
            Time("  balanced-growth outputs (one draw)", 200, () => b.Outputs());
            Time("  three reform paths, shared tables (one draw)", 200, () => b.ThreePaths());
            Time("Monte Carlo, 10,000 draws with reform paths", 3, () => b.MonteCarlo10k());
            var brief = new BriefBenchmarks();
            brief.Setup();
            Time("demo brief, in process (warm)", 10, () => brief.BuildDemoBrief());
            Time("regional brief (200 draws), in process (warm)", 10, () => brief.BuildLightBrief());
            Time("  its model runs only", 10, () => brief.SolveLight());
            Time("  its model runs and six charts", 10, () => brief.ChartsLight());
            Stages(brief);
        }

        /// <summary>Each stage of the demo brief on its own (warm), to see where the time goes.</summary>
        private static void Stages(BriefBenchmarks brief)
        {
            var scenario = brief.Scenario;
            var inputs = scenario.Inputs;
            var settings = scenario.Analysis;
            var bgp = Briefwright.Model.Core.BalancedGrowth.Solve(inputs);
            double guess = bgp.Optimum.SchoolingYears;
            Console.WriteLine("demo brief by stage:");
            Time("  balanced growth + optimum", 10, () => Briefwright.Model.Core.BalancedGrowth.Solve(inputs));
            Time("  reform paths + appraisal", 10, () => Briefwright.Model.Dynamics.Appraisal.Run(inputs, settings.Reform, settings.Discounts, guess));
            Time("  tornado", 10, () => Briefwright.Model.Uncertainty.Sensitivity.Tornado(inputs, settings, guess));
            Time("  grids", 10, () => settings.Grids.Select(g => Briefwright.Model.Uncertainty.Sensitivity.Grid(inputs, settings, g, guess)).ToList());
            Time("  Monte Carlo", 5, () => Briefwright.Model.Uncertainty.MonteCarlo.Run(inputs, settings, guess));
            Time("  whole model (incl. Sobol)", 5, () => Briefwright.Brief.ScenarioSolver.Solve(scenario));
            var solved = Briefwright.Brief.ScenarioSolver.Solve(scenario);
            Time("  six charts", 10, () => Briefwright.Brief.BriefBuilder.RenderCharts(solved));
            var charts = Briefwright.Brief.BriefBuilder.RenderCharts(solved);
            Time("  fill template", 10, () => Briefwright.Brief.BriefBuilder.FillTemplate(solved, charts, Briefwright.Brief.StandardTemplate.Template));
            string markdown = Briefwright.Brief.BriefBuilder.FillTemplate(solved, charts, Briefwright.Brief.StandardTemplate.Template);
            var figures = charts.ToDictionary(c => c.Id, c => new Briefwright.Composer.Document.FigureBlock(c.Id, c.Pdf, c.Page, c.WidthPt, c.HeightPt, c.Caption, c.Source, c.AltText));
            Time("  read Markdown", 10, () => Briefwright.Composer.Markdown.MarkdownReader.Read(markdown, figures));
            var blocks = Briefwright.Composer.Markdown.MarkdownReader.Read(markdown, figures);
            var info = new Briefwright.Composer.Document.DocumentInfo("t", "t", "a", "s", "k", "en-GB", scenario.Brief.Date, "Edition 1", "footer");
            var doc = new Briefwright.Composer.Document.BriefDocument(info, blocks);
            var theme = Briefwright.Composer.Layout.Theme.For(doc.Paper);
            Time("  layout", 10, () => Briefwright.Composer.DocumentComposer.Layout(doc, theme, Briefwright.Composer.DocumentComposer.Measurer));
            Time("  layout + write PDF", 10, () => Briefwright.Composer.DocumentComposer.WritePdf(doc));
            Time("  results JSON", 10, () => Briefwright.Brief.Annex.ResultsJson.Write(Briefwright.Brief.Annex.ResultsDocument.From(scenario, solved.BalancedGrowth, solved.Analysis)));
            Time("  annex files", 10, () => Briefwright.Brief.Annex.AnnexFiles.Build(solved, charts));
        }

        public static void Time(string what, int runs, Action action)
        {
            // Warm up long enough for tiered compilation to replace the first, unoptimised code (it waits ~100 ms).
            var warm = Stopwatch.StartNew();
            int calls = 0;
            for (; calls < 2000 && (calls < 2 || warm.ElapsedMilliseconds < 400); calls++) action();
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
            string unit = times[0] < 1 ? "µs" : "ms";
            double scale = times[0] < 1 ? 1000 : 1;
            Console.WriteLine($"{what,-48} best {times[0] * scale,9:0.0} {unit}   median {times[times.Count / 2] * scale,9:0.0} {unit}   ({runs} runs)");
        }
    }
}

internal sealed class JitListener : System.Diagnostics.Tracing.EventListener
{
    public readonly System.Collections.Concurrent.ConcurrentQueue<string> Names = new();

    protected override void OnEventSourceCreated(System.Diagnostics.Tracing.EventSource source)
    {
        if (source.Name == "Microsoft-Windows-DotNETRuntime")
            EnableEvents(source, System.Diagnostics.Tracing.EventLevel.Verbose, (System.Diagnostics.Tracing.EventKeywords)0x10);
    }

    protected override void OnEventWritten(System.Diagnostics.Tracing.EventWrittenEventArgs e)
    {
        if (e.EventName != "MethodLoadVerbose_V2" && e.EventName != "MethodLoadVerbose_V1" && e.EventName != "MethodLoadVerbose") return;
        string ns = e.Payload?[e.PayloadNames!.IndexOf("MethodNamespace")]?.ToString() ?? "";
        string name = e.Payload?[e.PayloadNames!.IndexOf("MethodName")]?.ToString() ?? "";
        if (ns.Contains("dynamicClass") || ns.Length == 0) Names.Enqueue(ns + "::" + name);
    }
}
