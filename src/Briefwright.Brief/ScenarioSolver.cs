using Briefwright.Model.Core;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Brief;

/// <summary>Everything the model computes for one scenario.</summary>
public sealed record SolvedScenario(ScenarioDocument Scenario, BalancedGrowthResults BalancedGrowth, AnalysisResults Analysis);

/// <summary>The one place that runs the model for a scenario: balanced growth, then the reform path and uncertainty.</summary>
public static class ScenarioSolver
{
    public static SolvedScenario Solve(ScenarioDocument scenario)
    {
        var bgp = BalancedGrowth.Solve(scenario.Inputs);
        ResultsGuard.EnsureFinite(bgp);
        var analysis = AnalysisRunner.Run(scenario.Inputs, scenario.Analysis, bgp);
        ResultsGuard.EnsureFinite(analysis);
        return new SolvedScenario(scenario, bgp, analysis);
    }
}
