using System.Globalization;
using System.Text.RegularExpressions;
using Briefwright.Model.Inputs;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>Turns the merged YAML tree of a scenario into validated model inputs, reporting every problem.</summary>
public sealed partial class ScenarioBinder(
    BindContext ctx,
    Func<string, SourceSpan, string, TabulatedSurvival?> loadLifeTable)
{
    public static readonly string[] TopLevelKeys = ScenarioFields.Keys("");

    private static ScenarioField F(string path, string? variant = null) => ScenarioFields.Get(path, variant);

    [GeneratedRegex(@"^[a-z0-9][a-z0-9_-]{0,63}\z")]
    private static partial Regex IdPattern();

    [GeneratedRegex(@"^[a-z]{2,3}(-[A-Za-z0-9]{2,8})*\z")]
    private static partial Regex LanguageTagPattern();

    public ScenarioDocument? Bind(YNode root, IReadOnlyList<string> files)
    {
        if (root is not YMapping top)
        {
            ctx.Report(root.At, "", "a scenario must be a mapping with the sections brief, demography, " +
                "human_capital, production and options", root.Kind);
            return null;
        }
        ctx.CheckKeys(top, "", TopLevelKeys);
        var brief = BindBrief(top);
        var demography = BindDemography(top);
        var humanCapital = BindHumanCapital(top);
        var production = BindProduction(top);
        var options = BindOptions(top, out string? baselineId, out var optionNames);
        if (brief is null || demography is null || humanCapital is null || production is null || options is null
            || baselineId is null || ctx.Problems.Count > 0)
            return null;
        var inputs = new ModelInputs(demography, humanCapital, production, options, baselineId);
        CrossFieldRules.Check(top, inputs, ctx);
        var analysisBinder = new AnalysisBinder(ctx);
        var analysis = analysisBinder.Bind(top, inputs, brief);
        if (ctx.Problems.Count > 0 || analysis is null) return null;
        return new ScenarioDocument(brief, inputs, ctx.Assumptions, files)
        {
            Analysis = analysis, OptionNames = optionNames!, RuleNames = analysisBinder.RuleNames, Texts = ctx.Texts,
        };
    }

    private BriefInfo? BindBrief(YMapping top)
    {
        var m = ctx.Mapping(top, F("brief"), "");
        if (m is null) return null;
        const string p = "brief";
        ctx.CheckFields(m, p, F(p));
        string? id = ctx.Text(m, F("brief.id"), p);
        if (id is not null && !IdPattern().IsMatch(id))
        {
            ctx.Report(m["id"]!.At, "brief.id",
                "must be 1–64 lower-case letters, digits, '-' or '_', starting with a letter or digit " +
                "(it names the output files)", BindContext.Quote(id));
            id = null;
        }
        string? title = ctx.Text(m, F("brief.title"), p);
        string? shortTitle = ctx.Text(m, F("brief.short_title"), p);
        string? organisation = ctx.Text(m, F("brief.organisation"), p);
        string? author = ctx.Text(m, F("brief.author"), p);
        string? dateText = ctx.Text(m, F("brief.date"), p);
        DateOnly? date = null;
        if (dateText is not null)
        {
            if (DateOnly.TryParseExact(dateText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None,
                out var d)) date = d;
            else ctx.Report(m["date"]!.At, "brief.date", "must be a date written YYYY-MM-DD", $"'{dateText}'");
        }
        string status = ctx.Choice(m, F("brief.status"), p) ?? F("brief.status").DefaultText!;
        double? edition = ctx.Number(m, F("brief.edition"), p);
        if (edition is { } e && e != Math.Floor(e))
        {
            ctx.Report(m["edition"]!.At, "brief.edition", "must be a whole number", BindContext.Show(m["edition"]!));
            edition = null;
        }
        string? question = ctx.Text(m, F("brief.question"), p);
        string? language = ctx.Text(m, F("brief.language"), p);
        if (language is not null && !LanguageTagPattern().IsMatch(language))
        {
            ctx.Report(m["language"]!.At, "brief.language",
                "must be a language tag such as en-GB, fr-FR, es-ES or de-DE", BindContext.Quote(language));
            language = null;
        }
        else if (language is not null && LanguageTag.RightToLeft.Contains(language.Split('-')[0]))
        {
            ctx.Report(m["language"]!.At, "brief.language",
                "is a right-to-left language, which briefs cannot be written in yet (the layout writes left to right " +
                "only); use en, fr, es or de", BindContext.Quote(language));
            language = null;
        }
        if (id is null || title is null || organisation is null || date is null || edition is null) return null;
        return new BriefInfo(id, title, shortTitle ?? title, organisation, author, date.Value, status,
            (int)edition.Value, question, language ?? LanguageTag.Default);
    }

    private Demography? BindDemography(YMapping top)
    {
        var m = ctx.Mapping(top, F("demography"), "");
        if (m is null) return null;
        const string p = "demography";
        ctx.CheckFields(m, p, F(p));
        double? n = ctx.Number(m, F("demography.population_growth"), p);
        double? entry = ctx.Number(m, F("demography.school_entry_age"), p);
        double? retire = ctx.Number(m, F("demography.retirement_age"), p);
        double? part = ctx.Number(m, F("demography.participation"), p);
        var survival = BindSurvival(m, p);
        if (n is null || entry is null || retire is null || part is null || survival is null) return null;
        return new Demography(n.Value, entry.Value, retire.Value, survival, part.Value);
    }

    private Survival? BindSurvival(YMapping demography, string parent)
    {
        const string p = "demography.survival";
        var m = ctx.Mapping(demography, F(p), parent);
        if (m is null) return null;
        string? form = ctx.Choice(m, F(p + ".form"), p);
        if (form is not null) ctx.CheckFields(m, p, F(p), form);
        switch (form)
        {
            case "rectangular":
            {
                double? max = ctx.Number(m, F(p + ".max_age", form), p);
                return max is null ? null : new RectangularSurvival(max.Value);
            }
            case "gompertz_makeham":
            {
                double? a = ctx.Number(m, F(p + ".a"), p);
                double? b = ctx.Number(m, F(p + ".b"), p);
                double? c = ctx.Number(m, F(p + ".c"), p);
                double? max = ctx.Number(m, F(p + ".max_age", form), p);
                return a is null || b is null || c is null || max is null
                    ? null
                    : new GompertzMakehamSurvival(a.Value, b.Value, c.Value, max.Value);
            }
            case "life_table":
            {
                var fileField = F(p + ".file");
                string? file = ctx.Text(m, fileField, p);
                if (file is null) return null;
                var table = loadLifeTable(file, m["file"]!.At, fileField.Path);
                if (table is not null)
                    ctx.Add(new Assumption(fileField.Path, fileField.Label, null,
                        $"{file} (ages 0–{table.MaxAge:0})", fileField.Unit,
                        ctx.Text(m, F(p + ".source"), p), ctx.Text(m, F(p + ".note"), p)));
                return table;
            }
            default:
                return null;
        }
    }

    private HumanCapital? BindHumanCapital(YMapping top)
    {
        const string p = "human_capital";
        var m = ctx.Mapping(top, F(p), "");
        if (m is null)
        {
            ctx.Add(HallJonesAssumption(p + ".returns"));
            return new HumanCapital(BracketReturns.HallJones, null);
        }
        ctx.CheckFields(m, p, F(p));
        var returns = BindReturns(m, p);
        ExperienceProfile? experience = null;
        bool experienceOk = true;
        const string ep = p + ".experience";
        if (ctx.Mapping(m, F(ep), p) is { } e)
        {
            ctx.CheckFields(e, ep, F(ep));
            double? b1 = ctx.Number(e, F(ep + ".linear"), ep);
            double? b2 = ctx.Number(e, F(ep + ".quadratic"), ep);
            experienceOk = b1 is not null && b2 is not null;
            if (experienceOk) experience = new ExperienceProfile(b1!.Value, b2!.Value);
        }
        return returns is null || !experienceOk ? null : new HumanCapital(returns, experience);
    }

    private static Assumption HallJonesAssumption(string path) =>
        new(path, ScenarioFields.Get("human_capital.returns").Label, null,
            "13.4% a year for years 0–4, 10.1% for 4–8, 6.8% beyond", ValueUnit.Text,
            "Hall & Jones (1999), after Psacharopoulos (1994) (default)", null);

    private ReturnSchedule? BindReturns(YMapping hc, string parent)
    {
        const string p = "human_capital.returns";
        var m = ctx.Mapping(hc, F(p), parent);
        if (m is null)
        {
            ctx.Add(HallJonesAssumption(p));
            return BracketReturns.HallJones;
        }
        string? form = ctx.Choice(m, F(p + ".form"), p);
        if (form is not null) ctx.CheckFields(m, p, F(p), form);
        switch (form)
        {
            case "constant":
            {
                double? r = ctx.Number(m, F(p + ".rate"), p);
                return r is null ? null : new ConstantReturn(r.Value);
            }
            case "power":
            {
                double? theta = ctx.Number(m, F(p + ".theta"), p);
                double? psi = ctx.Number(m, F(p + ".psi"), p);
                return theta is null || psi is null ? null : new PowerReturn(theta.Value, psi.Value);
            }
            case "brackets":
            {
                var list = ctx.Sequence(m, F(p + ".brackets"), p);
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
        const string item = "human_capital.returns.brackets[]";
        var brackets = new List<ReturnBracket>();
        bool ok = list.Items.Count > 0;
        if (!ok) ctx.Report(list.At, p, "must list at least one bracket", "an empty list");
        for (int i = 0; i < list.Items.Count; i++)
        {
            string ip = $"{p}[{i}]";
            if (list.Items[i] is not YMapping bracket)
            {
                ctx.Report(list.Items[i].At, ip,
                    "each bracket must be a mapping with from and rate", list.Items[i].Kind);
                ok = false;
                continue;
            }
            ctx.CheckFields(bracket, ip, F(item));
            double? from = ctx.Number(bracket, F(item + ".from"), ip);
            double? rate = ctx.Number(bracket, F(item + ".rate"), ip);
            if (from is null || rate is null) { ok = false; continue; }
            if (i == 0 && from != 0)
            {
                ctx.Report(bracket["from"]!.At, ip + ".from",
                    "the first bracket must start at year 0", BindContext.Show(bracket["from"]!));
                ok = false;
            }
            if (brackets.Count > 0 && from <= brackets[^1].FromYear)
            {
                ctx.Report(bracket["from"]!.At, ip + ".from",
                    "brackets must start at increasing years (previous bracket starts at " +
                    $"{brackets[^1].FromYear.ToString(CultureInfo.InvariantCulture)})",
                    BindContext.Show(bracket["from"]!));
                ok = false;
            }
            brackets.Add(new ReturnBracket(from.Value, rate.Value));
        }
        if (!ok) return null;
        string text = string.Join("; ", brackets.Select((b, i) =>
            $"{Numbers.Percent(b.Rate, minDecimals: 1)} from year " +
            $"{b.FromYear.ToString(CultureInfo.InvariantCulture)}"));
        ctx.Add(new Assumption(p, F(parent).Label, null, text, ValueUnit.Text,
            ctx.Text(returns, F(parent + ".source"), parent), ctx.Text(returns, F(parent + ".note"), parent)));
        return new BracketReturns(brackets);
    }

    private Production? BindProduction(YMapping top)
    {
        const string p = "production";
        var m = ctx.Mapping(top, F(p), "");
        if (m is null) return null;
        ctx.CheckFields(m, p, F(p));
        double? s = ctx.Number(m, F(p + ".saving_rate"), p);
        double? alpha = ctx.Number(m, F(p + ".capital_share"), p);
        double? delta = ctx.Number(m, F(p + ".depreciation"), p);
        double? g = ctx.Number(m, F(p + ".technology_growth"), p);
        if (s is null || alpha is null || delta is null || g is null) return null;
        return new Production(s.Value, alpha.Value, delta.Value, g.Value);
    }

    private IReadOnlyList<PolicyOption>? BindOptions(YMapping top, out string? baselineId,
        out Dictionary<string, string>? names)
    {
        baselineId = null;
        names = null;
        var list = ctx.Sequence(top, F("options"), "");
        if (list is null) return null;
        if (list.Items.Count < F("options").MinItems)
        {
            ctx.Report(list.At, "options",
                "must list a baseline and at least one alternative", $"{list.Items.Count} option(s)");
            return null;
        }
        var options = new List<PolicyOption>();
        var optionNames = new Dictionary<string, string>(StringComparer.Ordinal);
        var ids = new Dictionary<string, int>(StringComparer.Ordinal);
        var baselines = new List<string>();
        bool ok = true;
        for (int i = 0; i < list.Items.Count; i++)
        {
            if (BindOption(list.Items[i], i, ids) is not var (option, inSentence, isBaseline))
            {
                ok = false;
                continue;
            }
            if (isBaseline) baselines.Add(option.Id);
            options.Add(option);
            optionNames[option.Id] = inSentence ?? InSentence.FromLabel(option.Label);
        }
        if (baselines.Count > 1)
        {
            ctx.Report(list.At, "options",
                "exactly one option may be marked baseline: true", string.Join(", ", baselines));
            ok = false;
        }
        if (!ok) return null;
        baselineId = baselines.Count == 1 ? baselines[0] : options[0].Id;
        names = optionNames;
        return options;
    }

    /// <summary>One option (its id checked against <paramref name="ids"/>, the ids seen before it); null when it has a
    /// problem, which is reported.</summary>
    private (PolicyOption Option, string? InSentence, bool IsBaseline)? BindOption(YNode node, int i,
        Dictionary<string, int> ids)
    {
        string ip = $"options[{i}]";
        if (node is not YMapping item)
        {
            ctx.Report(node.At, ip, "each option must be a mapping with id, label and schooling_years", node.Kind);
            return null;
        }
        const string o = "options[]";
        ctx.CheckFields(item, ip, F(o));
        string? id = ctx.Text(item, F(o + ".id"), ip);
        if (id is not null && !IdPattern().IsMatch(id))
        {
            ctx.Report(item["id"]!.At, ip + ".id",
                "must be 1–64 lower-case letters, digits, '-' or '_'", BindContext.Quote(id));
            id = null;
        }
        if (id is not null && ids.TryGetValue(id, out int first))
        {
            ctx.Report(item["id"]!.At, ip + ".id",
                $"option ids must be unique (also used by options[{first}])", $"'{id}'");
            id = null;
        }
        if (id is not null) ids[id] = i;
        string? label = ctx.Text(item, F(o + ".label"), ip);
        string? inSentence = ctx.Text(item, F(o + ".in_sentence"), ip);
        double? years = ctx.Number(item, F(o + ".schooling_years"), ip);
        double? retire = item["retirement_age"] is null ? null : ctx.Number(item, F(o + ".retirement_age"), ip);
        double? part = item["participation"] is null ? null : ctx.Number(item, F(o + ".participation"), ip);
        bool isBaseline = ctx.Flag(item, F(o + ".baseline"), ip) ?? false;
        if (id is null || label is null || years is null || (item["retirement_age"] is not null && retire is null)
            || (item["participation"] is not null && part is null))
            return null;
        ctx.Add(new Assumption(ip + ".schooling_years", $"Schooling: {label}", years.Value, null, ValueUnit.Years,
            ctx.Text(item, F(o + ".source"), ip), ctx.Text(item, F(o + ".note"), ip)));
        return (new PolicyOption(id, label, years.Value, retire, part), inSentence, isBaseline);
    }
}
