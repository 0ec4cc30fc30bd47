using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;

namespace Briefwright.Model.Uncertainty;

/// <summary>Sobol indices of the headline results with respect to every uncertain parameter.</summary>
public sealed record GlobalSensitivity(IReadOnlyList<string> Outputs, IReadOnlyList<SobolIndices> Indices);

/// <summary>Everything beyond the balanced growth path.</summary>
public sealed record AnalysisResults(
    string HeadlineOptionId,
    AppraisalResults Reform,
    IReadOnlyList<TornadoRow> Tornado,
    IReadOnlyList<GridResult> Grids,
    MonteCarloResults? MonteCarlo,
    GlobalSensitivity? Sobol);

public static class AnalysisRunner
{
    public static readonly string[] SobolOutputs =
        { "headline_long_run_change_pct", "optimum_schooling_years", "headline_present_value" };

    /// <param name="maxThreads">Threads the Monte Carlo, Sobol and sensitivity loops may use
    /// (<see cref="ModelThreads"/>).</param>
    public static AnalysisResults Run(
        ModelInputs inputs, AnalysisSettings settings, BalancedGrowthResults bgp,
        int maxThreads = ModelThreads.AllCores)
    {
        double guess = bgp.Optimum.SchoolingYears;
        var reform = Appraisal.Run(inputs, settings.Reform, settings.Discounts, guess);
        var tornado = Sensitivity.Tornado(inputs, settings, guess, maxThreads);
        var grids = settings.Grids.Select(g => Sensitivity.Grid(inputs, settings, g, guess, maxThreads)).ToList();
        MonteCarloResults? mc = null;
        GlobalSensitivity? sobol = null;
        if (settings.MonteCarlo is { } spec)
        {
            mc = MonteCarlo.Run(inputs, settings, guess, maxThreads);
            if (spec.SobolSamples > 0) sobol = Sobol(inputs, settings, spec, guess, maxThreads);
        }
        return new AnalysisResults(settings.HeadlineOptionId, reform, tornado, grids, mc, sobol);
    }

    /// <summary>The seed of the Sobol samples: the scenario's, changed so they are not the Monte Carlo draws.</summary>
    public static ulong SobolSeed(MonteCarloSpec spec) => spec.Seed ^ 0x5AB0_1D5EUL;

    private static GlobalSensitivity Sobol(
        ModelInputs inputs, AnalysisSettings settings, MonteCarloSpec spec, double guess, int maxThreads)
    {
        var names = spec.Parameters.Select(p => p.Parameter).ToList();
        var indices = Uncertainty.Sobol.Estimate(spec.Parameters.Count, spec.SobolSamples, SobolSeed(spec), names, u =>
        {
            var trial = MonteCarlo.Apply(inputs, spec.Parameters, u);
            if (Parameters.Violation(trial) is not null) return null;
            // Only the headline option's results are used, so only its reform path is simulated.
            var k = KeyResultsEvaluator.Evaluate(trial, settings, guess, headlineOnly: true);
            return new[] { k.LongRunChangePct[0], k.OptimumYears, k.PresentValue[0] };
        }, maxThreads);
        return new GlobalSensitivity(SobolOutputs, indices);
    }
}
