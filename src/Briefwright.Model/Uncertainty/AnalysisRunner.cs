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
    public static readonly string[] SobolOutputs = { "headline_long_run_change_pct", "optimum_schooling_years", "headline_present_value" };

    public static AnalysisResults Run(ModelInputs inputs, AnalysisSettings settings, BalancedGrowthResults bgp)
    {
        double guess = bgp.Optimum.SchoolingYears;
        var reform = Appraisal.Run(inputs, settings.Reform, settings.Discounts, guess);
        var tornado = Sensitivity.Tornado(inputs, settings, guess);
        var grids = settings.Grids.Select(g => Sensitivity.Grid(inputs, settings, g, guess)).ToList();
        MonteCarloResults? mc = null;
        GlobalSensitivity? sobol = null;
        if (settings.MonteCarlo is { } spec)
        {
            mc = MonteCarlo.Run(inputs, settings, guess);
            if (spec.SobolSamples > 0) sobol = Sobol(inputs, settings, spec, guess);
        }
        return new AnalysisResults(settings.HeadlineOptionId, reform, tornado, grids, mc, sobol);
    }

    private static GlobalSensitivity Sobol(ModelInputs inputs, AnalysisSettings settings, MonteCarloSpec spec, double guess)
    {
        int headline = inputs.Options.Where(o => o.Id != inputs.BaselineId).Select(o => o.Id).ToList().IndexOf(settings.HeadlineOptionId);
        var names = spec.Parameters.Select(p => p.Parameter).ToList();
        var indices = Uncertainty.Sobol.Estimate(spec.Parameters.Count, spec.SobolSamples, spec.Seed ^ 0x5AB0_1D5EUL, names, u =>
        {
            var trial = MonteCarlo.Apply(inputs, spec.Parameters, u);
            if (Parameters.Violation(trial) is not null) return null;
            var k = KeyResultsEvaluator.Evaluate(trial, settings, guess, keepHeadlinePath: false);
            return new[] { k.LongRunChangePct[headline], k.OptimumYears, k.PresentValue[headline] };
        });
        return new GlobalSensitivity(SobolOutputs, indices);
    }
}
