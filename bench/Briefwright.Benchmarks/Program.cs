using System.Diagnostics;
using BenchmarkDotNet.Running;
using Briefwright.Benchmarks;

// `dotnet run -c Release -- quick` runs the timed harness (a few seconds); anything else goes to BenchmarkDotNet.
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
        }

        private static void Time(string what, int runs, Action action)
        {
            action();
            var times = new List<double>();
            for (int i = 0; i < runs; i++)
            {
                var sw = Stopwatch.StartNew();
                action();
                times.Add(sw.Elapsed.TotalMilliseconds);
            }
            times.Sort();
            Console.WriteLine($"{what,-48} best {times[0],9:0.0} ms   median {times[times.Count / 2],9:0.0} ms   ({runs} runs)");
        }
    }
}
