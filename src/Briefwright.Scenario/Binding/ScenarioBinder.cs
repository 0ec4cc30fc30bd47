using System.Globalization;
using System.Text.RegularExpressions;
using Briefwright.Model.Inputs;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>Turns the merged YAML tree of a scenario into validated model inputs, reporting every problem.</summary>
public sealed partial class ScenarioBinder(BindContext ctx, Func<string, SourceSpan, string, TabulatedSurvival?> loadLifeTable)
{
    public static readonly string[] TopLevelKeys = { "extends", "brief", "demography", "human_capital", "production", "options", "reform", "appraisal", "sensitivity", "uncertainty" };

    [GeneratedRegex(@"^[a-z0-9][a-z0-9_-]{0,63}\z")]
    private static partial Regex IdPattern();

    [GeneratedRegex(@"^[a-z]{2,3}(-[A-Za-z0-9]{2,8})*\z")]
    private static partial Regex LanguageTagPattern();

    public ScenarioDocument? Bind(YNode root, IReadOnlyList<string> files)
    {
        if (root is not YMapping top)
        {
            ctx.Report(root.At, "", "a scenario must be a mapping with the sections brief, demography, human_capital, production and options", root.Kind);
            return null;
        }
        ctx.CheckKeys(top, "", TopLevelKeys);
        var brief = BindBrief(top);
        var demography = BindDemography(top);
        var humanCapital = BindHumanCapital(top);
        var production = BindProduction(top);
        var options = BindOptions(top, out string? baselineId, out var optionNames);
        if (brief is null || demography is null || humanCapital is null || production is null || options is null || baselineId is null || ctx.Problems.Count > 0)
            return null;
        var inputs = new ModelInputs(demography, humanCapital, production, options, baselineId);
        CrossFieldRules.Check(top, inputs, ctx);
        var analysisBinder = new AnalysisBinder(ctx);
        var analysis = analysisBinder.Bind(top, inputs, brief);
        return ctx.Problems.Count > 0 || analysis is null ? null : new ScenarioDocument(brief, inputs, ctx.Assumptions, files)
        {
            Analysis = analysis, OptionNames = optionNames!, RuleNames = analysisBinder.RuleNames, Texts = ctx.Texts,
        };
    }

    private BriefInfo? BindBrief(YMapping top)
    {
        var m = ctx.Mapping(top, "brief", "", required: true);
        if (m is null) return null;
        const string p = "brief";
        ctx.CheckKeys(m, p, "id", "title", "short_title", "organisation", "author", "date", "status", "edition", "question", "language");
        string? id = ctx.Text(m, "id", p, required: true);
        if (id is not null && !IdPattern().IsMatch(id))
        {
            ctx.Report(m["id"]!.At, "brief.id", "must be 1–64 lower-case letters, digits, '-' or '_', starting with a letter or digit (it names the output files)", BindContext.Quote(id));
            id = null;
        }
        string? title = ctx.Text(m, "title", p, required: true, maxLength: 200);
        string? shortTitle = ctx.Text(m, "short_title", p, required: false, maxLength: 80);
        string? organisation = ctx.Text(m, "organisation", p, required: true, maxLength: 200);
        string? author = ctx.Text(m, "author", p, required: false, maxLength: 200);
        string? dateText = ctx.Text(m, "date", p, required: true);
        DateOnly? date = null;
        if (dateText is not null)
        {
            if (DateOnly.TryParseExact(dateText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d)) date = d;
            else ctx.Report(m["date"]!.At, "brief.date", "must be a date written YYYY-MM-DD", $"'{dateText}'");
        }
        string status = ctx.Choice(m, "status", p, required: false, "draft", "consultation", "final") ?? "draft";
        double? edition = ctx.Number(m, "edition", p, ValueUnit.Number, Bounds.Closed(1, 9999), fallback: 1);
        if (edition is { } e && e != Math.Floor(e))
        {
            ctx.Report(m["edition"]!.At, "brief.edition", "must be a whole number", BindContext.Show(m["edition"]!));
            edition = null;
        }
        string? question = ctx.Text(m, "question", p, required: false, maxLength: 2000);
        string? language = ctx.Text(m, "language", p, required: false, maxLength: 35);
        if (language is not null && !LanguageTagPattern().IsMatch(language))
        {
            ctx.Report(m["language"]!.At, "brief.language", "must be a language tag such as en-GB, fr-FR, es-ES or de-DE", BindContext.Quote(language));
            language = null;
        }
        else if (language is not null && LanguageTag.RightToLeft.Contains(language.Split('-')[0]))
        {
            ctx.Report(m["language"]!.At, "brief.language", "is a right-to-left language, which briefs cannot be written in yet (the layout writes left to right only); use en, fr, es or de", BindContext.Quote(language));
            language = null;
        }
        if (id is null || title is null || organisation is null || date is null || edition is null) return null;
        return new BriefInfo(id, title, shortTitle ?? title, organisation, author, date.Value, status, (int)edition.Value, question, language ?? LanguageTag.Default);
    }

    private Demography? BindDemography(YMapping top)
    {
        var m = ctx.Mapping(top, "demography", "", required: true);
        if (m is null) return null;
        const string p = "demography";
        ctx.CheckKeys(m, p, "population_growth", "school_entry_age", "retirement_age", "participation", "survival");
        double? n = ctx.Number(m, "population_growth", p, ValueUnit.Rate, ParameterBounds.PopulationGrowth, "Population growth rate");
        double? entry = ctx.Number(m, "school_entry_age", p, ValueUnit.Age, ParameterBounds.SchoolEntryAge, "School-entry age");
        double? retire = ctx.Number(m, "retirement_age", p, ValueUnit.Age, ParameterBounds.RetirementAge, "Retirement age");
        double? part = ctx.Number(m, "participation", p, ValueUnit.Rate, ParameterBounds.Participation, "Labour-force participation", fallback: 1.0);
        var survival = BindSurvival(m, p);
        if (n is null || entry is null || retire is null || part is null || survival is null) return null;
        return new Demography(n.Value, entry.Value, retire.Value, survival, part.Value);
    }

    private Survival? BindSurvival(YMapping demography, string parent)
    {
        var m = ctx.Mapping(demography, "survival", parent, required: true);
        if (m is null) return null;
        string p = BindContext.Join(parent, "survival");
        string? form = ctx.Choice(m, "form", p, required: true, "rectangular", "gompertz_makeham", "life_table");
        switch (form)
        {
            case "rectangular":
            {
                ctx.CheckKeys(m, p, "form", "max_age");
                double? max = ctx.Number(m, "max_age", p, ValueUnit.Age, Bounds.OpenClosed(0, 150), "Age at death (everyone)");
                return max is null ? null : new RectangularSurvival(max.Value);
            }
            case "gompertz_makeham":
            {
                ctx.CheckKeys(m, p, "form", "a", "b", "c", "max_age");
                double? a = ctx.Number(m, "a", p, ValueUnit.Number, Bounds.ClosedOpen(0, 1), "Makeham term A");
                double? b = ctx.Number(m, "b", p, ValueUnit.Number, Bounds.Open(0, 1), "Gompertz level B");
                double? c = ctx.Number(m, "c", p, ValueUnit.Number, Bounds.Open(1, 2), "Gompertz growth c");
                double? max = ctx.Number(m, "max_age", p, ValueUnit.Age, Bounds.OpenClosed(0, 150), "Oldest age considered", fallback: 120);
                return a is null || b is null || c is null || max is null ? null : new GompertzMakehamSurvival(a.Value, b.Value, c.Value, max.Value);
            }
            case "life_table":
            {
                ctx.CheckKeys(m, p, "form", "file", "source", "note");
                string? file = ctx.Text(m, "file", p, required: true);
                if (file is null) return null;
                var table = loadLifeTable(file, m["file"]!.At, BindContext.Join(p, "file"));
                if (table is not null)
                    ctx.Add(new Assumption(BindContext.Join(p, "file"), "Life table", null, $"{file} (ages 0–{table.MaxAge:0})", ValueUnit.Text,
                        ctx.Text(m, "source", p, required: false), ctx.Text(m, "note", p, required: false, maxLength: 1000)));
                return table;
            }
            default:
                return null;
        }
    }

    private HumanCapital? BindHumanCapital(YMapping top)
    {
        var m = ctx.Mapping(top, "human_capital", "", required: false);
        const string p = "human_capital";
        if (m is null)
        {
            ctx.Add(HallJonesAssumption(p + ".returns"));
            return new HumanCapital(BracketReturns.HallJones, null);
        }
        ctx.CheckKeys(m, p, "returns", "experience");
        var returns = BindReturns(m, p);
        ExperienceProfile? experience = null;
        bool experienceOk = true;
        if (ctx.Mapping(m, "experience", p, required: false) is { } e)
        {
            string ep = p + ".experience";
            ctx.CheckKeys(e, ep, "linear", "quadratic");
            double? b1 = ctx.Number(e, "linear", ep, ValueUnit.Number, Bounds.Closed(0, 0.5), "Experience premium, linear term β₁");
            double? b2 = ctx.Number(e, "quadratic", ep, ValueUnit.Number, Bounds.OpenClosed(0, 0.05), "Experience premium, quadratic term β₂");
            experienceOk = b1 is not null && b2 is not null;
            if (experienceOk) experience = new ExperienceProfile(b1!.Value, b2!.Value);
        }
        return returns is null || !experienceOk ? null : new HumanCapital(returns, experience);
    }

    private static Assumption HallJonesAssumption(string path) =>
        new(path, "Returns to schooling", null, "13.4% a year for years 0–4, 10.1% for 4–8, 6.8% beyond", ValueUnit.Text,
            "Hall & Jones (1999), after Psacharopoulos (1994) (default)", null);

    private ReturnSchedule? BindReturns(YMapping hc, string parent)
    {
        var m = ctx.Mapping(hc, "returns", parent, required: false);
        string p = BindContext.Join(parent, "returns");
        if (m is null)
        {
            ctx.Add(HallJonesAssumption(p));
            return BracketReturns.HallJones;
        }
        string? form = ctx.Choice(m, "form", p, required: true, "constant", "brackets", "power");
        switch (form)
        {
            case "constant":
            {
                ctx.CheckKeys(m, p, "form", "rate");
                double? r = ctx.Number(m, "rate", p, ValueUnit.Rate, Bounds.Open(0, 1), "Return to a year of schooling");
                return r is null ? null : new ConstantReturn(r.Value);
            }
            case "power":
            {
                ctx.CheckKeys(m, p, "form", "theta", "psi");
                double? theta = ctx.Number(m, "theta", p, ValueUnit.Number, Bounds.Open(0, 2), "Power-form scale θ");
                double? psi = ctx.Number(m, "psi", p, ValueUnit.Number, Bounds.ClosedOpen(0, 1), "Power-form curvature ψ");
                return theta is null || psi is null ? null : new PowerReturn(theta.Value, psi.Value);
            }
            case "brackets":
            {
                ctx.CheckKeys(m, p, "form", "brackets", "source", "note");
                var list = ctx.Sequence(m, "brackets", p, required: false);
                if (list is null)
                {
                    ctx.Add(HallJonesAssumption(p));
                    return BracketReturns.HallJones;
                }
                return BindBrackets(m, list, p);
            }
            default:
                return null;
        }
    }

    private ReturnSchedule? BindBrackets(YMapping returns, YSequence list, string parent)
    {
        string p = BindContext.Join(parent, "brackets");
        var brackets = new List<ReturnBracket>();
        bool ok = list.Items.Count > 0;
        if (!ok) ctx.Report(list.At, p, "must list at least one bracket", "an empty list");
        for (int i = 0; i < list.Items.Count; i++)
        {
            string ip = $"{p}[{i}]";
            if (list.Items[i] is not YMapping item)
            {
                ctx.Report(list.Items[i].At, ip, "each bracket must be a mapping with from and rate", list.Items[i].Kind);
                ok = false;
                continue;
            }
            ctx.CheckKeys(item, ip, "from", "rate");
            double? from = ctx.Number(item, "from", ip, ValueUnit.Years, Bounds.Closed(0, 40));
            double? rate = ctx.Number(item, "rate", ip, ValueUnit.Rate, Bounds.ClosedOpen(0, 1));
            if (from is null || rate is null) { ok = false; continue; }
            if (i == 0 && from != 0)
            {
                ctx.Report(item["from"]!.At, ip + ".from", "the first bracket must start at year 0", BindContext.Show(item["from"]!));
                ok = false;
            }
            if (brackets.Count > 0 && from <= brackets[^1].FromYear)
            {
                ctx.Report(item["from"]!.At, ip + ".from", $"brackets must start at increasing years (previous bracket starts at {brackets[^1].FromYear.ToString(CultureInfo.InvariantCulture)})", BindContext.Show(item["from"]!));
                ok = false;
            }
            brackets.Add(new ReturnBracket(from.Value, rate.Value));
        }
        if (!ok) return null;
        string text = string.Join("; ", brackets.Select((b, i) =>
            $"{(b.Rate * 100).ToString("0.0##", CultureInfo.InvariantCulture)}% from year {b.FromYear.ToString(CultureInfo.InvariantCulture)}"));
        ctx.Add(new Assumption(p, "Returns to schooling", null, text, ValueUnit.Text, ctx.Text(returns, "source", parent, false), ctx.Text(returns, "note", parent, false, 1000)));
        return new BracketReturns(brackets);
    }

    private Production? BindProduction(YMapping top)
    {
        var m = ctx.Mapping(top, "production", "", required: true);
        if (m is null) return null;
        const string p = "production";
        ctx.CheckKeys(m, p, "saving_rate", "capital_share", "depreciation", "technology_growth");
        double? s = ctx.Number(m, "saving_rate", p, ValueUnit.Rate, ParameterBounds.SavingRate, "Saving (investment) rate");
        double? alpha = ctx.Number(m, "capital_share", p, ValueUnit.Rate, ParameterBounds.CapitalShare, "Capital share of income α");
        double? delta = ctx.Number(m, "depreciation", p, ValueUnit.Rate, ParameterBounds.Depreciation, "Depreciation rate δ");
        double? g = ctx.Number(m, "technology_growth", p, ValueUnit.Rate, ParameterBounds.TechnologyGrowth, "Technology growth g");
        if (s is null || alpha is null || delta is null || g is null) return null;
        return new Production(s.Value, alpha.Value, delta.Value, g.Value);
    }

    private IReadOnlyList<PolicyOption>? BindOptions(YMapping top, out string? baselineId, out Dictionary<string, string>? names)
    {
        baselineId = null;
        names = null;
        var list = ctx.Sequence(top, "options", "", required: true);
        if (list is null) return null;
        if (list.Items.Count < 2)
        {
            ctx.Report(list.At, "options", "must list a baseline and at least one alternative", $"{list.Items.Count} option(s)");
            return null;
        }
        var options = new List<PolicyOption>();
        var optionNames = new Dictionary<string, string>(StringComparer.Ordinal);
        var ids = new Dictionary<string, int>(StringComparer.Ordinal);
        var baselines = new List<string>();
        bool ok = true;
        for (int i = 0; i < list.Items.Count; i++)
        {
            string ip = $"options[{i}]";
            if (list.Items[i] is not YMapping item)
            {
                ctx.Report(list.Items[i].At, ip, "each option must be a mapping with id, label and schooling_years", list.Items[i].Kind);
                ok = false;
                continue;
            }
            ctx.CheckKeys(item, ip, "id", "label", "in_sentence", "schooling_years", "retirement_age", "participation", "baseline", "source", "note");
            string? id = ctx.Text(item, "id", ip, required: true);
            if (id is not null && !IdPattern().IsMatch(id))
            {
                ctx.Report(item["id"]!.At, ip + ".id", "must be 1–64 lower-case letters, digits, '-' or '_'", BindContext.Quote(id));
                id = null;
            }
            if (id is not null && ids.TryGetValue(id, out int first))
            {
                ctx.Report(item["id"]!.At, ip + ".id", $"option ids must be unique (also used by options[{first}])", $"'{id}'");
                id = null;
            }
            if (id is not null) ids[id] = i;
            string? label = ctx.Text(item, "label", ip, required: true, maxLength: 120);
            string? inSentence = ctx.Text(item, "in_sentence", ip, required: false, maxLength: 120);
            double? years = ctx.Number(item, "schooling_years", ip, ValueUnit.Years, Bounds.Closed(0, 40));
            double? retire = item["retirement_age"] is null ? null : ctx.Number(item, "retirement_age", ip, ValueUnit.Age, Bounds.OpenClosed(0, 150));
            double? part = item["participation"] is null ? null : ctx.Number(item, "participation", ip, ValueUnit.Rate, Bounds.OpenClosed(0, 1));
            bool isBaseline = ctx.Flag(item, "baseline", ip) ?? false;
            if (id is null || label is null || years is null || (item["retirement_age"] is not null && retire is null) || (item["participation"] is not null && part is null))
            {
                ok = false;
                continue;
            }
            if (isBaseline) baselines.Add(id);
            options.Add(new PolicyOption(id, label, years.Value, retire, part));
            optionNames[id] = inSentence ?? InSentence.FromLabel(label);
            ctx.Add(new Assumption(ip + ".schooling_years", $"Schooling: {label}", years.Value, null, ValueUnit.Years,
                ctx.Text(item, "source", ip, false), ctx.Text(item, "note", ip, false, 1000)));
        }
        if (baselines.Count > 1)
        {
            ctx.Report(list.At, "options", "exactly one option may be marked baseline: true", string.Join(", ", baselines));
            ok = false;
        }
        if (!ok) return null;
        baselineId = baselines.Count == 1 ? baselines[0] : options[0].Id;
        names = optionNames;
        return options;
    }
}
