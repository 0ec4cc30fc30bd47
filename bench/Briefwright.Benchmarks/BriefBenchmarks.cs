using BenchmarkDotNet.Attributes;
using Briefwright.Brief;
using Briefwright.Scenario;

namespace Briefwright.Benchmarks;

[MemoryDiagnoser]
public class BriefBenchmarks
{
    private ScenarioDocument scenario = null!;

    public ScenarioDocument Scenario => scenario;

    [GlobalSetup]
    public void Setup()
    {
        scenario = Demo.Load("auroria-national");
        BriefBuilder.Build(scenario, StandardTemplate.Template);
    }

    [Benchmark]
    public object BuildDemoBrief() => BriefBuilder.Build(scenario, StandardTemplate.Template);

    /// <summary>A regional brief as in the 200-brief batch: 200 draws, no Sobol indices, a 5 × 5 grid.</summary>
    public ScenarioDocument Light => scenario with
    {
        Analysis = scenario.Analysis with
        {
            MonteCarlo = scenario.Analysis.MonteCarlo! with { Draws = 200, SobolSamples = 0 },
            Grids = scenario.Analysis.Grids.Select(g => g with { Steps = 5 }).ToList(),
        },
    };

    public object SolveLight() => ScenarioSolver.Solve(Light);

    public object ChartsLight() => BriefBuilder.RenderCharts(ScenarioSolver.Solve(Light));

    [Benchmark]
    public object BuildLightBrief() => BriefBuilder.Build(Light, StandardTemplate.Template);
}
