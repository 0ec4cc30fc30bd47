using System.Globalization;
using Briefwright.Model.Dynamics;
using Briefwright.Model.Inputs;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>Reads the optional sections reform, appraisal, sensitivity and uncertainty into analysis settings.</summary>
public sealed class AnalysisBinder(BindContext ctx)
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
    /// The most simulated years one brief's uncertainty analysis may ask for: (draws + Sobol samples × (parameters + 2))
    /// × horizon years. Each unit is one year of one simulated reform path, so this bounds the run's time and memory
    /// whatever the combination of limits (at 150 years: 66,000 draws, or 2,000 draws and the default 2,560 Sobol samples of 9 parameters
    /// with room to spare).
    /// </summary>
    public const long MaxSimulatedYears = 10_000_000;

    private void CheckWork(YMapping top, ReformSettings reform, MonteCarloSpec mc)
    {
        long paths = mc.Draws + (long)mc.SobolSamples * (mc.Parameters.Count + 2);
        long years = paths * reform.HorizonYears;
        if (years <= MaxSimulatedYears) return;
        var u = (YMapping)top["uncertainty"]!;
        var at = u["draws"] ?? u["sobol_samples"] ?? (YNode)u;
        ctx.Report(at.At, "uncertainty", $"asks for {Numbers.Count(years)} simulated years ((draws + sobol_samples × (parameters + 2)) × reform.horizon_years = ({mc.Draws} + {mc.SobolSamples} × {mc.Parameters.Count + 2}) × {reform.HorizonYears}); the limit for one brief is {Numbers.Count(MaxSimulatedYears)}; lower draws, sobol_samples or reform.horizon_years",
            Numbers.Count(years));
    }

    /// <summary>Monte Carlo draws tried when the scenario is checked, to catch distributions whose draws nearly all break a model rule.</summary>
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
        headline = (alternatives.FirstOrDefault(o => inputs.DemographyFor(o) != inputs.DemographyFor(b) || o.SchoolingYears != b.SchoolingYears) ?? alternatives[0]).Id;
        var m = ctx.Mapping(top, F("reform"), "");
        int defaultYear = brief.Date.Year + 1;
        if ((m is null || m["year"] is null) && !YearBounds.Contains(defaultYear))
        {
            var date = ((YMapping)top["brief"]!)["date"]!;
            ctx.Report(date.At, "brief.date", $"the reform starts the year after the brief's date unless reform.year is given, and must start from {YearBounds.Min} to {YearBounds.Max}; give reform.year", BindContext.Show(date));
            return null;
        }
        if (m is null) return new ReformSettings(defaultYear);
        const string p = "reform";
        ctx.CheckFields(m, p, F(p));
        double? year = ctx.Number(m, F("reform.year"), p, fallback: defaultYear);
        double? phase = ctx.Number(m, F("reform.phase_in_cohorts"), p);
        double? horizon = ctx.Number(m, F("reform.horizon_years"), p);
        foreach (var (key, v) in new[] { ("year", year), ("phase_in_cohorts", phase), ("horizon_years", horizon) })
            if (v is { } x && x != Math.Floor(x)) ctx.Report(m[key]!.At, $"{p}.{key}", "must be a whole number", BindContext.Show(m[key]!));
        if (ctx.Text(m, F("reform.headline_option"), p) is { } h)
        {
            if (inputs.Options.All(o => o.Id != h) || h == inputs.BaselineId)
                ctx.Report(m["headline_option"]!.At, "reform.headline_option", $"must name an option other than the baseline ({string.Join(", ", inputs.Options.Where(o => o.Id != inputs.BaselineId).Select(o => o.Id))})", $"'{h}'");
            else headline = h;
        }
        return year is null || phase is null || horizon is null ? null : new ReformSettings((int)year, (int)phase, (int)horizon);
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
            ctx.Report(m!["valuation_year"]!.At, "appraisal.valuation_year", "must be a whole number", BindContext.Show(m["valuation_year"]!));
            return null;
        }
        if (reform is not null && y > reform.Year)
        {
            if (m?["valuation_year"] is { } node)
                ctx.Report(node.At, "appraisal.valuation_year", $"must not be after the reform year ({reform.Year})", BindContext.Show(node));
            else if ((top["reform"] as YMapping)?["year"] is { } reformNode)
                ctx.Report(reformNode.At, "reform.year", $"must not be before the valuation year ({defaultYear}, the brief's year); set appraisal.valuation_year to value an earlier reform", BindContext.Show(reformNode));
            else
                ctx.Report(top.At, "appraisal.valuation_year", $"must not be after the reform year ({reform.Year})", $"{defaultYear}");
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
                    ctx.Report(s.At, ip, $"must be one of {string.Join(", ", known.Keys)} or a mapping with id, label and rate or schedule{(Suggestions.Closest(s.Value, known.Keys) is { } g ? $" (did you mean '{g}'?)" : "")}", $"'{s.Value}'");
                    break;
                case YMapping item:
                    if (BindSchedule(item, ip) is { } own) result.Add(own);
                    break;
                default:
                    ctx.Report(list.Items[i].At, ip, "must be a published schedule name or a mapping", list.Items[i].Kind);
                    break;
            }
        }
        if (result.Count < F("appraisal.discount_rates").MinItems) ctx.Report(list.At, "appraisal.discount_rates", "must list at least one discount rate", "an empty list");
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
            return id is null || label is null || rate is null ? null : DiscountSchedule.Constant(id, label, rate.Value);
        }
        var steps = ctx.Sequence(item, F(d + ".schedule"), ip, required: true);
        if (steps is null) return null;
        var list = new List<DiscountStep>();
        for (int j = 0; j < steps.Items.Count; j++)
        {
            string sp = $"{ip}.schedule[{j}]";
            if (steps.Items[j] is not YMapping s) { ctx.Report(steps.Items[j].At, sp, "must be a mapping with from_year and rate", steps.Items[j].Kind); continue; }
            const string step = d + ".schedule[]";
            ctx.CheckFields(s, sp, F(step));
            double? from = ctx.Number(s, F(step + ".from_year"), sp);
            double? rate = ctx.Number(s, F(step + ".rate"), sp);
            if (from is null || rate is null) continue;
            if (j == 0 && from != 1) ctx.Report(s["from_year"]!.At, sp + ".from_year", "the first step must start at year 1", BindContext.Show(s["from_year"]!));
            if (list.Count > 0 && from <= list[^1].FromYear) ctx.Report(s["from_year"]!.At, sp + ".from_year", $"steps must start at increasing years (previous step starts at {list[^1].FromYear})", BindContext.Show(s["from_year"]!));
            list.Add(new DiscountStep((int)from.Value, rate.Value));
        }
        return id is null || label is null || list.Count == 0 ? null : new DiscountSchedule(id, label, list);
    }

    private Parameters.Definition? Parameter(YScalar key, string path)
    {
        var def = Parameters.Find(key.Value);
        if (def is null)
            ctx.Report(key.At, path, Suggestions.Closest(key.Value, Parameters.All.Select(p => p.Name)) is { } g ? $"unknown parameter (did you mean '{g}'?)" : $"unknown parameter (expected one of: {Names})", $"'{key.Value}'");
        return def;
    }

    private (double Low, double High)? Pair(YNode node, string path, Parameters.Definition def, ModelInputs inputs)
    {
        if (node is not YSequence { Items.Count: 2 } seq || seq.Items.Any(i => i is not YScalar))
        {
            ctx.Report(node.At, path, "must be a list of two numbers, [low, high]", node.Kind);
            return null;
        }
        var wrapper = new YMapping(new[] { new KeyValuePair<YScalar, YNode>(new YScalar("low", false, seq.At), seq.Items[0]), new(new YScalar("high", false, seq.At), seq.Items[1]) }, seq.At);
        var unit = def.IsRate ? ValueUnit.Rate : ValueUnit.Number;
        var bounds = ParameterBounds.For(def.Name);
        double? lo = ctx.Number(wrapper, "low", path + "[0]", unit, bounds);
        double? hi = ctx.Number(wrapper, "high", path + "[1]", unit, bounds);
        if (lo is null || hi is null) return null;
        if (!(hi > lo)) { ctx.Report(seq.Items[1].At, path + "[1]", $"the high end must be above the low end ({lo.Value.ToString(CultureInfo.InvariantCulture)})", BindContext.Show(seq.Items[1])); return null; }
        if (!Solvable(inputs, def, lo.Value, seq.Items[0], path + "[0]") || !Solvable(inputs, def, hi.Value, seq.Items[1], path + "[1]")) return null;
        return (lo.Value, hi.Value);
    }

    /// <summary>Whether the scenario with <paramref name="def"/> set to <paramref name="value"/> still meets every model
    /// rule (the rules Monte Carlo draws are held to); reports the broken rule at <paramref name="node"/> when not.</summary>
    private bool Solvable(ModelInputs inputs, Parameters.Definition def, double value, YNode node, string path, (Parameters.Definition Def, double Value)? other = null)
    {
        var trial = def.Set(inputs, value);
        if (other is { } o) trial = o.Def.Set(trial, o.Value);
        if (Parameters.Violation(trial) is not { } why) return true;
        string with = other is { } w ? $" and {w.Def.Name} at {Format(w.Def, w.Value)}" : "";
        ctx.Report(node.At, path, $"with {def.Name} at {Format(def, value)}{with} the scenario breaks a model rule ({why})", BindContext.Show(node));
        return false;
    }

    private static string Format(Parameters.Definition def, double v) =>
        def.IsRate ? Numbers.Percent(v) : Numbers.Plain(v);

    private (IReadOnlyList<SensitivityRange>, IReadOnlyList<GridSpec>) BindSensitivity(YMapping top, ModelInputs inputs)
    {
        var ranges = new List<SensitivityRange>();
        var grids = new List<GridSpec>();
        var m = ctx.Mapping(top, F("sensitivity"), "");
        if (m is null) return (ranges, grids);
        ctx.CheckFields(m, "sensitivity", F("sensitivity"));
        if (ctx.Mapping(m, F("sensitivity.ranges"), "sensitivity") is { } r)
            foreach (var (key, value) in r.Entries)
            {
                string path = $"sensitivity.ranges.{key.Value}";
                if (Parameter(key, path) is { } def && Pair(value, path, def, inputs) is { } pair) ranges.Add(new SensitivityRange(def.Name, pair.Low, pair.High));
            }
        const string gf = "sensitivity.grids[]";
        if (ctx.Sequence(m, F("sensitivity.grids"), "sensitivity") is { } g)
            for (int i = 0; i < g.Items.Count; i++)
            {
                string ip = $"sensitivity.grids[{i}]";
                if (g.Items[i] is not YMapping item) { ctx.Report(g.Items[i].At, ip, "must be a mapping with x, x_range, y, y_range", g.Items[i].Kind); continue; }
                ctx.CheckFields(item, ip, F(gf));
                var x = item["x"] as YScalar;
                var y = item["y"] as YScalar;
                if (x is null || y is null) { ctx.Report(item.At, ip, "needs x and y parameter names", null); continue; }
                var dx = Parameter(x, ip + ".x");
                var dy = Parameter(y, ip + ".y");
                double? steps = ctx.Number(item, F(gf + ".steps"), ip);
                string output = ctx.Choice(item, F(gf + ".output"), ip) ?? F(gf + ".output").DefaultText!;
                if (dx is null || dy is null || steps is null) continue;
                if (dx == dy) { ctx.Report(y.At, ip + ".y", "must differ from x", $"'{y.Value}'"); continue; }
                var xr = item["x_range"] is { } xn ? Pair(xn, ip + ".x_range", dx, inputs) : null;
                var yr = item["y_range"] is { } yn ? Pair(yn, ip + ".y_range", dy, inputs) : null;
                if (xr is null || yr is null) { if (item["x_range"] is null || item["y_range"] is null) ctx.Report(item.At, ip, "needs x_range and y_range", null); continue; }
                // Every rule is linear or monotone in each parameter, so the grid's four corners stand for all its points.
                bool cornersOk = true;
                foreach (double xv in new[] { xr.Value.Low, xr.Value.High })
                    foreach (double yv in new[] { yr.Value.Low, yr.Value.High })
                        if (cornersOk) cornersOk = Solvable(inputs, dx, xv, item["x_range"]!, ip + ".x_range", (dy, yv));
                if (!cornersOk) continue;
                grids.Add(new GridSpec(dx.Name, xr.Value.Low, xr.Value.High, dy.Name, yr.Value.Low, yr.Value.High, (int)steps.Value, output));
            }
        return (ranges, grids);
    }

    private MonteCarloSpec? BindUncertainty(YMapping top, ModelInputs inputs)
    {
        const string p = "uncertainty";
        var m = ctx.Mapping(top, F(p), "");
        if (m is null) return null;
        ctx.CheckFields(m, p, F(p));
        double? draws = ctx.Number(m, F(p + ".draws"), p);
        double? seed = ctx.Number(m, F(p + ".seed"), p);
        double? sobol = ctx.Number(m, F(p + ".sobol_samples"), p);
        var parameters = new List<UncertainParameter>();
        if (ctx.Mapping(m, F(p + ".parameters"), p) is { } ps)
            foreach (var (key, value) in ps.Entries)
            {
                string path = $"{p}.parameters.{key.Value}";
                if (Parameter(key, path) is not { } def) continue;
                if (value is not YMapping dm) { ctx.Report(value.At, path, "must be a mapping with a distribution and its parameters", value.Kind); continue; }
                if (BindDistribution(dm, path, def) is { } dist) parameters.Add(new UncertainParameter(def.Name, dist));
            }
        if (draws is null || seed is null || sobol is null) return null;
        if (parameters.Count == 0)
        {
            // Only when none was given: a parameter that failed to bind has already been reported where it was written.
            if (m["parameters"] is not YMapping { Entries.Count: > 0 }) ctx.Report(m.At, p + ".parameters", "must give at least one parameter a distribution", null);
            return null;
        }
        var spec = new MonteCarloSpec((int)draws, (ulong)seed, parameters, (int)sobol);
        return Pilot(inputs, spec, m["parameters"]!) && SobolPilot(inputs, spec, m) ? spec : null;
    }

    /// <summary>
    /// Draws the first <see cref="PilotDraws"/> Monte Carlo draws as the model will (same streams, same rejection rule)
    /// without solving them: when more than a third of those draws fail every attempt, the run would stop, so the
    /// distributions are reported now. Cheap: a draw here is only a few additions and comparisons.
    /// </summary>
    private bool Pilot(ModelInputs inputs, MonteCarloSpec spec, YNode at)
    {
        int n = Math.Min(spec.Draws, PilotDraws), failed = 0;
        string? why = null;
        var u = new double[spec.Parameters.Count];
        for (int i = 0; i < n; i++)
        {
            var rng = SplitMix64.ForStream(spec.Seed, (ulong)i);
            bool accepted = false;
            for (int attempt = 0; attempt < MonteCarlo.MaxAttemptsPerDraw && !accepted; attempt++)
            {
                for (int j = 0; j < u.Length; j++) u[j] = rng.NextOpenUnit();
                var trial = MonteCarlo.Apply(inputs, spec.Parameters, u);
                string? violation = Parameters.Violation(trial);
                accepted = violation is null;
                why ??= violation;
            }
            if (!accepted) failed++;
        }
        if (failed * 3 <= n) return true;
        ctx.Report(at.At, "uncertainty.parameters",
            $"the distributions break a model rule too often: {failed} of the first {n} draws failed all {MonteCarlo.MaxAttemptsPerDraw} attempts (for example: {why}); narrow the distributions",
            $"{failed} of {n}");
        return false;
    }

    /// <summary>
    /// The Sobol samples' counterpart of <see cref="Pilot"/>: the first <see cref="PilotDraws"/> base samples as the
    /// model draws them (same seed, same rows), each with its d + 2 runs checked against the model's rules without
    /// solving. A sample is used only when all its runs meet them and is not redrawn, so distributions that Monte Carlo
    /// survives by redrawing can leave the indices nothing; the model needs <see cref="Sobol.MinRows"/> of them.
    /// </summary>
    private bool SobolPilot(ModelInputs inputs, MonteCarloSpec spec, YMapping at)
    {
        if (spec.SobolSamples == 0) return true;
        int n = Math.Min(spec.SobolSamples, PilotDraws), d = spec.Parameters.Count, accepted = 0;
        string? why = null;
        var a = new double[d];
        var b = new double[d];
        var mixed = new double[d];
        bool Meets(double[] u)
        {
            string? violation = Parameters.Violation(MonteCarlo.Apply(inputs, spec.Parameters, u));
            why ??= violation;
            return violation is null;
        }
        for (int r = 0; r < n; r++)
        {
            Sobol.BaseRow(AnalysisRunner.SobolSeed(spec), r, a, b);
            bool ok = Meets(a) && Meets(b);
            for (int i = 0; i < d && ok; i++)
            {
                a.CopyTo(mixed, 0);
                mixed[i] = b[i];
                ok = Meets(mixed);
            }
            if (ok) accepted++;
        }
        if (accepted >= Sobol.MinRows(n)) return true;
        var node = at["sobol_samples"] ?? at["parameters"]!;
        ctx.Report(node.At, node == at["sobol_samples"] ? "uncertainty.sobol_samples" : "uncertainty.parameters",
            $"the distributions break a model rule too often for the Sobol indices: only {accepted} of the first {n} base samples met every rule in all {d + 2} of their runs (at least {Sobol.MinRows(n)} must; for example: {why}); narrow the distributions, or set sobol_samples to 0",
            $"{accepted} of {n}");
        return false;
    }

    private Distribution? BindDistribution(YMapping m, string path, Parameters.Definition def)
    {
        const string d = "uncertainty.parameters.*";
        var unit = def.IsRate ? ValueUnit.Rate : ValueUnit.Number;
        // The ends of a bounded distribution are values the parameter takes, so they follow the parameter's own rules.
        var ends = ParameterBounds.For(def.Name);
        double? Value(string key)
        {
            var f = F(d + "." + key);
            return ctx.Number(m, f, path, unit: unit, bounds: f.ParameterBounds ? ends : f.Bounds);
        }
        string? kind = ctx.Choice(m, F(d + ".distribution"), path);
        if (kind is not null) ctx.CheckFields(m, path, F(d), kind);
        switch (kind)
        {
            case "normal":
            {
                double? mean = Value("mean"), sd = Value("sd");
                return mean is null || sd is null ? null : new NormalDistribution(mean.Value, sd.Value);
            }
            case "truncated_normal":
            {
                double? mean = Value("mean"), sd = Value("sd");
                double? lo = Value("low"), hi = Value("high");
                if (mean is null || sd is null || lo is null || hi is null) return null;
                if (!(hi > lo)) { ctx.Report(m["high"]!.At, path + ".high", "must be above low", BindContext.Show(m["high"]!)); return null; }
                return new TruncatedNormalDistribution(mean.Value, sd.Value, lo.Value, hi.Value);
            }
            case "uniform":
            {
                double? lo = Value("low"), hi = Value("high");
                if (lo is null || hi is null) return null;
                if (!(hi > lo)) { ctx.Report(m["high"]!.At, path + ".high", "must be above low", BindContext.Show(m["high"]!)); return null; }
                return new UniformDistribution(lo.Value, hi.Value);
            }
            case "triangular":
            {
                double? lo = Value("low"), mode = Value("mode"), hi = Value("high");
                if (lo is null || mode is null || hi is null) return null;
                if (!(lo <= mode && mode <= hi && hi > lo)) { ctx.Report(m["mode"]!.At, path + ".mode", "must satisfy low ≤ mode ≤ high with low < high", BindContext.Show(m["mode"]!)); return null; }
                return new TriangularDistribution(lo.Value, mode.Value, hi.Value);
            }
            case "lognormal":
            {
                double? median = Value("median"), sigma = ctx.Number(m, F(d + ".sigma_log"), path);
                return median is null || sigma is null ? null : new LognormalDistribution(median.Value, sigma.Value);
            }
            default:
                return null;
        }
    }
}
