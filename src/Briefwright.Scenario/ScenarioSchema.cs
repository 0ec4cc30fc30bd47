using System.Text.Json;
using System.Text.Json.Nodes;
using Briefwright.Model.Uncertainty;

namespace Briefwright.Scenario;

/// <summary>
/// JSON Schema (draft 2020-12) of the scenario format, for editors' completion and checking. The tool's own
/// validation is stricter (cross-field rules, positions); this schema describes shapes, names and single-field ranges.
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

    private static JsonObject Str(string description) => Obj(("type", "string"), ("description", description));

    /// <summary>A number; rates may also be written as a percentage string such as "2%".</summary>
    private static JsonObject Num(string description, bool rate = false, double? min = null, double? max = null)
    {
        var n = Obj(("type", "number"), ("description", description));
        if (min is not null) n["minimum"] = min;
        if (max is not null) n["maximum"] = max;
        var bare = rate ? Obj(("anyOf", new JsonArray(n, Obj(("type", "string"), ("pattern", "^-?[0-9.]+(e-?[0-9]+)?\\s*%$"))))) : n;
        var wrapped = Obj(("type", "object"), ("additionalProperties", false), ("required", Arr("value")), ("properties", Obj(
            ("value", bare.DeepClone()), ("source", Str("Where the value comes from (assumptions table)")), ("note", Str("A note for the assumptions table")))));
        return Obj(("description", description), ("anyOf", new JsonArray(bare.DeepClone(), wrapped)));
    }

    private static JsonObject Section(string description, JsonObject properties, params string[] required) =>
        Obj(("type", "object"), ("description", description), ("additionalProperties", false), ("required", Arr(required)), ("properties", properties));

    public static JsonObject Build()
    {
        var parameterNames = Arr(Parameters.All.Select(p => p.Name).ToArray());
        var range = Obj(("type", "array"), ("minItems", 2), ("maxItems", 2), ("items", Obj(("type", new JsonArray("number", "string")))));
        var survival = Obj(("type", "object"), ("description", "Survival curve"), ("required", Arr("form")), ("properties", Obj(
            ("form", Obj(("enum", Arr("rectangular", "gompertz_makeham", "life_table")))),
            ("max_age", Num("Age at death (rectangular) or oldest age considered", false, 0, 150)),
            ("a", Num("Makeham term A", false, 0, 1)), ("b", Num("Gompertz level B", false, 0, 1)), ("c", Num("Gompertz growth c", false, 1, 2)),
            ("file", Str("Life table CSV: age,survivors from age 0")), ("source", Str("Source of the life table")), ("note", Str("Note")))));
        var distribution = Obj(("type", "object"), ("required", Arr("distribution")), ("properties", Obj(
            ("distribution", Obj(("enum", Arr("normal", "truncated_normal", "uniform", "triangular", "lognormal")))),
            ("mean", Num("Mean", true)), ("sd", Num("Standard deviation", true)), ("low", Num("Lower bound", true)), ("high", Num("Upper bound", true)),
            ("mode", Num("Most likely value", true)), ("median", Num("Median", true)), ("sigma_log", Num("Standard deviation of the log", false, 0, 5)))));
        var id = Obj(("type", "string"), ("pattern", "^[a-z0-9][a-z0-9_-]{0,63}$"));
        var brief = Section("Title-block facts", Obj(
            ("id", id.DeepClone()), ("title", Str("Title")), ("short_title", Str("Running header")), ("organisation", Str("Organisation")),
            ("author", Str("Author")), ("date", Obj(("type", "string"), ("format", "date"))),
            ("status", Obj(("enum", Arr("draft", "consultation", "final")))), ("edition", Num("Edition", false, 1, 9999)), ("question", Str("The policy question"))),
            "id", "title", "organisation", "date");
        var demography = Section("Stable population", Obj(
            ("population_growth", Num("Population growth rate n", true, -0.1, 0.1)), ("school_entry_age", Num("School-entry age a0", false, 0, 30)),
            ("retirement_age", Num("Retirement age R", false, 0, 150)), ("participation", Num("Labour-force participation p", true, 0, 1)), ("survival", survival)),
            "population_growth", "school_entry_age", "retirement_age", "survival");
        var bracket = Obj(("type", "object"), ("required", Arr("from", "rate")), ("properties", Obj(("from", Num("First year", false, 0, 40)), ("rate", Num("Return", true, 0, 1)))));
        var returns = Obj(("type", "object"), ("properties", Obj(
            ("form", Obj(("enum", Arr("constant", "brackets", "power")))), ("rate", Num("Return to a year of schooling", true, 0, 1)),
            ("theta", Num("Power-form scale", false, 0, 2)), ("psi", Num("Power-form curvature", false, 0, 1)),
            ("brackets", Obj(("type", "array"), ("items", bracket))), ("source", Str("Source")), ("note", Str("Note")))));
        var experience = Section("Mincer experience profile", Obj(("linear", Num("β1", false, 0, 0.5)), ("quadratic", Num("β2", false, 0, 0.05))), "linear", "quadratic");
        var humanCapital = Section("Human capital", Obj(("returns", returns), ("experience", experience)));
        var production = Section("Production", Obj(
            ("saving_rate", Num("Saving rate s", true, 0, 1)), ("capital_share", Num("Capital share α", true, 0, 1)),
            ("depreciation", Num("Depreciation δ", true, 0, 1)), ("technology_growth", Num("Technology growth g", true, -0.1, 0.1))),
            "saving_rate", "capital_share", "depreciation", "technology_growth");
        var option = Section("A policy option", Obj(
            ("id", id.DeepClone()), ("label", Str("Label")), ("schooling_years", Num("Years of schooling", false, 0, 40)),
            ("retirement_age", Num("Own retirement age", false, 0, 150)), ("participation", Num("Own participation", true, 0, 1)),
            ("baseline", Obj(("type", "boolean"))), ("source", Str("Source")), ("note", Str("Note"))), "id", "label", "schooling_years");
        var reform = Section("Reform simulation", Obj(("year", Num("Reform year", false, 1900, 2300)), ("phase_in_cohorts", Num("Cohorts to phase in", false, 1, 40)),
            ("horizon_years", Num("Years simulated", false, 20, 400)), ("headline_option", Str("Option for charts and indices"))));
        var discount = Obj(("anyOf", new JsonArray(Obj(("enum", Arr("green_book", "omb_3", "omb_7"))), Obj(("type", "object"), ("required", Arr("id", "label"))))));
        var appraisal = Section("Discounting", Obj(("discount_rates", Obj(("type", "array"), ("items", discount))),
            ("valuation_year", Num("Calendar year present values are valued at (default: the brief's year); not after the reform year", false, 1900, 2300))));
        var grid = Obj(("type", "object"), ("required", Arr("x", "x_range", "y", "y_range")), ("properties", Obj(
            ("x", Obj(("enum", parameterNames.DeepClone()))), ("x_range", range.DeepClone()), ("y", Obj(("enum", parameterNames.DeepClone()))),
            ("y_range", range.DeepClone()), ("steps", Num("Steps per axis", false, 2, 41)), ("output", Obj(("enum", Arr("optimum", "change")))))));
        var sensitivity = Section("Sensitivity", Obj(
            ("ranges", Obj(("type", "object"), ("propertyNames", Obj(("enum", parameterNames.DeepClone()))), ("additionalProperties", range.DeepClone()))),
            ("grids", Obj(("type", "array"), ("items", grid)))));
        var uncertainty = Section("Monte Carlo and Sobol", Obj(
            ("draws", Num("Accepted draws", false, 10, 200000)), ("seed", Num("Random seed", false, 0)), ("sobol_samples", Num("Sobol base samples", false, 0, 8192)),
            ("parameters", Obj(("type", "object"), ("propertyNames", Obj(("enum", parameterNames.DeepClone()))), ("additionalProperties", distribution)))),
            "seed", "parameters");
        var schema = Obj(
            ("$schema", "https://json-schema.org/draft/2020-12/schema"),
            ("title", "briefwright scenario"),
            ("type", "object"),
            ("additionalProperties", false),
            ("properties", Obj(
                ("extends", Str("Path of the scenario this one builds on, relative to this file")),
                ("brief", brief), ("demography", demography), ("human_capital", humanCapital), ("production", production),
                ("options", Obj(("type", "array"), ("minItems", 2), ("items", option))),
                ("reform", reform), ("appraisal", appraisal), ("sensitivity", sensitivity), ("uncertainty", uncertainty))),
            ("required", Arr("brief", "demography", "production", "options")));
        return schema;
    }

    public static string Text() => Build().ToJsonString(new JsonSerializerOptions { WriteIndented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }) + "\n";
}
