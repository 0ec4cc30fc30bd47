using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using Scriban.Runtime;
using static Briefwright.Templating.BriefModelBuilder;
using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating;

/// <summary>
/// The output-maximising schooling length as template data, with sentences chosen from its shape: inside the
/// range, at a corner (never called a peak), flat, or with several local maxima; and the discounted optimum beside it.
/// </summary>
internal static class OptimumModel
{
    /// <summary>A 1% band at least this wide (years) is called flat.</summary>
    public const double FlatBandYears = 5;

    public static ScriptObject Build(ScenarioDocument s, BalancedGrowthResults r, AnalysisResults a)
    {
        var opt = r.Optimum;
        var baseline = r.Options.First(o => o.IsBaseline);
        string shape = !opt.AtBoundary ? "interior" : opt.SchoolingYears <= opt.FeasibleMaxSchooling / 2 ? "corner_zero" : "corner_max";
        double width = opt.Within1Pct[1] - opt.Within1Pct[0];
        bool flat = width >= FlatBandYears;
        string summary = shape switch
        {
            "corner_zero" => "In this model output per person is highest with no schooling at all: it falls as soon as schooling lengthens from zero, so the model's answer lies at the edge of the feasible range, not inside it.",
            "corner_max" => $"In this model output per person is highest at the longest schooling the assumptions allow ({Years(opt.SchoolingYears)}), so the model's answer lies at the edge of the feasible range, not inside it.",
            _ => $"In this model output per person would be highest with {Years(opt.SchoolingYears)} of schooling ({(opt.Method == OptimumMethod.ClosedForm ? "closed form" : "numerical search")}).",
        };
        string band = shape == "corner_zero"
            ? $"Any length up to {Years(opt.Within1Pct[1])} comes within 1% of that level."
            : $"Any length between {Years(opt.Within1Pct[0])} and {Years(opt.Within1Pct[1])} comes within 1% of the maximum" +
              (flat ? ", so the curve is flat near its top and small changes in the assumptions move the optimum a lot." : ".");
        string? maxima = opt.LocalMaxima.Count > 1
            ? $"Output per person has {opt.LocalMaxima.Count} local maxima over schooling length, at {Wording.List(opt.LocalMaxima.OrderBy(m => m.SchoolingYears).Select(m => Years(m.SchoolingYears)).ToList())}; the highest is the one given."
            : null;
        var d = a.Reform.Optimum;
        string rule = s.RuleName(d.ScheduleId);
        string discounted = opt.SchoolingYears <= baseline.SchoolingYears
            ? $"The output-maximising length is no longer than the baseline's {Years(baseline.SchoolingYears)}, so no discounted optimum was searched for: that search looks only at longer schooling."
            : d.SchoolingYears <= baseline.SchoolingYears + 1e-9
                ? $"Discounted at {rule}, no schooling length between the baseline's {Years(baseline.SchoolingYears)} and {Years(opt.SchoolingYears)} gives a reform a positive present value."
                : Years(d.SchoolingYears) == Years(opt.SchoolingYears)
                    ? $"Discounted at {rule}, the schooling length that maximises the present value of a reform is the same, {Years(d.SchoolingYears)}, to one decimal."
                    : $"Discounted at {rule}, the schooling length that maximises the present value of a reform is {Years(d.SchoolingYears)}, against {Years(opt.SchoolingYears)} without discounting: discounting weighs the early loss of workers against gains that arrive decades later.";
        return Obj(
            ("schooling_years", opt.SchoolingYears), ("low", opt.Within1Pct[0]), ("high", opt.Within1Pct[1]),
            ("method", opt.Method == OptimumMethod.ClosedForm ? "closed form" : "numerical search"), ("at_boundary", opt.AtBoundary),
            ("output_per_person", opt.OutputPerPerson), ("closed_form_reason", opt.ClosedFormNotApplicable), ("local_maxima", opt.LocalMaxima.Count),
            ("gain_vs_baseline_pct", 100 * (opt.OutputPerPerson / baseline.OutputPerPerson - 1)),
            ("shape", shape), ("is_corner", opt.AtBoundary), ("is_flat", flat), ("summary", summary), ("band_text", band), ("maxima_text", maxima),
            ("discounted_text", discounted), ("discounted_years", d.SchoolingYears), ("discounted_rule", rule));
    }
}
