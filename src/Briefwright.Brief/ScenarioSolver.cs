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
    /// <param name="maxThreads">Threads the model's uncertainty loops may use (<see cref="ModelThreads"/>); results do not depend on it.</param>
    /// <exception cref="UnsolvableScenarioException">The model cannot solve these inputs (the reason is in the message).</exception>
    public static SolvedScenario Solve(ScenarioDocument scenario, int maxThreads = ModelThreads.AllCores)
    {
        try
        {
            var bgp = BalancedGrowth.Solve(scenario.Inputs);
            ResultsGuard.EnsureFinite(bgp);
            var analysis = AnalysisRunner.Run(scenario.Inputs, scenario.Analysis, bgp, maxThreads);
            ResultsGuard.EnsureFinite(analysis);
            return new SolvedScenario(scenario, bgp, analysis);
        }
        catch (Exception ex) when (ex is ArithmeticException or ArgumentException or InvalidOperationException)
        {
            throw new UnsolvableScenarioException(ex.Message, ex);
        }
        catch (AggregateException ex) when (ex.InnerExceptions.All(e => e is ArithmeticException or ArgumentException or InvalidOperationException))
        {
            throw new UnsolvableScenarioException(ex.InnerExceptions[0].Message, ex);
        }
    }
}
