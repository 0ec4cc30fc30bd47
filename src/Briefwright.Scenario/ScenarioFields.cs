using System.Globalization;
using System.Text;
using Briefwright.Model.Inputs;
using Briefwright.Scenario.Binding;

namespace Briefwright.Scenario;

/// <summary>What a field of the scenario holds.</summary>
public enum FieldKind
{
    /// <summary>A mapping of the keys listed under it.</summary>
    Section,
    /// <summary>A mapping whose keys depend on a selector field (<c>form</c>, <c>distribution</c>).</summary>
    Variants,
    /// <summary>A list of the item listed under it (path <c>…[]</c>).</summary>
    List,
    /// <summary>A mapping from parameter names to the item listed under it (path <c>….*</c>).</summary>
    ParameterMap,
    /// <summary>A published schedule's name or a mapping of the keys listed under it.</summary>
    NameOrSection,
    Text,
    /// <summary>A path to another file, relative to the file that names it.</summary>
    Path,
    /// <summary>1–64 of a–z, 0–9, '-' and '_', starting with a letter or digit.</summary>
    Id,
    Date,
    Choice,
    Flag,
    Number,
    /// <summary>A parameter's name (one of <see cref="Model.Uncertainty.Parameters.All"/>).</summary>
    ParameterName,
    /// <summary>A number in the unit of the parameter it belongs to.</summary>
    ParameterValue,
    /// <summary><c>[low, high]</c> in the unit of the parameter it belongs to, each end within its bounds.</summary>
    Range,
}

/// <summary>
/// One field of the scenario format. <see cref="Path"/> is dotted (<c>demography.survival.max_age</c>); a list's item
/// is <c>options[]</c>, a parameter map's entry <c>uncertainty.parameters.*</c>. A field under a
/// <see cref="FieldKind.Variants"/> mapping names the variants it belongs to (none: all of them).
/// </summary>
public sealed record ScenarioField(string Path, FieldKind Kind, string Label)
{
    public string[] Variants { get; init; } = [];
    public bool Required { get; init; }
    public ValueUnit Unit { get; init; } = ValueUnit.Number;
    public Bounds Bounds { get; init; }
    /// <summary>Whole numbers only (the binder refuses 2027.5; the schema says integer).</summary>
    public bool Whole { get; init; }
    /// <summary>The value taken when the field is not written.</summary>
    public double? Default { get; init; }
    /// <summary>The default in words, when it is not a number or depends on other fields.</summary>
    public string? DefaultText { get; init; }
    public string? Help { get; init; }
    public int MaxLength { get; init; } = 400;
    /// <summary>
    /// For <see cref="FieldKind.Text"/>: a regular expression the whole value must match (the schema says it too).
    /// </summary>
    public string? Pattern { get; init; }
    public string[] Choices { get; init; } = [];
    /// <summary>The selector field of a <see cref="FieldKind.Variants"/> mapping.</summary>
    public string? Selector { get; init; }
    public int MinItems { get; init; }
    /// <summary>
    /// Keys of which a mapping must hold at least one (a discount rule's <c>rate</c> or <c>schedule</c>).
    /// </summary>
    public string[] Alternatives { get; init; } = [];
    /// <summary>The binder adds a row with <see cref="Label"/> to the brief's assumptions table.</summary>
    public bool Assumption { get; init; }
    /// <summary>For a <see cref="FieldKind.ParameterValue"/>: the value is one the parameter takes, so it obeys the
    /// parameter's own bounds (the ends of a bounded distribution) rather than <see cref="Bounds"/>.</summary>
    public bool ParameterBounds { get; init; }

    /// <summary>The key the field is written under (the last part of its path).</summary>
    public string Key => Path[(Path.LastIndexOf('.') + 1)..];

    /// <summary>The path of the mapping or list holding the field.</summary>
    public string Parent => Path.LastIndexOf('.') is var i and >= 0 ? Path[..i] : "";

    public bool In(string? variant) => Variants.Length == 0 || variant is null || Variants.Contains(variant);
}

/// <summary>
/// The scenario format, declared once: every field's path, kind, unit, bounds (with open or closed ends), default,
/// label and help. The binder takes its keys, bounds, defaults and labels from here, <see cref="ScenarioSchema"/>
/// builds the JSON Schema from it, and <see cref="ReferenceTable"/> writes the field reference in
/// docs/scenario-format.md (a test fails when the page and this list differ). Rules across fields (one baseline,
/// increasing brackets, n + g + δ) stay in the binder and <see cref="CrossFieldRules"/>.
/// </summary>
public static class ScenarioFields
{
    private const string Gm = "gompertz_makeham";
    private static readonly Bounds Age = Bounds.OpenClosed(0, 150);
    private static readonly Bounds Year = Bounds.Closed(1900, 2300);
    private static readonly Bounds DiscountRate = Bounds.Closed(-0.05, 0.5);
    private static readonly Bounds AnyValue = Bounds.Closed(-1000, 1000);
    private static readonly Bounds Positive = Bounds.OpenClosed(0, 1000);
    private static readonly string[] Distributions =
        ["normal", "truncated_normal", "uniform", "triangular", "lognormal"];

    private static ScenarioField S(string path, string label, bool required = false) =>
        new(path, FieldKind.Section, label) { Required = required };

    private static ScenarioField T(string path, string label, int maxLength = 400, bool required = false) =>
        new(path, FieldKind.Text, label) { MaxLength = maxLength, Required = required };

    private static ScenarioField N(string path, string label, ValueUnit unit, Bounds bounds, bool required = false) =>
        new(path, FieldKind.Number, label) { Unit = unit, Bounds = bounds, Required = required };

    private static ScenarioField C(string path, string label, params string[] choices) =>
        new(path, FieldKind.Choice, label) { Choices = choices };

    /// <summary>
    /// Every field, in the order the binder lists a mapping's keys (its messages name them in this order).
    /// </summary>
    public static readonly IReadOnlyList<ScenarioField> All =
    [
        new("extends", FieldKind.Path, "Path of the scenario this one builds on, relative to this file")
            { Help = "a `.yaml` file inside the project folder; see `extends` below" },
        S("brief", "Title-block facts", required: true),
        S("demography", "Stable population", required: true),
        S("human_capital", "Human capital"),
        S("production", "Production", required: true),
        new("options", FieldKind.List, "Policy options")
            { Required = true, MinItems = 2, Help = "a baseline and at least one alternative" },
        S("reform", "Reform simulation"),
        S("appraisal", "Discounting"),
        S("sensitivity", "Sensitivity"),
        S("uncertainty", "Monte Carlo and Sobol"),

        new("brief.id", FieldKind.Id, "Id") { Required = true, Help = "names the output files" },
        T("brief.title", "Title", 200, required: true),
        T("brief.short_title", "Running header", 80) with { DefaultText = "the title" },
        T("brief.organisation", "Organisation", 200, required: true),
        T("brief.author", "Author", 200),
        new("brief.date", FieldKind.Date, "Date of the brief, YYYY-MM-DD")
            { Required = true, Help = "never taken from the clock" },
        C("brief.status", "Status", "draft", "consultation", "final") with
            { DefaultText = "draft", Help = "a draft or consultation brief carries a DRAFT marker on every page" },
        N("brief.edition", "Edition", ValueUnit.Number, Bounds.Closed(1, 9999)) with
        {
            Whole = true, Default = 1,
            Help = "a minimum: a new edition takes the next number or this one, whichever is higher; below an edition "
                + "already issued it is an error (README, \"Rebuilds, editions and the data annex\")",
        },
        T("brief.question", "The policy question", 2000),
        T("brief.language", "Language of the brief", 35) with
        {
            DefaultText = LanguageTag.Default, Pattern = LanguageTag.Pattern,
            Help = "a language tag: en-GB, fr-FR, es-ES, de-DE (any region of en, fr, es, de); the tool's words, "
                + "the number and date formats and the PDF's language tag follow it; a right-to-left language, or "
                + "right-to-left text in any field, is refused (the layout writes left to right only); see "
                + "docs/templates.md, \"Languages\"",
        },

        N("demography.population_growth", "Population growth rate", ValueUnit.Rate, Bounds.Closed(-0.1, 0.1), true)
            with { Assumption = true, Help = "n; zero and negative allowed" },
        N("demography.school_entry_age", "School-entry age", ValueUnit.Age, Bounds.Closed(0, 30), true)
            with { Assumption = true },
        N("demography.retirement_age", "Retirement age", ValueUnit.Age, Age, true)
            with { Assumption = true, Help = "at most the survival curve's maximum age" },
        N("demography.participation", "Labour-force participation", ValueUnit.Rate, Bounds.OpenClosed(0, 1))
            with { Assumption = true, Default = 1, Help = "share of working-age people in the labour force" },
        new("demography.survival", FieldKind.Variants, "Survival curve") { Required = true, Selector = "form" },
        C("demography.survival.form", "Form of the survival curve", "rectangular", Gm, "life_table")
            with { Required = true },
        N("demography.survival.max_age", "Age at death (everyone)", ValueUnit.Age, Age, true)
            with { Variants = ["rectangular"], Assumption = true },
        N("demography.survival.a", "Makeham term A", ValueUnit.Number, Bounds.ClosedOpen(0, 1), true)
            with { Variants = [Gm], Assumption = true, Help = "μ(a) = A + B·cᵃ" },
        N("demography.survival.b", "Gompertz level B", ValueUnit.Number, Bounds.Open(0, 1), true)
            with { Variants = [Gm], Assumption = true },
        N("demography.survival.c", "Gompertz growth c", ValueUnit.Number, Bounds.Open(1, 2), true)
            with { Variants = [Gm], Assumption = true },
        N("demography.survival.max_age", "Oldest age considered", ValueUnit.Age, Age)
            with { Variants = [Gm], Assumption = true, Default = 120, Help = "integrals stop here" },
        T("demography.survival.file", "Life table", required: true) with
        {
            Variants = ["life_table"], Unit = ValueUnit.Text,
            Help = "a `.csv` file inside the project folder of `age,survivors` from age 0, not increasing; any radix",
        },
        T("demography.survival.source", "Source of the life table") with { Variants = ["life_table"] },
        T("demography.survival.note", "Note", 1000) with { Variants = ["life_table"] },

        new("human_capital.returns", FieldKind.Variants, "Returns to schooling")
            { Selector = "form", DefaultText = "Hall–Jones brackets" },
        C("human_capital.returns.form", "Form of the returns", "constant", "brackets", "power")
            with { Required = true },
        N("human_capital.returns.rate", "Return to a year of schooling", ValueUnit.Rate, Bounds.Open(0, 1), true)
            with { Variants = ["constant"], Assumption = true },
        new("human_capital.returns.brackets", FieldKind.List, "Returns to schooling")
            {
                Variants = ["brackets"], MinItems = 1, DefaultText = "Hall–Jones",
                Help = "first `from` is 0, increasing",
            },
        T("human_capital.returns.source", "Source") with { Variants = ["brackets"] },
        T("human_capital.returns.note", "Note", 1000) with { Variants = ["brackets"] },
        N("human_capital.returns.theta", "Power-form scale θ", ValueUnit.Number, Bounds.Open(0, 2), true)
            with { Variants = ["power"], Assumption = true, Help = "φ(E) = θ/(1−ψ)·E^(1−ψ)" },
        N("human_capital.returns.psi", "Power-form curvature ψ", ValueUnit.Number, Bounds.ClosedOpen(0, 1), true)
            with { Variants = ["power"], Assumption = true },
        S("human_capital.returns.brackets[]", "A bracket of returns"),
        N("human_capital.returns.brackets[].from", "First year of the bracket", ValueUnit.Years, Bounds.Closed(0, 40),
            true),
        N("human_capital.returns.brackets[].rate", "Return", ValueUnit.Rate, Bounds.ClosedOpen(0, 1), true),
        S("human_capital.experience", "Mincer experience profile") with { Help = "β₁x − β₂x²" },
        N("human_capital.experience.linear", "Experience premium, linear term β₁", ValueUnit.Number,
            Bounds.Closed(0, 0.5), true)
            with { Assumption = true },
        N("human_capital.experience.quadratic", "Experience premium, quadratic term β₂", ValueUnit.Number,
            Bounds.OpenClosed(0, 0.05), true) with { Assumption = true },

        N("production.saving_rate", "Saving (investment) rate", ValueUnit.Rate,
            Bounds.ClosedOpen(ModelLimits.MinSavingRate, 1), true) with { Assumption = true },
        N("production.capital_share", "Capital share of income α", ValueUnit.Rate,
            Bounds.Open(0, ModelLimits.MaxCapitalShare), true) with { Assumption = true },
        N("production.depreciation", "Depreciation rate δ", ValueUnit.Rate, Bounds.ClosedOpen(0, 1), true)
            with { Assumption = true, Help = "n + g + δ must be at least 0.1%" },
        N("production.technology_growth", "Technology growth g", ValueUnit.Rate, Bounds.Closed(-0.1, 0.1), true)
            with { Assumption = true },

        S("options[]", "A policy option"),
        new("options[].id", FieldKind.Id, "Id") { Required = true, Help = "unique among the options" },
        T("options[].label", "Label", 120, required: true),
        T("options[].in_sentence", "How the option reads inside a sentence", 120) with
        {
            DefaultText = "the label, first letter lower-cased unless it starts with a name or acronym",
            Help = "`raising compulsory schooling to 12 years` where the table says `Compulsory to 12 years`",
        },
        N("options[].schooling_years", "Years of schooling", ValueUnit.Years, Bounds.Closed(0, 40), true),
        N("options[].retirement_age", "Own retirement age", ValueUnit.Age, Age) with { DefaultText = "the scenario's" },
        N("options[].participation", "Own participation", ValueUnit.Rate, Bounds.OpenClosed(0, 1))
            with { DefaultText = "the scenario's" },
        new("options[].baseline", FieldKind.Flag, "The baseline option")
            { DefaultText = "false", Help = "at most one option; without one, the first is the baseline" },
        T("options[].source", "Source"),
        T("options[].note", "Note", 1000),

        N("reform.year", "Reform year", ValueUnit.Number, Year)
            with { Whole = true, DefaultText = "the year after the brief's date" },
        N("reform.phase_in_cohorts", "Cohorts to phase in", ValueUnit.Number, Bounds.Closed(1, 40))
            with { Whole = true, Default = 1 },
        N("reform.horizon_years", "Years simulated", ValueUnit.Years, Bounds.Closed(20, AnalysisBinder.MaxHorizon))
            with { Whole = true, Default = 150 },
        T("reform.headline_option", "Option for charts and indices") with
            {
                DefaultText = "the first option that differs from the baseline",
                Help = "an option other than the baseline",
            },

        new("appraisal.discount_rates", FieldKind.List, "Discount rates")
            { MinItems = 1, DefaultText = "green_book, omb_3, omb_7", Help = "the first is the headline schedule" },
        N("appraisal.valuation_year", "Valuation year of present values", ValueUnit.Number, Year) with
        {
            Whole = true, Assumption = true, DefaultText = "the brief's year", Help = "not after the reform year",
        },
        new("appraisal.discount_rates[]", FieldKind.NameOrSection, "A discount rate")
            {
                Choices = ["green_book", "omb_3", "omb_7"], Alternatives = ["rate", "schedule"],
                Help = "a published schedule's name or a rule of one's own",
            },
        T("appraisal.discount_rates[].id", "Id", required: true),
        T("appraisal.discount_rates[].label", "Label", 120, required: true),
        T("appraisal.discount_rates[].in_sentence", "How the rule reads inside a sentence", 120)
            with { DefaultText = "described from its rates" },
        N("appraisal.discount_rates[].rate", "Constant rate", ValueUnit.Rate, DiscountRate)
            with { Help = "give `rate` or `schedule`" },
        new("appraisal.discount_rates[].schedule", FieldKind.List, "A declining schedule")
            { MinItems = 1, Help = "give `rate` or `schedule`" },
        T("appraisal.discount_rates[].source", "Source"),
        S("appraisal.discount_rates[].schedule[]", "A step of a declining schedule"),
        N("appraisal.discount_rates[].schedule[].from_year", "First year of the step", ValueUnit.Number,
            Bounds.Closed(1, 10_000), true) with { Help = "the first is 1, increasing" },
        N("appraisal.discount_rates[].schedule[].rate", "Rate", ValueUnit.Rate, DiscountRate, true),

        new("sensitivity.ranges", FieldKind.ParameterMap, "One-at-a-time ranges (tornado)"),
        new("sensitivity.grids", FieldKind.List, "Two-way grids (heat map)"),
        new("sensitivity.ranges.*", FieldKind.Range, "A parameter's range")
            { Bounds = AnyValue, ParameterBounds = true },
        S("sensitivity.grids[]", "A two-way grid"),
        new("sensitivity.grids[].x", FieldKind.ParameterName, "Parameter across") { Required = true },
        new("sensitivity.grids[].x_range", FieldKind.Range, "Its range")
            { Required = true, Bounds = AnyValue, ParameterBounds = true },
        new("sensitivity.grids[].y", FieldKind.ParameterName, "Parameter down")
            { Required = true, Help = "differs from x" },
        new("sensitivity.grids[].y_range", FieldKind.Range, "Its range")
            { Required = true, Bounds = AnyValue, ParameterBounds = true },
        N("sensitivity.grids[].steps", "Steps per axis", ValueUnit.Number, Bounds.Closed(2, 41)) with { Default = 9 },
        C("sensitivity.grids[].output", "What the grid shows", "optimum", "change") with { DefaultText = "optimum" },

        N("uncertainty.draws", "Accepted draws", ValueUnit.Number, Bounds.Closed(10, AnalysisBinder.MaxDraws))
            with { Default = 2000 },
        N("uncertainty.seed", "Random seed", ValueUnit.Number, Bounds.Closed(0, 9_007_199_254_740_991), true)
            with { Help = "the same seed gives the same numbers" },
        N("uncertainty.sobol_samples", "Sobol base samples", ValueUnit.Number,
            Bounds.Closed(0, AnalysisBinder.MaxSobolSamples))
            with { Default = AnalysisBinder.DefaultSobolSamples, Help = "0 skips the Sobol indices" },
        new("uncertainty.parameters", FieldKind.ParameterMap, "Distributions of the uncertain parameters")
            { Required = true, MinItems = 1 },
        new("uncertainty.parameters.*", FieldKind.Variants, "A parameter's distribution") { Selector = "distribution" },
        C("uncertainty.parameters.*.distribution", "Distribution", Distributions) with { Required = true },
        new("uncertainty.parameters.*.mean", FieldKind.ParameterValue, "Mean")
            { Variants = ["normal", "truncated_normal"], Required = true, Bounds = AnyValue },
        new("uncertainty.parameters.*.sd", FieldKind.ParameterValue, "Standard deviation")
            { Variants = ["normal", "truncated_normal"], Required = true, Bounds = Positive },
        new("uncertainty.parameters.*.low", FieldKind.ParameterValue, "Lower bound")
            {
                Variants = ["truncated_normal", "uniform", "triangular"], Required = true, Bounds = AnyValue,
                ParameterBounds = true,
            },
        new("uncertainty.parameters.*.mode", FieldKind.ParameterValue, "Most likely value")
            { Variants = ["triangular"], Required = true, Bounds = AnyValue, ParameterBounds = true },
        new("uncertainty.parameters.*.high", FieldKind.ParameterValue, "Upper bound")
            {
                Variants = ["truncated_normal", "uniform", "triangular"], Required = true, Bounds = AnyValue,
                ParameterBounds = true,
            },
        new("uncertainty.parameters.*.median", FieldKind.ParameterValue, "Median")
            { Variants = ["lognormal"], Required = true, Bounds = Positive },
        N("uncertainty.parameters.*.sigma_log", "Standard deviation of the log", ValueUnit.Number,
            Bounds.OpenClosed(0, 5), true)
            with { Variants = ["lognormal"] },
    ];

    /// <summary>The fields written as keys of a mapping, by the mapping's path (a list's item and a parameter map's
    /// entry are not keys).</summary>
    private static readonly IReadOnlyDictionary<string, ScenarioField[]> ByParent = All
        .Where(f => !f.Path.EndsWith("[]", StringComparison.Ordinal)
            && !f.Path.EndsWith(".*", StringComparison.Ordinal))
        .GroupBy(f => f.Parent).ToDictionary(g => g.Key, g => g.ToArray(), StringComparer.Ordinal);

    /// <summary>
    /// The field at <paramref name="path"/> (in <paramref name="variant"/>, where the path has several).
    /// </summary>
    public static ScenarioField Get(string path, string? variant = null) =>
        All.FirstOrDefault(f => f.Path == path && f.In(variant))
        ?? throw new ArgumentException($"no scenario field {path}", nameof(path));

    /// <summary>The fields of the mapping at <paramref name="path"/> (of one variant), in order.</summary>
    public static IReadOnlyList<ScenarioField> Children(string path, string? variant = null) =>
        ByParent.TryGetValue(path, out var fields) ? fields.Where(f => f.In(variant)).ToArray() : [];

    /// <summary>
    /// The keys the mapping at <paramref name="path"/> (of one variant) may hold, in order, each once.
    /// </summary>
    public static string[] Keys(string path, string? variant = null) =>
        Children(path, variant).Select(f => f.Key).Distinct().ToArray();

    private static string Number(double x, bool percent) =>
        (percent ? Numbers.Percent(x) : Math.Abs(x) >= 1e15 ? Numbers.Exact(x) : Numbers.Plain(x, 8)).Replace('-', '−');

    /// <summary>An interval as the reference writes it: [a, b] holds both ends, (a, b) neither.</summary>
    public static string Interval(Bounds b, bool percent) =>
        $"{(b.MinInclusive ? '[' : '(')}{Number(b.Min, percent)}, " +
        $"{Number(b.Max, percent)}{(b.MaxInclusive ? ']' : ')')}";

    private static string UnitText(ScenarioField f) => f.Kind switch
    {
        FieldKind.Section or FieldKind.Variants => "mapping",
        FieldKind.List => "list",
        FieldKind.ParameterMap => "parameter → " + (f.Path == "sensitivity.ranges" ? "range" : "distribution"),
        FieldKind.NameOrSection => string.Join(", ", f.Choices.Select(c => $"`{c}`")) + " or mapping",
        FieldKind.Text => "text",
        FieldKind.Path => "path",
        FieldKind.Id => "id",
        FieldKind.Date => "`YYYY-MM-DD`",
        FieldKind.Choice => string.Join(", ", f.Choices.Select(c => $"`{c}`")),
        FieldKind.Flag => "`true` or `false`",
        FieldKind.ParameterName => "parameter",
        FieldKind.ParameterValue => "parameter's unit",
        FieldKind.Range => "`[low, high]`",
        _ when f.Whole => "whole number",
        _ => f.Unit switch
        {
            ValueUnit.Rate => "rate", ValueUnit.Age => "age", ValueUnit.Years => "years", _ => "number",
        },
    };

    /// <summary>The default in words (a rate as a percentage), or null when the field has none.</summary>
    public static string? DefaultOf(ScenarioField f) =>
        f.DefaultText ?? (f.Default is { } v ? Number(v, f.Unit == ValueUnit.Rate) : null);

    private static string RequiredText(ScenarioField f)
    {
        string when = f.Variants.Length == 0 ? "" : string.Join(", ", f.Variants.Select(v => $"`{v}`")) + ": ";
        if (f.Path.EndsWith("[]", StringComparison.Ordinal) || f.Path.EndsWith(".*", StringComparison.Ordinal))
            return "each item";
        if (f.Required) return when + "yes";
        return when + (DefaultOf(f) is { } d ? $"no ({d})" : "no");
    }

    private static string RuleText(ScenarioField f)
    {
        var parts = new List<string>();
        bool numeric = f.Kind is FieldKind.Number or FieldKind.ParameterValue or FieldKind.Range;
        if (f.ParameterBounds) parts.Add("within the parameter's bounds");
        else if (numeric) parts.Add(Interval(f.Bounds, f.Unit == ValueUnit.Rate));
        if (f.Kind is FieldKind.Text && f.MaxLength != 400) parts.Add($"at most {f.MaxLength} characters");
        if (f.MinItems > 0) parts.Add($"at least {f.MinItems}");
        if (f.Help is not null) parts.Add(f.Help);
        return string.Join("; ", parts);
    }

    /// <summary>The field reference of docs/scenario-format.md: one row per field, in the catalogue's order.</summary>
    public static string ReferenceTable()
    {
        var sb = new StringBuilder();
        sb.Append("| field | label | unit | required (default) | rule |\n|---|---|---|---|---|\n");
        foreach (var f in All)
            sb.Append(CultureInfo.InvariantCulture,
                $"| `{f.Path}` | {f.Label} | {UnitText(f)} | {RequiredText(f)} | " +
                $"{RuleText(f).Replace("|", "\\|")} |\n");
        return sb.ToString();
    }
}
