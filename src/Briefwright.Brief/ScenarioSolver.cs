using Briefwright.Model.Core;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Brief;

/// <summary>Everything the model computes for one scenario.</summary>
public sealed record SolvedScenario(
    ScenarioDocument Scenario, BalancedGrowthResults BalancedGrowth, AnalysisResults Analysis)
{
    private OptionOutcomes? outcomes;

    /// <summary>The results per option, with the headline option at hand.</summary>
    public OptionOutcomes Outcomes => outcomes ??= OptionOutcomes.From(BalancedGrowth, Analysis);
}

/// <summary>
/// The one place that runs the model for a scenario: balanced growth, then the reform path and uncertainty.
/// </summary>
public static class ScenarioSolver
{
    /// <summary>What the model throws when inputs leave it nothing to compute: its own
    /// <see cref="Model.ModelRuleException"/>, a non-finite result, or an arithmetic or argument failure deep in a
    /// computation.</summary>
    private static bool IsModelFailure(Exception ex)
        => ex is ArithmeticException or ArgumentException or InvalidOperationException;

    /// <param name="maxThreads">Threads the model's uncertainty loops may use (<see cref="ModelThreads"/>); results do
    /// not depend on it.</param>
    /// <exception cref="UnsolvableScenarioException">The model cannot solve these inputs (the reason is in the
    /// message).</exception>
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
        catch (Exception ex) when (IsModelFailure(ex))
        {
            throw new UnsolvableScenarioException(ex.Message, ex);
        }
        catch (AggregateException ex) when (ex.Flatten().InnerExceptions.All(IsModelFailure))
        {
            throw new UnsolvableScenarioException(ex.Flatten().InnerExceptions[0].Message, ex);
        }
    }
}
