using Briefwright.Model.Dynamics;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using Scriban.Runtime;

namespace Briefwright.Templating;

/// <summary>Template data and block placeholders for the reform over time, sensitivity and uncertainty.</summary>
internal sealed class AnalysisModel(BriefLanguage language) : TemplateFunctions(language)
{
    public void Add(ScriptObject model, ScenarioDocument s, BalancedGrowthResults r, AnalysisResults a)
    {
        string Label(string id) => s.Inputs.Options.First(o => o.Id == id).Label;
        var outcomes = OptionOutcomes.From(r, a);
        model["headline"] = Headline(model, s, r, a, outcomes.Headline);
        AddReform(model, s, a, outcomes.Headline);
        model["dynamics_available"] = true;
        AddSensitivity(model, a, outcomes.Headline);
        model["mc"] = a.MonteCarlo is { } mc ? MonteCarloSummary(mc, outcomes.Headline.Uncertainty!) : null;
        model["sobol"] = a.Sobol is { } sobol ? SobolSummary(sobol) : null;

        model.AddFunction("reform_table", new Func<string>(() => ReformTable(a, Label)));
        model.AddFunction("appraisal_table", new Func<string>(() => AppraisalTable(a, Label)));
        model.AddFunction("uncertainty_table", new Func<string>(() => UncertaintyTable(a, Label)));
        model.AddFunction("sobol_table", new Func<string>(() => SobolTable(a)));
    }

    /// <summary>The reform over time: every option's path and present values, and the discounted optimum.</summary>
    private void AddReform(ScriptObject model, ScenarioDocument s, AnalysisResults a, OptionOutcome headline)
    {
        var reform = a.Reform;
        ScriptObject OptionPath(OptionAppraisal o)
        {
            var headlinePv = o.PresentValues[0];
            var option = s.Inputs.Options.First(x => x.Id == o.OptionId);
            return Obj(("id", o.OptionId), ("label", Md.Escape(option.Label)),
                ("name", Md.Escape(s.OptionName(o.OptionId))),
                ("schedule_name", Md.Escape(s.RuleName(headlinePv.ScheduleId))),
                ("lengthens_schooling", option.SchoolingYears > s.Inputs.Baseline.SchoolingYears),
                ("dip_depth", o.Path.DipDepth), ("dip_year", reform.ReformYear + o.Path.DipYear),
                ("has_dip", o.Path.DipDepth is not null),
                ("first_positive_year", reform.ReformYear + o.Path.FirstPositiveYear),
                ("long_run", o.Path.LongRunGain), ("balanced_growth", o.Path.BalancedGrowthGain),
                ("pv", headlinePv.ToHorizon), ("pv_total", headlinePv.Total),
                ("break_even_year", reform.ReformYear + headlinePv.BreakEvenYear),
                ("schedule", Md.Escape(headlinePv.ScheduleLabel)));
        }
        var d = reform.Optimum;
        model["reform"] = Obj(("year", reform.ReformYear), ("horizon", reform.HorizonYears),
            ("end_year", reform.ReformYear + reform.HorizonYears),
            ("valuation_year", reform.ValuationYear),
            ("price_base", ResultWords.Brief(this).PriceBase(reform.ValuationYear)),
            ("phase_in", reform.PhaseInCohorts), ("options", new ScriptArray(reform.Options.Select(OptionPath))),
            ("headline", OptionPath(headline.Appraisal!)),
            ("discounted_optimum", Obj(("years", d.SchoolingYears), ("pv", d.PresentValue),
                ("explanation", ResultWords.Brief(this).Explanation(d)),
                ("schedule", Md.Escape(s.Analysis.Headline.Label)), ("balanced_growth", d.BalancedGrowthOptimum),
                ("tail_included", d.TailIncluded),
                ("by_horizon", new ScriptArray(d.ByHorizon.Select(
                    x => Obj(("horizon", x.HorizonYears), ("years", x.SchoolingYears), ("pv", x.PresentValue))))),
                ("tail_text", TailText(d, reform.HorizonYears)))));
    }

    /// <summary>The tornado of the headline option's long-run change.</summary>
    private void AddSensitivity(ScriptObject model, AnalysisResults a, OptionOutcome headline)
    {
        model["sensitivity_available"] = a.Tornado.Count > 0 || a.MonteCarlo is not null;
        model["tornado"] = new ScriptArray(headline.Swings.Select(w => Obj(("parameter", w.Row.Parameter),
            ("label", ParameterLabel(w.Row.Parameter, w.Row.Label)), ("at_low", w.AtLowPct), ("at_high", w.AtHighPct),
            ("swing", w.Row.Swing),
            ("optimum_low", w.Row.AtLow.OptimumYears), ("optimum_high", w.Row.AtHigh.OptimumYears))));
        // Parameters whose whole range moves the headline change by less than 0.05 points: named, not assumed.
        var still = headline.Swings.Where(w => Math.Abs(w.AtHighPct - w.AtLowPct) < 0.05)
            .Select(w => InSentence(ParameterLabel(w.Row.Parameter, w.Row.Label))).ToList();
        model["tornado_still"] = still.Count == 0 ? null : Wording.List(still);
        model["has_grid"] = a.Grids.Count > 0;
    }

    private ScriptObject MonteCarloSummary(MonteCarloResults mc, OptionUncertainty o) =>
        Obj(("draws", mc.Draws), ("rejected", mc.Rejected), ("seed", mc.Seed.ToString()),
            ("p5", o.LongRunChangePct.P5), ("p50", o.LongRunChangePct.P50), ("p95", o.LongRunChangePct.P95),
            ("prob_gain", o.ProbabilityGain.Estimate), ("prob_gain_low", o.ProbabilityGain.Low),
            ("prob_gain_high", o.ProbabilityGain.High),
            ("prob_gain_text", ProbabilityWords.Sentence(o.ProbabilityGain)),
            ("prob_pv", o.ProbabilityPositivePv.Estimate), ("prob_pv_low", o.ProbabilityPositivePv.Low),
            ("prob_pv_high", o.ProbabilityPositivePv.High),
            ("prob_pv_text", ProbabilityWords.Sentence(o.ProbabilityPositivePv)),
            ("optimum_p5", mc.OptimumYears.P5), ("optimum_p50", mc.OptimumYears.P50),
            ("optimum_p95", mc.OptimumYears.P95));

    private ScriptObject SobolSummary(GlobalSensitivity sobol)
    {
        var idx = sobol.Indices[0];
        int top = Enumerable.Range(0, idx.Inputs.Count).MaxBy(i => idx.Total[i]);
        return Obj(("top_parameter", ParameterLabel(idx.Inputs[top], Parameters.Find(idx.Inputs[top])!.Label)),
            ("top_total", idx.Total[top]), ("top_total_low", idx.TotalLow[top]), ("top_total_high", idx.TotalHigh[top]),
            ("top_first", idx.FirstOrder[top]),
            ("top_first_low", idx.FirstOrderLow[top]), ("top_first_high", idx.FirstOrderHigh[top]),
            ("samples", idx.Samples), ("resamples", idx.Resamples), ("level", idx.Level),
            ("top_share", T(idx.Total[top] > 0.5 ? "sobol.most" : "sobol.largest_share")));
    }

    /// <summary>
    /// The headline option: its facts and the sentences page 1 is made of, each chosen from those facts.
    /// </summary>
    private ScriptObject Headline(
        ScriptObject model, ScenarioDocument s, BalancedGrowthResults r, AnalysisResults a, OptionOutcome headline)
    {
        var h = HeadlineFacts.From(headline, a.Reform);
        var option = ((ScriptArray)model["options"]!).Cast<ScriptObject>().First(o => (string)o["id"]! == h.OptionId);
        var baseline = (ScriptObject)model["baseline"]!;
        string rule = s.RuleName(h.ScheduleId);
        int y0 = a.Reform.ReformYear;
        string lead = T("headline.lead", Wording.Capitalise(s.OptionName(h.OptionId)),
            Wording.Effect(h.LongRunChangePct), baseline["name"]);
        var decomposition = r.Levers.FirstOrDefault(l => l.OptionId == h.OptionId);
        string? split = decomposition is { IsCombined: true }
            ? T("headline.split", BriefModelBuilder.DecompositionText(decomposition)) : null;
        var others = ((ScriptArray)model["alternatives"]!).Cast<ScriptObject>()
            .Where(o => (string)o["id"]! != h.OptionId).Select(o =>
            {
                string line = T("headline.other", o["label"], Wording.Effect((double)o["change_pct"]!));
                if (o["decomposition_text"] is string d) line += $" ({d})";
                return (object)Obj(("id", o["id"]), ("label", o["label"]), ("line", line + "."));
            });
        return Obj(("id", h.OptionId), ("label", option["label"]), ("name", option["name"]),
            ("change_pct", h.LongRunChangePct),
            ("direction", Wording.DirectionWord(h.LongRunChangePct)), ("effect", Wording.Effect(h.LongRunChangePct)),
            ("lead", lead), ("split", split), ("range", Wording.Range(h)), ("arrival", Wording.Arrival(h, y0)),
            ("payback", Wording.Payback(h, rule, y0)),
            ("has_range", h.RangeLowPct is not null), ("range_low", h.RangeLowPct), ("range_high", h.RangeHighPct),
            ("prob_gain", h.ProbabilityGain),
            ("dip_pct", h.DeepestDipPct), ("dip_year", h.DipCalendarYear), ("first_year_above", h.FirstYearAbove),
            ("first_year_below", h.FirstYearBelow),
            ("break_even_year", h.BreakEvenCalendarYear), ("pays_back", h.BreakEvenCalendarYear is not null),
            ("rule", rule), ("horizon_end_year", h.HorizonEndYear),
            ("present_value", h.PresentValue), ("is_combined", decomposition?.IsCombined ?? false),
            ("others", new ScriptArray(others)));
    }

    private string Year(int reformYear, int? t) => t is { } y ? (reformYear + y).ToString() : "–";

    private string ReformTable(AnalysisResults a, Func<string, string> label)
    {
        var r = a.Reform;
        var rows = r.Options.Select(o => (IReadOnlyList<string>)new[]
        {
            label(o.OptionId), o.Path.DipDepth is { } dd ? Change(100 * dd) : T("table.none"),
            Year(r.ReformYear, o.Path.DipYear), Year(r.ReformYear, o.Path.FirstPositiveYear),
            o.PresentValues[0].BreakEvenYear is null
                ? T("table.not_by", r.ReformYear + r.HorizonYears)
                : Year(r.ReformYear, o.PresentValues[0].BreakEvenYear),
            Change(100 * o.Path.LongRunGain), Change(100 * o.Path.BalancedGrowthGain),
        });
        return Md.Table(T("table.reform_caption", r.ReformYear), T("source.simulation"),
            new[]
            {
                T("table.option"), T("table.deepest_dip"), T("table.dip_year"), T("table.above_from"),
                T("table.pays_back", r.Options[0].PresentValues[0].ScheduleLabel),
                T("table.change_in", r.ReformYear + r.HorizonYears), T("table.once_adjusted"),
            },
            rows, new HashSet<int> { 1, 2, 3, 4, 5, 6 });
    }

    private string AppraisalTable(AnalysisResults a, Func<string, string> label)
    {
        var schedules = a.Reform.Options[0].PresentValues;
        var header = new List<string> { T("table.option") };
        header.AddRange(schedules.Select(p => p.ScheduleLabel));
        var rows = a.Reform.Options.Select(o =>
            (IReadOnlyList<string>)o.PresentValues.Select(pv => Pv(pv.ToHorizon)).Prepend(label(o.OptionId)).ToList());
        return Md.Table(T("table.pv_caption", a.Reform.ReformYear + a.Reform.HorizonYears, a.Reform.ValuationYear),
            T("source.pv", a.Reform.ValuationYear), header, rows, Enumerable.Range(1, schedules.Count).ToHashSet());
    }

    private string UncertaintyTable(AnalysisResults a, Func<string, string> label)
    {
        if (a.MonteCarlo is not { } mc) return "";
        var rows = mc.Options.Select(o => (IReadOnlyList<string>)new[]
        {
            label(o.OptionId),
            Change(o.LongRunChangePct.P5), Change(o.LongRunChangePct.P50), Change(o.LongRunChangePct.P95),
            ProbabilityWords.Cell(o.ProbabilityGain), ProbabilityWords.Cell(o.ProbabilityPositivePv),
        });
        return Md.Table(T("table.mc_caption", Big(mc.Draws), mc.Seed), T("source.mc"),
            new[]
            {
                T("table.option"), T("table.p5"), T("table.median"), T("table.p95"), T("table.prob_gain"),
                T("table.prob_pv"),
            },
            rows, new HashSet<int> { 1, 2, 3, 4, 5 });
    }

    private string SobolTable(AnalysisResults a)
    {
        if (a.Sobol is not { } s) return "";
        var idx = s.Indices;
        string Show(double v) => v is > -0.005 and < 0.005 ? Num(0, 2) : Num(v, 2);
        string Cell(double v, double lo, double hi) => $"{Show(v)} ({Show(lo)}–{Show(hi)})";
        var rows = Enumerable.Range(0, idx[0].Inputs.Count).OrderByDescending(i => idx[0].Total[i]).Select(i =>
            (IReadOnlyList<string>)new[]
            {
                ParameterLabel(idx[0].Inputs[i], Parameters.Find(idx[0].Inputs[i])!.Label),
                Cell(idx[0].FirstOrder[i], idx[0].FirstOrderLow[i], idx[0].FirstOrderHigh[i]),
                Cell(idx[0].Total[i], idx[0].TotalLow[i], idx[0].TotalHigh[i]),
                Cell(idx[1].Total[i], idx[1].TotalLow[i], idx[1].TotalHigh[i]),
                Cell(idx[2].Total[i], idx[2].TotalLow[i], idx[2].TotalHigh[i]),
            });
        return Md.Table(T("table.sobol_caption", Big(idx[0].Samples), Pct(idx[0].Level, 0)), T("source.sobol"),
            new[]
            {
                T("table.parameter"), T("table.sobol_first"), T("table.sobol_total"), T("table.sobol_optimum"),
                T("table.sobol_pv"),
            },
            rows, new HashSet<int> { 1, 2, 3, 4 });
    }

    /// <summary>
    /// How the discounted optimum treats the value beyond the horizon, in words chosen from the result.
    /// </summary>
    private string TailText(Model.Dynamics.DiscountedOptimum d, int horizon)
    {
        if (d.TailIncluded)
            return T("tail.included", horizon);
        var cuts = string.Join(", ",
            d.ByHorizon.Select(x => T("tail.cut_at", Years(x.SchoolingYears), x.HorizonYears)));
        return T("tail.cut", horizon, cuts);
    }

    /// <summary>
    /// A parameter's label in the brief's language (key <c>parameter.&lt;name&gt;</c>), else the model's.
    /// </summary>
    internal string ParameterLabel(string name, string fallback) =>
        L.Texts.TryGetValue("parameter." + name, out var t) ? t.Text : fallback;

    /// <summary>
    /// A label as it reads inside a sentence: lower case, except German nouns (key <c>list.lower_case</c>).
    /// </summary>
    internal string InSentence(string label) => L.Get("list.lower_case") == "yes" ? label.ToLowerInvariant() : label;
}
