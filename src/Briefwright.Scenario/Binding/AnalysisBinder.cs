using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>Reads the optional sections reform, appraisal, sensitivity and uncertainty into analysis settings. This
/// part reads the reform and the appraisal; <c>AnalysisBinder.Uncertainty.cs</c> the parameters' ranges and
/// distributions (sensitivity, Monte Carlo, Sobol) with the pilot draws that check them.</summary>
public sealed partial class AnalysisBinder(BindContext ctx)
{
    public const int MaxDraws = 200_000;
    public const int MaxSobolSamples = 8192;
    public const int MaxHorizon = 400;

    /// <summary>
    /// Sobol base samples when a scenario does not say: the smallest multiple of 256 at which every 95% bootstrap
    /// interval of the demo brief's headline indices is at most ±0.05 wide (measured: ±0.148 at 256, ±0.051 at 2,048,
    /// ±0.046 at 2,560; see docs/model.md).
    /// </summary>
    public const int DefaultSobolSamples = 2560;

    private static readonly Bounds YearBounds = ScenarioFields.Get("reform.year").Bounds;

    private static ScenarioField F(string path, string? variant = null) => ScenarioFields.Get(path, variant);

    /// <summary>
    /// The most simulated years one brief's uncertainty analysis may ask for: (draws + Sobol samples × (parameters +
    /// 2)) × horizon years. Each unit is one year of one simulated reform path, so this bounds the run's time and
    /// memory whatever the combination of limits (at 150 years: 66,000 draws, or 2,000 draws and the default 2,560
    /// Sobol samples of 9 parameters with room to spare).
    /// </summary>
    public const long MaxSimulatedYears = 10_000_000;

    private void CheckWork(YMapping top, ReformSettings reform, MonteCarloSpec mc)
    {
        long paths = mc.Draws + (long)mc.SobolSamples * (mc.Parameters.Count + 2);
        long years = paths * reform.HorizonYears;
        if (years <= MaxSimulatedYears) return;
        var u = (YMapping)top["uncertainty"]!;
        var at = u["draws"] ?? u["sobol_samples"] ?? (YNode)u;
        ctx.Report(at.At, "uncertainty",
            $"asks for {Numbers.Count(years)} simulated years ((draws + sobol_samples × (parameters + 2)) × " +
            $"reform.horizon_years = ({mc.Draws} + {mc.SobolSamples} × {mc.Parameters.Count + 2}) × " +
            $"{reform.HorizonYears}); the limit for one brief is {Numbers.Count(MaxSimulatedYears)}; lower draws, " +
            "sobol_samples or reform.horizon_years",
            Numbers.Count(years));
    }

    /// <summary>
    /// Monte Carlo draws tried when the scenario is checked, to catch distributions whose draws nearly all break a
    /// model rule.
    /// </summary>
    public const int PilotDraws = 500;

    /// <summary>In-sentence names of the appraisal rules, by schedule id (filled by <see cref="Bind"/>).</summary>
    public Dictionary<string, string> RuleNames { get; } = new(StringComparer.Ordinal);

    private static string Names => string.Join(", ", Parameters.All.Select(p => p.Name));

    public AnalysisSettings? Bind(YMapping top, ModelInputs inputs, BriefInfo brief)
    {
        int before = ctx.Problems.Count;
        var reform = BindReform(top, inputs, brief, out string headline);
        var discounts = BindDiscounts(top);
        int? valuation = BindValuationYear(top, brief, reform);
        var (ranges, grids) = BindSensitivity(top, inputs);
        var monteCarlo = BindUncertainty(top, inputs);
        if (reform is not null && monteCarlo is not null) CheckWork(top, reform, monteCarlo);
        if (ctx.Problems.Count > before || reform is null || discounts is null || valuation is null) return null;
        reform = reform with { ValuationYear = valuation };
        foreach (var d in discounts) RuleNames.TryAdd(d.Id, InSentence.ForRule(d));
        return new AnalysisSettings(reform, headline, discounts, ranges, grids, monteCarlo);
    }

    private ReformSettings? BindReform(YMapping top, ModelInputs inputs, BriefInfo brief, out string headline)
    {
        // The headline option: the one the scenario names, else the first that differs from the baseline.
        var b = inputs.Baseline;
        var alternatives = inputs.Options.Where(o => o.Id != inputs.BaselineId).ToList();
        headline = (alternatives.FirstOrDefault(o =>
            inputs.DemographyFor(o) != inputs.DemographyFor(b) || o.SchoolingYears != b.SchoolingYears)
            ?? alternatives[0]).Id;
        var m = ctx.Mapping(top, F("reform"), "");
        int defaultYear = brief.Date.Year + 1;
        if ((m is null || m["year"] is null) && !YearBounds.Contains(defaultYear))
        {
            var date = ((YMapping)top["brief"]!)["date"]!;
            ctx.Report(date.At, "brief.date",
                "the reform starts the year after the brief's date unless reform.year is given, and must start from " +
                $"{YearBounds.Min} to {YearBounds.Max}; give reform.year", BindContext.Show(date));
            return null;
        }
        if (m is null) return new ReformSettings(defaultYear);
        const string p = "reform";
        ctx.CheckFields(m, p, F(p));
        double? year = ctx.Number(m, F("reform.year"), p, fallback: defaultYear);
        double? phase = ctx.Number(m, F("reform.phase_in_cohorts"), p);
        double? horizon = ctx.Number(m, F("reform.horizon_years"), p);
        foreach (var (key, v) in new[] { ("year", year), ("phase_in_cohorts", phase), ("horizon_years", horizon) })
            if (v is { } x && x != Math.Floor(x))
                ctx.Report(m[key]!.At, $"{p}.{key}", "must be a whole number", BindContext.Show(m[key]!));
        if (ctx.Text(m, F("reform.headline_option"), p) is { } h)
        {
            if (inputs.Options.All(o => o.Id != h) || h == inputs.BaselineId)
                ctx.Report(m["headline_option"]!.At, "reform.headline_option",
                    "must name an option other than the baseline " +
                    $"({string.Join(", ", alternatives.Select(o => o.Id))})",
                    $"'{h}'");
            else headline = h;
        }
        return year is null || phase is null || horizon is null
            ? null
            : new ReformSettings((int)year, (int)phase, (int)horizon);
    }

    /// <summary>
    /// <c>appraisal.valuation_year</c>: the calendar year present values are valued at (default: the brief's year). It
    /// may not follow the reform year: present values discount, they do not compound past flows forward.
    /// </summary>
    private int? BindValuationYear(YMapping top, BriefInfo brief, ReformSettings? reform)
    {
        var m = top["appraisal"] as YMapping;
        int defaultYear = brief.Date.Year;
        var empty = new YMapping(Array.Empty<KeyValuePair<YScalar, YNode>>(), top.At);
        double? year = ctx.Number(m ?? empty, F("appraisal.valuation_year"), "appraisal", fallback: defaultYear,
            fallbackSource: "the brief's date");
        if (year is not { } y) return null;
        if (y != Math.Floor(y))
        {
            ctx.Report(m!["valuation_year"]!.At, "appraisal.valuation_year", "must be a whole number",
                BindContext.Show(m["valuation_year"]!));
            return null;
        }
        if (reform is not null && y > reform.Year)
        {
            if (m?["valuation_year"] is { } node)
                ctx.Report(node.At, "appraisal.valuation_year",
                    $"must not be after the reform year ({reform.Year})", BindContext.Show(node));
            else if ((top["reform"] as YMapping)?["year"] is { } reformNode)
                ctx.Report(reformNode.At, "reform.year",
                    $"must not be before the valuation year ({defaultYear}, the brief's year); set " +
                    "appraisal.valuation_year to value an earlier reform", BindContext.Show(reformNode));
            else
                ctx.Report(top.At, "appraisal.valuation_year",
                    $"must not be after the reform year ({reform.Year})", $"{defaultYear}");
            return null;
        }
        return (int)y;
    }

    private IReadOnlyList<DiscountSchedule>? BindDiscounts(YMapping top)
    {
        var m = ctx.Mapping(top, F("appraisal"), "");
        if (m is null) return DiscountSchedule.Published;
        ctx.CheckFields(m, "appraisal", F("appraisal"));
        var list = ctx.Sequence(m, F("appraisal.discount_rates"), "appraisal");
        if (list is null) return DiscountSchedule.Published;
        var result = new List<DiscountSchedule>();
        var published = new[] { DiscountSchedule.GreenBook, DiscountSchedule.Omb3, DiscountSchedule.Omb7 };
        var known = F("appraisal.discount_rates[]").Choices.Zip(published).ToDictionary(p => p.First, p => p.Second);
        for (int i = 0; i < list.Items.Count; i++)
        {
            string ip = $"appraisal.discount_rates[{i}]";
            switch (list.Items[i])
            {
                case YScalar s when known.TryGetValue(s.Value, out var schedule):
                    result.Add(schedule);
                    break;
                case YScalar s:
                    string hint = Suggestions.Closest(s.Value, known.Keys) is { } g ? $" (did you mean '{g}'?)" : "";
                    ctx.Report(s.At, ip, $"must be one of {string.Join(", ", known.Keys)} or a mapping with id, " +
                        $"label and rate or schedule{hint}", $"'{s.Value}'");
                    break;
                case YMapping item:
                    if (BindSchedule(item, ip) is { } own) result.Add(own);
                    break;
                default:
                    ctx.Report(list.Items[i].At, ip,
                        "must be a published schedule name or a mapping", list.Items[i].Kind);
                    break;
            }
        }
        if (result.Count < F("appraisal.discount_rates").MinItems)
            ctx.Report(list.At, "appraisal.discount_rates", "must list at least one discount rate", "an empty list");
        return result;
    }

    private DiscountSchedule? BindSchedule(YMapping item, string ip)
    {
        const string d = "appraisal.discount_rates[]";
        ctx.CheckFields(item, ip, F(d));
        string? id = ctx.Text(item, F(d + ".id"), ip);
        string? label = ctx.Text(item, F(d + ".label"), ip);
        if (id is not null && ctx.Text(item, F(d + ".in_sentence"), ip) is { } name) RuleNames[id] = name;
        if (item["rate"] is not null)
        {
            double? rate = ctx.Number(item, F(d + ".rate"), ip);
            return id is null || label is null || rate is null
                ? null
                : DiscountSchedule.Constant(id, label, rate.Value);
        }
        var steps = ctx.Sequence(item, F(d + ".schedule"), ip, required: true);
        if (steps is null) return null;
        var list = new List<DiscountStep>();
        for (int j = 0; j < steps.Items.Count; j++)
        {
            string sp = $"{ip}.schedule[{j}]";
            if (steps.Items[j] is not YMapping s)
            {
                ctx.Report(steps.Items[j].At, sp, "must be a mapping with from_year and rate", steps.Items[j].Kind);
                continue;
            }
            const string step = d + ".schedule[]";
            ctx.CheckFields(s, sp, F(step));
            double? from = ctx.Number(s, F(step + ".from_year"), sp);
            double? rate = ctx.Number(s, F(step + ".rate"), sp);
            if (from is null || rate is null) continue;
            if (j == 0 && from != 1)
                ctx.Report(s["from_year"]!.At, sp + ".from_year",
                    "the first step must start at year 1", BindContext.Show(s["from_year"]!));
            if (list.Count > 0 && from <= list[^1].FromYear)
                ctx.Report(s["from_year"]!.At, sp + ".from_year",
                    $"steps must start at increasing years (previous step starts at {list[^1].FromYear})",
                    BindContext.Show(s["from_year"]!));
            list.Add(new DiscountStep((int)from.Value, rate.Value));
        }
        return id is null || label is null || list.Count == 0 ? null : new DiscountSchedule(id, label, list);
    }
}
