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
        solved = ScenarioSolver.Solve(scenario);
        BriefBuilder.Build(scenario, StandardTemplate.Template);
    }

    private SolvedScenario solved = null!;

    /// <summary>
    /// The demo brief from its scenario: model (with 2,000 Monte Carlo draws and Sobol indices) and composition.
    /// </summary>
    [Benchmark]
    public object BuildDemoBrief() => BriefBuilder.Build(scenario, StandardTemplate.Template);

    /// <summary>
    /// Laying out and writing the demo brief once its model is solved: charts, results data, template, layout, PDF.
    /// </summary>
    [Benchmark]
    public object ComposeDemoBrief() => BriefBuilder.Compose(solved, StandardTemplate.Template);

    /// <summary>A regional brief as in the 200-brief batch: 200 draws, no Sobol indices, a 5 × 5 grid.</summary>
    public ScenarioDocument Light => scenario with
    {
        Analysis = scenario.Analysis with
        {
            MonteCarlo = scenario.Analysis.MonteCarlo! with { Draws = 200, SobolSamples = 0 },
            Grids = scenario.Analysis.Grids.Select(g => g with { Steps = 5 }).ToList(),
        },
    };

    [Benchmark]
    public object BuildLightBrief() => BriefBuilder.Build(Light, StandardTemplate.Template);
}
