using BenchmarkDotNet.Attributes;
using Briefwright.Model.Core;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Benchmarks;

[MemoryDiagnoser]
public class ModelBenchmarks
{
    private ScenarioDocument scenario = null!;
    private AnalysisSettings tenThousand = null!;
    private double guess;

    [GlobalSetup]
    public void Setup()
    {
        scenario = Demo.Load("auroria-national");
        tenThousand = scenario.Analysis with { MonteCarlo = scenario.Analysis.MonteCarlo! with { Draws = 10_000 } };
        guess = BalancedGrowth.Solve(scenario.Inputs).Optimum.SchoolingYears;
    }

    [Benchmark]
    public object SolveBalancedGrowth() => BalancedGrowth.Solve(scenario.Inputs);

    [Benchmark]
    public object ReformPath() =>
        ReformSimulator.Simulate(scenario.Inputs, scenario.Inputs.Options[1], scenario.Analysis.Reform);

    [Benchmark]
    public double LocalOptimum() => OptimumSearch.LocalFrom(scenario.Inputs.DemographyFor(scenario.Inputs.Baseline),
        scenario.Inputs.HumanCapital, guess + 1.3);

    [Benchmark]
    public object KeyResultsOneDraw() => KeyResultsEvaluator.Evaluate(scenario.Inputs, tenThousand, guess + 1.3,
        headlinePath: new double[tenThousand.Reform.HorizonYears + 1]);

    [Benchmark]
    public object MonteCarlo10k() => MonteCarlo.Run(scenario.Inputs, tenThousand, guess);
}
