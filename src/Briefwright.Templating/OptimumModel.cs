using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using Scriban.Runtime;

namespace Briefwright.Templating;

/// <summary>
/// The output-maximising schooling length as template data, with sentences chosen from its shape: inside the
/// range, at a corner (never called a peak), flat, or with several local maxima; and the discounted optimum beside it.
/// </summary>
internal sealed class OptimumModel(BriefLanguage language) : TemplateFunctions(language)
{
    /// <summary>A 1% band at least this wide (years) is called flat.</summary>
    public const double FlatBandYears = 5;

    public ScriptObject Build(ScenarioDocument s, BalancedGrowthResults r, AnalysisResults a)
    {
        var opt = r.Optimum;
        var baseline = r.Options.First(o => o.IsBaseline);
        string shape = !opt.AtBoundary
            ? "interior"
            : opt.SchoolingYears <= opt.FeasibleMaxSchooling / 2 ? "corner_zero" : "corner_max";
        double width = opt.Within1Pct[1] - opt.Within1Pct[0];
        bool flat = width >= FlatBandYears;
        string summary = shape switch
        {
            "corner_zero" => T("optimum.corner_zero"),
            "corner_max" => T("optimum.corner_max", Years(opt.SchoolingYears)),
            _ => T("optimum.interior", Years(opt.SchoolingYears),
                T(opt.Method == OptimumMethod.ClosedForm ? "optimum.closed_form" : "optimum.numerical")),
        };
        string band = shape == "corner_zero"
            ? T("optimum.band_up_to", Years(opt.Within1Pct[1]))
            : T(flat ? "optimum.band_flat" : "optimum.band", Years(opt.Within1Pct[0]), Years(opt.Within1Pct[1]));
        string? maxima = opt.LocalMaxima.Count > 1
            ? T("optimum.maxima", opt.LocalMaxima.Count, Wording.List(
                opt.LocalMaxima.OrderBy(m => m.SchoolingYears).Select(m => Years(m.SchoolingYears)).ToList()))
            : null;
        var d = a.Reform.Optimum;
        string rule = s.RuleName(d.ScheduleId);
        string discounted = opt.SchoolingYears <= baseline.SchoolingYears
            ? T("discounted.not_searched", Years(baseline.SchoolingYears))
            : d.SchoolingYears <= baseline.SchoolingYears + 1e-9
                ? T("discounted.none_positive", rule, Years(baseline.SchoolingYears), Years(opt.SchoolingYears))
                : Years(d.SchoolingYears) == Years(opt.SchoolingYears)
                    ? T("discounted.same", rule, Years(d.SchoolingYears))
                    : T("discounted.differs", rule, Years(d.SchoolingYears), Years(opt.SchoolingYears));
        return Obj(
            ("schooling_years", opt.SchoolingYears), ("low", opt.Within1Pct[0]), ("high", opt.Within1Pct[1]),
            ("method", opt.Method == OptimumMethod.ClosedForm ? "closed form" : "numerical search"),
            ("at_boundary", opt.AtBoundary),
            ("output_per_person", opt.OutputPerPerson),
            ("closed_form_reason",
                opt.ClosedFormNotApplicable is { } why ? ResultWords.Brief(this).ClosedFormReason(why) : null),
            ("local_maxima", opt.LocalMaxima.Count),
            ("gain_vs_baseline_pct", 100 * (opt.OutputPerPerson / baseline.OutputPerPerson - 1)),
            ("shape", shape), ("is_corner", opt.AtBoundary), ("is_flat", flat), ("summary", summary),
            ("band_text", band), ("maxima_text", maxima),
            ("discounted_text", discounted), ("discounted_years", d.SchoolingYears), ("discounted_rule", rule));
    }
}
