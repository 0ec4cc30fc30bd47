using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using Briefwright.Model.Uncertainty;
using Briefwright.Scenario.Binding;

namespace Briefwright.Scenario;

/// <summary>
/// JSON Schema (draft 2020-12) of the scenario format, for editors' completion and checking. It states what one
/// file may hold on its own: keys (unknown keys are refused), types, single-field bounds (also for percentages written
/// as text, such as <c>2.5%</c>) and required fields. A file with <c>extends</c> is checked as a partial scenario: it
/// needs nothing its parent gives, but what it writes obeys the same rules (lists are replaced whole, so their items
/// are complete). Dates are strings written YYYY-MM-DD (a YAML 1.2 reader, as editors use, keeps them as text).
/// <c>check</c> is stricter: rules across fields and files (one baseline, increasing brackets, life tables, extends
/// chains) are beyond a schema. A test validates every demo and corpus file with a JSON Schema validator and compares
/// its verdict with <c>check</c>'s.
/// </summary>
public static class ScenarioSchema
{
    private static JsonObject Obj(params (string, JsonNode?)[] props)
    {
        var o = new JsonObject();
        foreach (var (k, v) in props) o[k] = v;
        return o;
    }

    private static JsonArray Arr(params string[] items) => new(items.Select(i => (JsonNode?)JsonValue.Create(i)).ToArray());

    private static JsonObject Str(string description, int maxLength = 400) => Obj(("type", "string"), ("maxLength", maxLength), ("description", description));

    private static string F(double x) => x.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>A bare number within <paramref name="b"/>.</summary>
    private static JsonObject Bare(Bounds b, bool integer)
    {
        var n = Obj(("type", integer ? "integer" : "number"));
        n[b.MinInclusive ? "minimum" : "exclusiveMinimum"] = b.Min;
        n[b.MaxInclusive ? "maximum" : "exclusiveMaximum"] = b.Max;
        return n;
    }

    /// <summary>
    /// A regular expression for a percentage written as text (<c>-0.4%</c>, <c>22 %</c>) whose value lies within the
    /// bounds (given as fractions; whole-number percentages at the ends, as every rate bound is).
    /// </summary>
    public static string PercentPattern(Bounds b)
    {
        int lo = (int)Math.Round(b.Min * 100), hi = (int)Math.Round(b.Max * 100);
        const string any = "(\\.[0-9]*)?", zero = "(\\.0*)?", nonZero = "\\.[0-9]*[1-9][0-9]*";
        var positive = new List<string>();
        var negative = new List<string>();
        // Whole numbers from..to, grouped by tens: 0..99 is [0-9]|1[0-9]|…|9[0-9].
        string Ints(int from, int to)
        {
            var parts = new List<string>();
            for (int tens = from / 10; tens <= to / 10; tens++)
            {
                int lo = Math.Max(from, tens * 10) % 10, hi = Math.Min(to, tens * 10 + 9) % 10;
                string prefix = tens == 0 ? "" : tens.ToString(CultureInfo.InvariantCulture);
                parts.Add(prefix + (lo == hi ? $"{lo}" : $"[{lo}-{hi}]"));
            }
            return string.Join("|", parts);
        }
        void Add(List<string> into, int from, int to, string fraction)
        {
            if (to >= from) into.Add($"0*({Ints(from, to)}){fraction}");
        }
        // Non-negative values: [max(lo, 0), hi].
        int a = Math.Max(lo, 0);
        if (lo >= 0 && !b.MinInclusive)
        {
            Add(positive, a, a, nonZero); // just above the lower end
            Add(positive, a + 1, hi - 1, any);
        }
        else Add(positive, a, hi - 1, any);
        if (b.MaxInclusive) Add(positive, hi, hi, zero);
        // Negative values: magnitudes in (0, -lo].
        if (lo < 0)
        {
            Add(negative, 0, -lo - 1, any);
            if (b.MinInclusive) Add(negative, -lo, -lo, zero);
        }
        var sb = new StringBuilder("^(");
        sb.Append(string.Join("|", positive.Select(p => $"\\+?{p}").Concat(negative.Select(n => $"-{n}"))));
        sb.Append(")\\s*%$");
        return sb.ToString();
    }

    /// <summary>A number field as the binder reads it: bare, or a rate as a percentage string, or either wrapped as
    /// <c>{ value, source, note }</c>.</summary>
    private static JsonObject Num(string description, Bounds b, bool rate = false, bool integer = false) =>
        Wrap(description, rate ? Obj(("anyOf", new JsonArray(Bare(b, integer), Obj(("type", "string"), ("pattern", PercentPattern(b)))))) : Bare(b, integer));

    /// <summary>A number, or a percentage string (sensitivity ranges and distribution parameters, whose unit is the parameter's).</summary>
    private static JsonObject AnyNum(string description, bool positive = false) =>
        Wrap(description, Obj(("anyOf", new JsonArray(Bare(positive ? Bounds.OpenClosed(0, 1000) : Bounds.Closed(-1000, 1000), false),
            Obj(("type", "string"), ("pattern", "^[-+]?[0-9]+(\\.[0-9]*)?\\s*%$"))))));

    private static JsonObject Wrap(string description, JsonObject bare)
    {
        var wrapped = Obj(("type", "object"), ("additionalProperties", false), ("required", Arr("value")), ("properties", Obj(
            ("value", bare.DeepClone()), ("source", Str("Where the value comes from (assumptions table)")), ("note", Str("A note for the assumptions table", 1000)))));
        return Obj(("description", description), ("anyOf", new JsonArray(bare, wrapped)));
    }

    private static JsonObject Section(string description, JsonObject properties, bool strict, params string[] required)
    {
        var o = Obj(("type", "object"), ("description", description), ("additionalProperties", false), ("properties", properties));
        if (strict && required.Length > 0) o["required"] = Arr(required);
        return o;
    }

    /// <summary>A mapping whose keys depend on its <c>form</c> (or <c>distribution</c>): each variant lists its own keys;
    /// a partial one (under extends, merged into the parent's) may give any variant's keys and needs none.</summary>
    private static JsonObject Variants(string description, string selector, bool strict, params (string Name, JsonObject Props, string[] Required)[] variants)
    {
        if (!strict)
        {
            var union = Obj((selector, Obj(("enum", Arr(variants.Select(v => v.Name).ToArray())))));
            foreach (var v in variants)
                foreach (var (k, n) in v.Props) union[k] ??= n!.DeepClone();
            return Obj(("type", "object"), ("description", description), ("additionalProperties", false), ("properties", union));
        }
        var all = new JsonArray();
        foreach (var v in variants)
        {
            var props = Obj((selector, Obj(("const", v.Name))));
            foreach (var (k, n) in v.Props) props[k] = n!.DeepClone();
            all.Add((JsonNode)Obj(("if", Obj(("properties", Obj((selector, Obj(("const", v.Name))))))),
                ("then", Obj(("additionalProperties", false), ("required", Arr(v.Required)), ("properties", props)))));
        }
        return Obj(("type", "object"), ("description", description), ("required", Arr(selector)),
            ("properties", Obj((selector, Obj(("enum", Arr(variants.Select(v => v.Name).ToArray())))))), ("allOf", all));
    }

    private static JsonObject Sections(bool strict)
    {
        var parameterNames = Arr(Parameters.All.Select(p => p.Name).ToArray());
        var id = Obj(("type", "string"), ("pattern", "^[a-z0-9][a-z0-9_-]{0,63}$"));
        var age = Bounds.OpenClosed(0, 150);
        var survival = Variants("Survival curve", "form", strict,
            ("rectangular", Obj(("max_age", Num("Age at death (everyone)", age))), ["max_age"]),
            ("gompertz_makeham", Obj(("a", Num("Makeham term A", Bounds.ClosedOpen(0, 1))), ("b", Num("Gompertz level B", Bounds.Open(0, 1))),
                ("c", Num("Gompertz growth c", Bounds.Open(1, 2))), ("max_age", Num("Oldest age considered (default 120)", age))), ["a", "b", "c"]),
            ("life_table", Obj(("file", Str("Life table CSV: age,survivors from age 0, relative to this file")), ("source", Str("Source of the life table")),
                ("note", Str("Note", 1000))), ["file"]));
        var brief = Section("Title-block facts", Obj(
            ("id", id.DeepClone()), ("title", Str("Title", 200)), ("short_title", Str("Running header", 80)), ("organisation", Str("Organisation", 200)),
            ("author", Str("Author", 200)), ("date", Obj(("type", "string"), ("pattern", "^[0-9]{4}-[0-9]{2}-[0-9]{2}$"), ("format", "date"), ("description", "Date of the brief, YYYY-MM-DD"))),
            ("status", Obj(("enum", Arr("draft", "consultation", "final")))), ("edition", Num("Edition", Bounds.Closed(1, 9999), integer: true)),
            ("question", Str("The policy question", 2000)),
            ("language", Obj(("type", "string"), ("pattern", LanguageTag.Pattern), ("description", LanguageTag.Description)))), strict, "id", "title", "organisation", "date");
        var demography = Section("Stable population", Obj(
            ("population_growth", Num("Population growth rate n", Bounds.Closed(-0.1, 0.1), rate: true)), ("school_entry_age", Num("School-entry age a0", Bounds.Closed(0, 30))),
            ("retirement_age", Num("Retirement age R", age)), ("participation", Num("Labour-force participation p (default 100%)", Bounds.OpenClosed(0, 1), rate: true)),
            ("survival", survival)), strict, "population_growth", "school_entry_age", "retirement_age", "survival");
        var bracket = Section("A bracket of returns", Obj(("from", Num("First year of the bracket", Bounds.Closed(0, 40))), ("rate", Num("Return", Bounds.ClosedOpen(0, 1), rate: true))),
            true, "from", "rate");
        var returns = Variants("Returns to schooling", "form", strict,
            ("constant", Obj(("rate", Num("Return to a year of schooling", Bounds.Open(0, 1), rate: true))), ["rate"]),
            ("power", Obj(("theta", Num("Power-form scale θ", Bounds.Open(0, 2))), ("psi", Num("Power-form curvature ψ", Bounds.ClosedOpen(0, 1)))), ["theta", "psi"]),
            ("brackets", Obj(("brackets", Obj(("type", "array"), ("minItems", 1), ("items", bracket))), ("source", Str("Source")), ("note", Str("Note", 1000))), []));
        var experience = Section("Mincer experience profile", Obj(("linear", Num("β1", Bounds.Closed(0, 0.5))), ("quadratic", Num("β2", Bounds.OpenClosed(0, 0.05)))),
            strict, "linear", "quadratic");
        var humanCapital = Section("Human capital", Obj(("returns", returns), ("experience", experience)), strict);
        var production = Section("Production", Obj(
            ("saving_rate", Num("Saving rate s", Binding.ParameterBounds.SavingRate, rate: true)), ("capital_share", Num("Capital share α", Binding.ParameterBounds.CapitalShare, rate: true)),
            ("depreciation", Num("Depreciation δ", Bounds.ClosedOpen(0, 1), rate: true)), ("technology_growth", Num("Technology growth g", Bounds.Closed(-0.1, 0.1), rate: true))),
            strict, "saving_rate", "capital_share", "depreciation", "technology_growth");
        var option = Section("A policy option", Obj(
            ("id", id.DeepClone()), ("label", Str("Label", 120)), ("in_sentence", Str("How the option reads inside a sentence (default: the label, first letter lower-cased)", 120)), ("schooling_years", Num("Years of schooling", Bounds.Closed(0, 40))),
            ("retirement_age", Num("Own retirement age", age)), ("participation", Num("Own participation", Bounds.OpenClosed(0, 1), rate: true)),
            ("baseline", Obj(("type", "boolean"))), ("source", Str("Source")), ("note", Str("Note", 1000))), true, "id", "label", "schooling_years");
        var reform = Section("Reform simulation", Obj(("year", Num("Reform year", Bounds.Closed(1900, 2300), integer: true)),
            ("phase_in_cohorts", Num("Cohorts to phase in", Bounds.Closed(1, 40), integer: true)),
            ("horizon_years", Num("Years simulated", Bounds.Closed(20, AnalysisBinder.MaxHorizon), integer: true)), ("headline_option", Str("Option for charts and indices"))), strict);
        var rate = Bounds.Closed(-0.05, 0.5);
        var step = Section("A step of a declining schedule", Obj(("from_year", Num("First year of the step", Bounds.Closed(1, 10_000))), ("rate", Num("Rate", rate, rate: true))),
            true, "from_year", "rate");
        var customRate = Obj(("type", "object"), ("additionalProperties", false), ("required", Arr("id", "label")),
            ("anyOf", new JsonArray(Obj(("required", Arr("rate"))), Obj(("required", Arr("schedule"))))), ("properties", Obj(
                ("id", Str("Id")), ("label", Str("Label", 120)), ("in_sentence", Str("How the rule reads inside a sentence (default: described from its rates)", 120)), ("rate", Num("Constant rate", rate, rate: true)),
                ("schedule", Obj(("type", "array"), ("minItems", 1), ("items", step))), ("source", Str("Source")))));
        var discount = Obj(("anyOf", new JsonArray(Obj(("enum", Arr("green_book", "omb_3", "omb_7"))), customRate)));
        var appraisal = Section("Discounting", Obj(("discount_rates", Obj(("type", "array"), ("minItems", 1), ("items", discount))),
            ("valuation_year", Num("Calendar year present values are valued at (default: the brief's year); not after the reform year",
                Bounds.Closed(1900, 2300), integer: true))), strict);
        var range = Obj(("type", "array"), ("minItems", 2), ("maxItems", 2), ("items", AnyNum("End of the range")));
        var grid = Section("A two-way grid", Obj(
            ("x", Obj(("enum", parameterNames.DeepClone()))), ("x_range", range.DeepClone()), ("y", Obj(("enum", parameterNames.DeepClone()))),
            ("y_range", range.DeepClone()), ("steps", Num("Steps per axis (default 9)", Bounds.Closed(2, 41))), ("output", Obj(("enum", Arr("optimum", "change"))))),
            true, "x", "x_range", "y", "y_range");
        var sensitivity = Section("Sensitivity", Obj(
            ("ranges", Obj(("type", "object"), ("propertyNames", Obj(("enum", parameterNames.DeepClone()))), ("additionalProperties", range.DeepClone()))),
            ("grids", Obj(("type", "array"), ("items", grid)))), strict);
        var distribution = Variants("A parameter's distribution", "distribution", strict,
            ("normal", Obj(("mean", AnyNum("Mean")), ("sd", AnyNum("Standard deviation", positive: true))), ["mean", "sd"]),
            ("truncated_normal", Obj(("mean", AnyNum("Mean")), ("sd", AnyNum("Standard deviation", positive: true)), ("low", AnyNum("Lower bound")), ("high", AnyNum("Upper bound"))),
                ["mean", "sd", "low", "high"]),
            ("uniform", Obj(("low", AnyNum("Lower bound")), ("high", AnyNum("Upper bound"))), ["low", "high"]),
            ("triangular", Obj(("low", AnyNum("Lower bound")), ("mode", AnyNum("Most likely value")), ("high", AnyNum("Upper bound"))), ["low", "mode", "high"]),
            ("lognormal", Obj(("median", AnyNum("Median", positive: true)), ("sigma_log", Num("Standard deviation of the log", Bounds.OpenClosed(0, 5)))), ["median", "sigma_log"]));
        var uncertainty = Section("Monte Carlo and Sobol", Obj(
            ("draws", Num("Accepted draws (default 2000)", Bounds.Closed(10, AnalysisBinder.MaxDraws))), ("seed", Num("Random seed", Bounds.Closed(0, 9_007_199_254_740_991))),
            ("sobol_samples", Num("Sobol base samples (default 2,560)", Bounds.Closed(0, AnalysisBinder.MaxSobolSamples))),
            ("parameters", Obj(("type", "object"), ("minProperties", 1), ("propertyNames", Obj(("enum", parameterNames.DeepClone()))), ("additionalProperties", distribution)))),
            strict, "seed", "parameters");
        var scenario = Obj(
            ("type", "object"),
            ("additionalProperties", false),
            ("properties", Obj(
                ("extends", Obj(("type", "string"), ("minLength", 1), ("description", "Path of the scenario this one builds on, relative to this file"))),
                ("brief", brief), ("demography", demography), ("human_capital", humanCapital), ("production", production),
                ("options", Obj(("type", "array"), ("minItems", 2), ("items", option))),
                ("reform", reform), ("appraisal", appraisal), ("sensitivity", sensitivity), ("uncertainty", uncertainty))));
        if (strict) scenario["required"] = Arr("brief", "demography", "production", "options");
        return scenario;
    }

    public static JsonObject Build() => Obj(
        ("$schema", "https://json-schema.org/draft/2020-12/schema"),
        ("title", "briefwright scenario"),
        ("description", "A complete scenario; a file with 'extends' is a partial one, completed by the scenario it names."),
        ("$defs", Obj(("complete", Sections(strict: true)), ("partial", Sections(strict: false)))),
        ("if", Obj(("type", "object"), ("required", Arr("extends")))),
        ("then", Obj(("$ref", "#/$defs/partial"))),
        ("else", Obj(("$ref", "#/$defs/complete"))));

    public static string Text() => Build().ToJsonString(new JsonSerializerOptions { WriteIndented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }) + "\n";
}
