using Briefwright.Model.Inputs;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;

namespace Briefwright.Templating;

/// <summary>The cautions every brief carries, and those the scenario and its results call for.</summary>
public sealed class Caveats(BriefLanguage language) : TemplateFunctions(language)
{
    /// <summary>The cautions every brief carries, in the brief's language.</summary>
    public IReadOnlyList<string> Fixed => new[] { T("caveat.not_forecasts"), T("caveat.optimum"),
        T("caveat.official") };

    /// <summary>
    /// Usual ranges for a parameter check; the bounds are common practice in growth accounting, not rules.
    /// </summary>
    private static readonly
        (string Label, Func<ModelInputs, double?> Get, double Low, double High, bool Percent)[] UsualRanges =
    {
        ("caveat.name.saving_rate", i => i.Production.SavingRate, 0.10, 0.40, true),
        ("caveat.name.capital_share", i => i.Production.CapitalShare, 0.25, 0.45, true),
        ("caveat.name.depreciation", i => i.Production.Depreciation, 0.02, 0.10, true),
        ("caveat.name.technology_growth", i => i.Production.TechnologyGrowth, 0.0, 0.03, true),
        ("caveat.name.participation", i => i.Demography.Participation, 0.5, 0.9, true),
        ("caveat.name.retirement_age", i => i.Demography.RetirementAge, 55, 72, false),
        ("caveat.name.school_entry_age", i => i.Demography.EntryAge, 4, 8, false),
        ("caveat.name.return", i => (i.HumanCapital.Returns as ConstantReturn)?.Rate, 0.04, 0.15, true),
    };

    public IReadOnlyList<string> Generated(ScenarioDocument scenario, BalancedGrowthResults results,
        AnalysisResults? analysis = null)
    {
        var list = new List<string>();
        var inputs = scenario.Inputs;
        var opt = results.Optimum;
        if (opt.AtBoundary)
            list.Add(T("caveat.edge", Years(opt.SchoolingYears)));
        else if (opt.SchoolingYears > 25)
            list.Add(T("caveat.far_beyond", Years(opt.SchoolingYears)));
        if (inputs.Demography.GrowthRate < 0)
            list.Add(T("caveat.shrinking", Pct(inputs.Demography.GrowthRate)));
        if (opt.ClosedFormNotApplicable is { } why)
            list.Add(T(opt.Diagnostics.Converged ? "caveat.numerical" : "caveat.numerical_not_converged",
                ResultWords.Brief(this).ClosedFormReason(why), opt.Diagnostics.GridPoints,
                Small(opt.Diagnostics.Tolerance)));
        if (opt.LocalMaxima.Count > 1)
            list.Add(T("caveat.maxima", opt.LocalMaxima.Count));
        foreach (var (label, get, low, high, percent) in UsualRanges)
        {
            if (get(inputs) is not { } v || (v >= low && v <= high)) continue;
            string show(double x) => percent ? Pct(x) : Num(x, x == Math.Floor(x) ? 0 : 2);
            list.Add(T("caveat.unusual", T(label), show(v), show(low), show(high)));
        }
        if (analysis is not null) list.AddRange(FromAnalysis(scenario, analysis));
        return list;
    }

    private IEnumerable<string> FromAnalysis(ScenarioDocument scenario, AnalysisResults a)
    {
        string Label(string id) => Md.Escape(scenario.OptionName(id));
        if (a.MonteCarlo is { } mc)
            foreach (var o in mc.Options)
            {
                if (o.ProbabilityGain.Estimate is >= 0.35 and <= 0.65)
                    yield return T("caveat.even_gain", Label(o.OptionId), Pct(o.ProbabilityGain.Estimate, 0));
                if (o.ProbabilityPositivePv.Estimate is >= 0.35 and <= 0.65)
                    yield return T("caveat.even_pv", Label(o.OptionId), Pct(o.ProbabilityPositivePv.Estimate, 0));
            }
        var headline = a.Reform.Options.FirstOrDefault(o => o.OptionId == a.HeadlineOptionId);
        if (headline?.PresentValues[0] is { Total: null } pv
            && scenario.Analysis.Discounts.FirstOrDefault(d => d.Id == pv.ScheduleId) is { } schedule)
            yield return T("caveat.horizon_only", a.Reform.ReformYear + a.Reform.HorizonYears,
                T("caveat.tail_infinite", Pct(schedule.Steps[^1].Rate),
                    Pct(scenario.Inputs.Production.TechnologyGrowth)));
        if (a.Reform.Optimum.SchoolingYears > 20)
            yield return T("caveat.discounted_long", Years(a.Reform.Optimum.SchoolingYears));
    }
}
