using System.Globalization;
using Briefwright.Model.Inputs;
using Briefwright.Model.Results;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario;
using Scriban.Runtime;

namespace Briefwright.Templating;

/// <summary>Builds the data a template sees: plain values, formatting functions and block placeholders.</summary>
public sealed class BriefModelBuilder(BriefLanguage language) : TemplateFunctions(language)
{
    public ScriptObject Build(BriefInputs b)
    {
        var model = new ScriptObject();
        AddTo(model);
        var language = L;
        model.AddFunction("say", new Say(language.Format));
        model["language"] = Obj(("code", language.Code), ("tag", language.Tag));
        var s = b.Scenario;
        var r = b.Results;

        // Text written in the scenario is text: escaped here, where it meets the template's markup, so it can never
        // make a link, a heading, a list, HTML or a [[directive]] (Md.Escape).
        model["brief"] = Obj(
            ("id", s.Brief.Id), ("title", Md.Text(s.Brief.Title)), ("short_title", Md.Text(s.Brief.ShortTitle)),
            ("organisation", Md.Text(s.Brief.Organisation)), ("author", Md.Text(s.Brief.Author)),
            ("date", s.Brief.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)), ("status", s.Brief.Status),
            ("edition", s.Brief.Edition), ("question", Md.Text(s.Brief.Question)));
        var baseResult = r.Options.First(o => o.IsBaseline);
        var levers = r.Levers.ToDictionary(l => l.OptionId);
        var options = r.Options.Select(o => OptionObject(s, o, baseResult, levers.GetValueOrDefault(o.Id))).ToList();
        model["options"] = new ScriptArray(options);
        model["baseline"] = options.First(o => (bool)o["is_baseline"]!);
        var alternatives = options.Where(o => !(bool)o["is_baseline"]!).ToList();
        model["alternatives"] = new ScriptArray(alternatives);
        model["best"] = alternatives.MaxBy(o => (double)o["change_pct"]!)!;
        model["worst"] = alternatives.MinBy(o => (double)o["change_pct"]!)!;
        model["has_combined"] = r.Levers.Any(l => l.IsCombined);
        model["results_summary"] = ResultsSummary(s, r);
        model["optimum"] = OptimumModel.Build(s, r, b.Analysis);
        var d = s.Inputs.Demography;
        model["demography"] = Obj(("growth", d.GrowthRate), ("entry_age", d.EntryAge),
            ("retirement_age", d.RetirementAge),
            ("participation", d.Participation), ("survival", SurvivalText(d.Survival)),
            ("growth_text", Math.Round(d.GrowthRate * 100, 1) > 0 ? T("demography.growing", Pct(d.GrowthRate))
                : Math.Round(d.GrowthRate * 100, 1) < 0 ? T("demography.shrinking", Pct(-d.GrowthRate))
                : T("demography.steady")));
        var p = s.Inputs.Production;
        model["production"] = Obj(("saving_rate", p.SavingRate), ("capital_share", p.CapitalShare),
            ("depreciation", p.Depreciation), ("technology_growth", p.TechnologyGrowth),
            ("output_per_effective_worker", r.SteadyState.OutputPerEffectiveWorker),
            ("effective_depreciation", r.SteadyState.EffectiveDepreciation));
        AnalysisModel.Add(model, s, r, b.Analysis);
        model["stamp"] = Obj(("input_hash", b.InputHash), ("tool_version", b.ToolVersion),
            ("template", b.TemplateName), ("template_hash", b.TemplateHash));
        AddBlocks(model, b);
        return model;
    }

    /// <summary>The template functions that place a figure or write a block: tables, caveats, annexes.</summary>
    private void AddBlocks(ScriptObject model, BriefInputs b)
    {
        var s = b.Scenario;
        var r = b.Results;
        var figureIds = b.Figures.Select(f => f.Id).ToHashSet();
        model.AddFunction("figure", new Func<string, string>(id => figureIds.Contains(id)
            ? $"[[figure: {id}]]"
            : throw new InvalidOperationException($"Unknown figure '{id}'. Known figures: " +
                $"{string.Join(", ", figureIds.Order())}.")));
        model.AddFunction("assumptions_table", new Func<string>(() => AssumptionsTable(s)));
        model.AddFunction("key_assumptions_table", new Func<string>(() => KeyAssumptions.Table(s, b.Analysis)));
        model.AddFunction("levers_table", new Func<string>(() => LeversTable(s, r)));
        model.AddFunction("results_table", new Func<string>(() => ResultsTable(r, s)));
        model.AddFunction("caveats",
            new Func<string>(() => Md.Bullets(Caveats.Fixed.Concat(Caveats.Generated(s, r, b.Analysis)))));
        model.AddFunction("equations_annex", new Func<string>(() => Equations.Annex(s.Inputs, r)));
        model.AddFunction("reproducibility", new Func<string>(() => Reproducibility(b)));
    }

    /// <summary>The template function <c>say "key" values…</c>: a text of the brief's language.</summary>
    public delegate string Say(string key, params object?[] values);

    private ScriptObject OptionObject(ScenarioDocument s, OptionResult o, OptionResult baseline,
        Model.Core.LeverDecomposition? levers)
    {
        var decomposition = levers?.Levers ?? [];
        double delta = o.SchoolingYears - baseline.SchoolingYears;
        return Obj(
            ("id", o.Id), ("label", Md.Text(o.Label)), ("name", Md.Text(s.OptionName(o.Id))),
            ("is_baseline", o.IsBaseline), ("schooling_years", o.SchoolingYears),
            ("worker_share", o.WorkerShare), ("human_capital", o.HumanCapitalPerWorker),
            ("output_per_person", o.OutputPerPerson),
            ("relative", 100 * o.OutputPerPerson / baseline.OutputPerPerson),
            ("change_pct", o.ChangeVsBaselinePct), ("direction", Wording.DirectionWord(o.ChangeVsBaselinePct)),
            ("effect", Wording.Effect(o.ChangeVsBaselinePct)),
            ("schooling_direction", delta > 0 ? "longer" : delta < 0 ? "shorter" : "same"),
            ("schooling_change_years", delta),
            ("levers", new ScriptArray(decomposition.Select(l => Wording.LeverName(l.Lever)))),
            ("is_combined", levers?.IsCombined ?? false),
            ("decomposition", new ScriptArray(decomposition.Select(
                l => Obj(("lever", l.Lever), ("name", Wording.LeverName(l.Lever)), ("points", l.ChangePct))))),
            ("decomposition_text", levers is { IsCombined: true } ? DecompositionText(levers) : null));
    }

    /// <summary>"schooling +8.2 points and the retirement age +4.0 points".</summary>
    public string DecompositionText(Model.Core.LeverDecomposition d) =>
        Wording.List(
            d.Levers.Select(l => T("lever.points", Wording.LeverName(l.Lever), Wording.Points(l.ChangePct))).ToList());

    /// <summary>
    /// What the options that change schooling alone show about the two opposing forces, chosen from their signs.
    /// </summary>
    private string ResultsSummary(ScenarioDocument s, BalancedGrowthResults r)
    {
        var alone = r.Levers.Where(l => l.Levers.Count == 1 && l.Levers[0].Lever == Model.Core.Levers.Schooling)
            .ToList();
        var baseYears = r.Options.First(o => o.IsBaseline).SchoolingYears;
        var parts = new List<string>();
        foreach (bool longer in new[] { true, false })
        {
            var set = alone.Where(l => (r.Options.First(o => o.Id == l.OptionId).SchoolingYears > baseYears) == longer)
                .ToList();
            if (set.Count == 0) continue;
            var dirs = set.Select(l => HeadlineFacts.Of(l.TotalChangePct)).Distinct().ToList();
            string side = longer ? "longer" : "shorter";
            string which = T(set.Count == 1 ? $"summary.one_{side}" : $"summary.every_{side}");
            string gainSide = T(longer ? "summary.gain_human_capital" : "summary.gain_workers");
            string lossSide = T(longer ? "summary.loss_workers" : "summary.loss_human_capital");
            if (dirs.Count > 1)
                parts.Add(T($"summary.mixed_{side}"));
            else parts.Add(dirs[0] switch
            {
                Direction.Rise => T("summary.rises", which, gainSide, lossSide),
                Direction.Fall => T("summary.falls", which, lossSide, gainSide),
                _ => T("summary.cancel", which),
            });
        }
        return string.Join(" ", parts);
    }

    public string LeversTable(ScenarioDocument s, BalancedGrowthResults r)
    {
        var combined = r.Levers.Where(l => l.IsCombined).ToList();
        if (combined.Count == 0) return "";
        var names = Model.Core.Levers.All.Where(lever => combined.Any(c => c.Levers.Any(l => l.Lever == lever)))
            .ToList();
        var header = new List<string> { T("table.option") };
        header.AddRange(names.Select(n => T("lever.heading." + n)));
        header.Add(T("table.total_change"));
        var rows = combined.Select(c =>
        {
            var row = new List<string> { Md.Escape(r.Options.First(o => o.Id == c.OptionId).Label) };
            row.AddRange(names.Select(
                n => c.Levers.FirstOrDefault(l => l.Lever == n) is { } l ? Wording.Points(l.ChangePct) : "–"));
            row.Add(Change(c.TotalChangePct));
            return (IReadOnlyList<string>)row;
        });
        return Md.Table(T("table.levers_caption"), T("source.model_results"), header, rows,
            Enumerable.Range(1, names.Count + 1).ToHashSet());
    }

    public string SurvivalText(Survival s) => s switch
    {
        RectangularSurvival r => T("survival.rectangular", Num(r.MaxAge, 0)),
        GompertzMakehamSurvival g => $"Gompertz–Makeham (A = {Sig(g.A, 3)}, B = {Sig(g.B, 3)}, c = {Sig(g.C, 4)})",
        TabulatedSurvival t => T("survival.table", Num(t.MaxAge, 0)),
        _ => s.GetType().Name,
    };

    private static readonly System.Collections.Frozen.FrozenSet<int> RightOfFirst =
        System.Collections.Frozen.FrozenSet.ToFrozenSet([1]);

    public string AssumptionsTable(ScenarioDocument s)
    {
        var rows = s.Assumptions.Select(a => (IReadOnlyList<string>)new[]
        {
            Label(a), ValueText(s, a), SourceText(a), a.Note ?? "",
        });
        return Md.Table(T("table.assumptions_caption"), T("source.scenario", s.Brief.Id),
            new[] { T("table.parameter"), T("table.value"), T("table.source"), T("table.note") }, rows, RightOfFirst);
    }

    /// <summary>The source column: an option without a source of its own is defined in the scenario.</summary>
    public string SourceText(Assumption a) => a.Source switch
    {
        null => a.Path.StartsWith("options[", StringComparison.Ordinal)
            ? T("source.defined_here")
            : T("source.none_given"),
        BriefDateSource => T("source.brief_date"),
        _ => a.Source,
    };

    /// <summary>The source the scenario reader gives a valuation year left to its default.</summary>
    private const string BriefDateSource = "the brief's date";

    /// <summary>
    /// An assumption's value as the table shows it: the reader's text, except brackets of returns, written in the
    /// brief's language.
    /// </summary>
    public string ValueText(ScenarioDocument s, Assumption a) =>
        a.Path == "human_capital.returns.brackets" && s.Inputs.HumanCapital.Returns is BracketReturns b
            ? string.Join("; ", b.Brackets.Select(x => T("value.bracket",
                Localise((x.Rate * 100).ToString("0.0##", CultureInfo.InvariantCulture)) + L.PercentSign,
                Num(x.FromYear, 0))))
            : a.Text ?? FormatValue(a);

    /// <summary>
    /// An assumption's label in the brief's language: the scenario's own label for an option, else the language's
    /// name for the field (key <c>field.&lt;path&gt;</c>), else the label the scenario reader gave it.
    /// </summary>
    public string Label(Assumption a)
    {
        string path = System.Text.RegularExpressions.Regex.Replace(a.Path, @"\[[0-9]+\]", "[]");
        if (!L.Texts.TryGetValue("field." + path, out var t)) return a.Label;
        // An option's row is labelled "Schooling: <the option's own label>": only the first part is the tool's.
        const string optionRow = "Schooling: ";
        return path == "options[].schooling_years" && a.Label.StartsWith(optionRow, StringComparison.Ordinal)
            ? L.Format("field." + path, a.Label[optionRow.Length..]) : t.Text;
    }

    /// <summary>A value with its unit, once: rates as percentages, years with "years", ages bare.</summary>
    public string FormatValue(Assumption a) => a.Value is not { } v ? "" : a.Unit switch
    {
        ValueUnit.Rate => Pct(v, Math.Abs(v * 100 - Math.Round(v * 100, 1)) < 1e-9 ? 1 : 2),
        ValueUnit.Years => Years(v),
        ValueUnit.Age => Num(v, v == Math.Floor(v) ? 0 : 1),
        _ => Sig(v, 4),
    };

    public string ResultsTable(BalancedGrowthResults r, ScenarioDocument? s = null)
    {
        var baseY = r.Options.First(o => o.IsBaseline).OutputPerPerson;
        var rows = r.Options.Select(o => (IReadOnlyList<string>)new[]
        {
            o.Label + (o.IsBaseline ? T("table.baseline_suffix") : ""),
            Num(o.SchoolingYears, 1), Num(o.WorkerShare, 3), Num(o.HumanCapitalPerWorker, 2),
            Num(100 * o.OutputPerPerson / baseY, 1), o.IsBaseline ? "–" : Change(o.ChangeVsBaselinePct, 1),
        });
        return Md.Table(T("table.results_caption"), T("source.model_results"),
            new[]
            {
                T("table.option"), T("table.schooling_years"), T("table.workers_per_person"), T("table.human_capital"),
                T("table.output_index"), T("table.change_vs_baseline"),
            },
            rows, new HashSet<int> { 1, 2, 3, 4, 5 });
    }

    private string Reproducibility(BriefInputs b) =>
        T("annex.reproducibility", b.InputHash, Md.Escape(b.TemplateName), b.TemplateHash, b.ToolVersion);
}
