using Briefwright.Model.Inputs;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating;

/// <summary>The cautions every brief carries, and those the scenario and its results call for.</summary>
public static class Caveats
{
    public static IReadOnlyList<string> Fixed { get; } = new[]
    {
        "**These are model illustrations under stated assumptions, not forecasts.** The figures show where a simple growth model ends up if the assumptions hold; they are not predictions of what will happen.",
        "The balanced-growth optimum ignores the cost of schooling, discounting of future gains, and the quality of schooling; it is not a recommended school-leaving age.",
        "Official statistics and the commissioning body's own appraisal rules prevail over any figure in this brief.",
    };

    /// <summary>Usual ranges for a parameter check; the bounds are common practice in growth accounting, not rules.</summary>
    private static readonly (string Label, Func<ModelInputs, double?> Get, double Low, double High, bool Percent)[] UsualRanges =
    {
        ("saving rate", i => i.Production.SavingRate, 0.10, 0.40, true),
        ("capital share", i => i.Production.CapitalShare, 0.25, 0.45, true),
        ("depreciation rate", i => i.Production.Depreciation, 0.02, 0.10, true),
        ("technology growth", i => i.Production.TechnologyGrowth, 0.0, 0.03, true),
        ("labour-force participation", i => i.Demography.Participation, 0.5, 0.9, true),
        ("retirement age", i => i.Demography.RetirementAge, 55, 72, false),
        ("school-entry age", i => i.Demography.EntryAge, 4, 8, false),
        ("return to a year of schooling", i => (i.HumanCapital.Returns as ConstantReturn)?.Rate, 0.04, 0.15, true),
    };

    public static IReadOnlyList<string> Generated(ScenarioDocument scenario, BalancedGrowthResults results, AnalysisResults? analysis = null)
    {
        var list = new List<string>();
        var inputs = scenario.Inputs;
        var opt = results.Optimum;
        if (opt.AtBoundary)
            list.Add($"The output-maximising schooling length lies at the edge of the feasible range ({Years(opt.SchoolingYears)}); the model gives no interior optimum for these assumptions.");
        else if (opt.SchoolingYears > 25)
            list.Add($"The output-maximising schooling length ({Years(opt.SchoolingYears)}) is far beyond any plausible school career; read it as a property of the model, not as a target.");
        if (inputs.Demography.GrowthRate < 0)
            list.Add($"Population growth is negative ({Pct(inputs.Demography.GrowthRate)} a year). A shrinking population raises the weight of older cohorts; the stable-population assumption is less reliable when decline is recent or driven by migration.");
        if (opt.ClosedFormNotApplicable is { } why)
            list.Add($"The closed-form optimum does not apply because {why}; the optimum was found by numerical search ({opt.Diagnostics.GridPoints} grid points, refined to {Small(opt.Diagnostics.Tolerance)} of a year{(opt.Diagnostics.Converged ? "" : "; the search did not converge")}).");
        if (opt.LocalMaxima.Count > 1)
            list.Add($"Output per person has {opt.LocalMaxima.Count} local maxima over schooling length; the brief reports the highest.");
        foreach (var (label, get, low, high, percent) in UsualRanges)
        {
            if (get(inputs) is not { } v || (v >= low && v <= high)) continue;
            string show(double x) => percent ? Pct(x) : Num(x, x == Math.Floor(x) ? 0 : 2);
            list.Add($"The {label} ({show(v)}) is outside the range usually assumed ({show(low)} to {show(high)}, common practice); check its source.");
        }
        if (analysis is not null) list.AddRange(FromAnalysis(scenario, analysis));
        return list;
    }

    private static IEnumerable<string> FromAnalysis(ScenarioDocument scenario, AnalysisResults a)
    {
        string Label(string id) => Md.Escape(scenario.OptionName(id));
        if (a.MonteCarlo is { } mc)
            foreach (var o in mc.Options)
            {
                if (o.ProbabilityGain.Estimate is >= 0.35 and <= 0.65)
                    yield return $"For {Label(o.OptionId)} the chance of a long-run gain is close to even ({Pct(o.ProbabilityGain.Estimate, 0)} of draws); the sign of the effect is not settled by the model.";
                if (o.ProbabilityPositivePv.Estimate is >= 0.35 and <= 0.65)
                    yield return $"For {Label(o.OptionId)} the chance of a positive present value is close to even ({Pct(o.ProbabilityPositivePv.Estimate, 0)} of draws).";
            }
        var headline = a.Reform.Options.FirstOrDefault(o => o.OptionId == a.HeadlineOptionId);
        if (headline?.PresentValues[0] is { Total: null } pv)
            yield return $"Present values are counted to {a.Reform.ReformYear + a.Reform.HorizonYears} only: {pv.TailNote}. The discounted optimum therefore depends on where the count stops.";
        if (a.Reform.Optimum.SchoolingYears > 20)
            yield return $"Even the discounted optimum ({Years(a.Reform.Optimum.SchoolingYears)}) is long, because the model still counts no cost of schooling other than lost working time.";
    }
}
