using System.Globalization;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;
using Briefwright.Scenario;
using Scriban.Runtime;
using static Briefwright.Templating.TemplateFunctions;

namespace Briefwright.Templating;

/// <summary>Builds the data a template sees: plain values, formatting functions and block placeholders.</summary>
public static class BriefModelBuilder
{
    public static ScriptObject Build(BriefInputs b)
    {
        var model = new ScriptObject();
        model.AddFunctions(typeof(TemplateFunctions));
        var s = b.Scenario;
        var r = b.Results;

        // Text written in the scenario is text: escaped here, where it meets the template's markup, so it can never make
        // a link, a heading, a list, HTML or a [[directive]] (Md.Escape).
        model["brief"] = Obj(
            ("id", s.Brief.Id), ("title", Md.Text(s.Brief.Title)), ("short_title", Md.Text(s.Brief.ShortTitle)), ("organisation", Md.Text(s.Brief.Organisation)),
            ("author", Md.Text(s.Brief.Author)), ("date", s.Brief.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)), ("status", s.Brief.Status),
            ("edition", s.Brief.Edition), ("question", Md.Text(s.Brief.Question)));
        var options = r.Options.Select(OptionObject).ToList();
        model["options"] = new ScriptArray(options);
        model["baseline"] = options.First(o => (bool)o["is_baseline"]!);
        var alternatives = options.Where(o => !(bool)o["is_baseline"]!).ToList();
        model["alternatives"] = new ScriptArray(alternatives);
        model["best"] = alternatives.MaxBy(o => (double)o["change_pct"]!)!;
        model["worst"] = alternatives.MinBy(o => (double)o["change_pct"]!)!;
        var opt = r.Optimum;
        model["optimum"] = Obj(
            ("schooling_years", opt.SchoolingYears), ("low", opt.Within1Pct[0]), ("high", opt.Within1Pct[1]),
            ("method", opt.Method == OptimumMethod.ClosedForm ? "closed form" : "numerical search"), ("at_boundary", opt.AtBoundary),
            ("output_per_person", opt.OutputPerPerson), ("closed_form_reason", opt.ClosedFormNotApplicable), ("local_maxima", opt.LocalMaxima.Count),
            ("gain_vs_baseline_pct", 100 * (opt.OutputPerPerson / r.Options.First(o => o.IsBaseline).OutputPerPerson - 1)));
        var d = s.Inputs.Demography;
        model["demography"] = Obj(("growth", d.GrowthRate), ("entry_age", d.EntryAge), ("retirement_age", d.RetirementAge),
            ("participation", d.Participation), ("survival", SurvivalText(d.Survival)));
        var p = s.Inputs.Production;
        model["production"] = Obj(("saving_rate", p.SavingRate), ("capital_share", p.CapitalShare), ("depreciation", p.Depreciation),
            ("technology_growth", p.TechnologyGrowth), ("output_per_effective_worker", r.SteadyState.OutputPerEffectiveWorker),
            ("effective_depreciation", r.SteadyState.EffectiveDepreciation));
        AnalysisModel.Add(model, s, r, b.Analysis);
        model["stamp"] = Obj(("input_hash", b.InputHash), ("tool_version", b.ToolVersion), ("template", b.TemplateName), ("template_hash", b.TemplateHash));

        var figureIds = b.Figures.Select(f => f.Id).ToHashSet();
        model.AddFunction("figure", new Func<string, string>(id => figureIds.Contains(id)
            ? $"[[figure: {id}]]"
            : throw new InvalidOperationException($"Unknown figure '{id}'. Known figures: {string.Join(", ", figureIds.Order())}.")));
        model.AddFunction("assumptions_table", new Func<string>(() => AssumptionsTable(s)));
        model.AddFunction("results_table", new Func<string>(() => ResultsTable(r)));
        model.AddFunction("caveats", new Func<string>(() => Md.Bullets(Caveats.Fixed.Concat(Caveats.Generated(s, r, b.Analysis)))));
        model.AddFunction("equations_annex", new Func<string>(() => Equations.Annex(s.Inputs, r)));
        model.AddFunction("reproducibility", new Func<string>(() => Reproducibility(b)));
        return model;
    }

    internal static ScriptObject Obj(params (string Key, object? Value)[] pairs)
    {
        var o = new ScriptObject();
        foreach (var (k, v) in pairs) o[k] = v;
        return o;
    }

    private static ScriptObject OptionObject(OptionResult o) => Obj(
        ("id", o.Id), ("label", Md.Text(o.Label)), ("is_baseline", o.IsBaseline), ("schooling_years", o.SchoolingYears),
        ("worker_share", o.WorkerShare), ("human_capital", o.HumanCapitalPerWorker), ("output_per_person", o.OutputPerPerson),
        ("change_pct", o.ChangeVsBaselinePct));

    public static string SurvivalText(Survival s) => s switch
    {
        RectangularSurvival r => $"everyone lives to {Num(r.MaxAge, 0)}",
        GompertzMakehamSurvival g => $"Gompertz–Makeham (A = {Sig(g.A, 3)}, B = {Sig(g.B, 3)}, c = {Sig(g.C, 4)})",
        TabulatedSurvival t => $"life table to age {Num(t.MaxAge, 0)}",
        _ => s.GetType().Name,
    };

    private static readonly HashSet<int> RightOfFirst = new() { 1 };

    public static string AssumptionsTable(ScenarioDocument s)
    {
        var rows = s.Assumptions.Select(a => (IReadOnlyList<string>)new[]
        {
            a.Label, a.Text ?? FormatValue(a), UnitText(a.Unit), a.Source ?? "not given", a.Note ?? "",
        });
        return Md.Table("Assumptions", $"scenario {s.Brief.Id}", new[] { "Parameter", "Value", "Unit", "Source", "Note" }, rows, RightOfFirst);
    }

    private static string FormatValue(Assumption a) => a.Value is not { } v ? "" : a.Unit switch
    {
        ValueUnit.Rate => Pct(v, Math.Abs(v * 100 - Math.Round(v * 100, 1)) < 1e-9 ? 1 : 2),
        ValueUnit.Years or ValueUnit.Age => Num(v, v == Math.Floor(v) ? 0 : 1),
        _ => Sig(v, 4),
    };

    private static string UnitText(ValueUnit unit) => unit switch
    {
        ValueUnit.Rate => "%",
        ValueUnit.Years => "years",
        ValueUnit.Age => "age",
        _ => "",
    };

    public static string ResultsTable(BalancedGrowthResults r)
    {
        var rows = r.Options.Select(o => (IReadOnlyList<string>)new[]
        {
            o.Label + (o.IsBaseline ? " (baseline)" : ""), Num(o.SchoolingYears, 1), Num(o.WorkerShare, 3), Num(o.HumanCapitalPerWorker, 2),
            Num(o.OutputPerPerson, 3), o.IsBaseline ? "–" : Change(o.ChangeVsBaselinePct, 1),
        });
        return Md.Table("Long-run output per person by option (balanced growth path)", "briefwright model results",
            new[] { "Option", "Schooling (years)", "Worker share", "Human capital per worker", "Output per person", "Change vs baseline" },
            rows, new HashSet<int> { 1, 2, 3, 4, 5 });
    }

    private static string Reproducibility(BriefInputs b) =>
        $"Inputs (scenario and every file it reads), SHA-256: `{b.InputHash}`. Template `{Md.Escape(b.TemplateName)}`, SHA-256: `{b.TemplateHash[..16]}`. Tool: briefwright {b.ToolVersion}. The brief's date comes from the scenario, so the same inputs give a byte-identical PDF.";
}
