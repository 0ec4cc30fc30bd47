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

    private static JsonArray Arr(params string[] items) =>
        new(items.Select(i => (JsonNode?)JsonValue.Create(i)).ToArray());

    private static JsonObject Str(string description, int maxLength = 400) =>
        Obj(("type", "string"), ("maxLength", maxLength), ("description", description));

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
        Wrap(description, rate
            ? Obj(("anyOf", new JsonArray(Bare(b, integer), Obj(("type", "string"), ("pattern", PercentPattern(b))))))
            : Bare(b, integer));

    /// <summary>A number, or a percentage string, in a parameter's unit (range ends and distribution parameters): the
    /// schema cannot tell which parameter, so only the field's own wide bounds apply.</summary>
    private static JsonObject AnyNum(string description, Bounds b) =>
        Wrap(description, Obj(("anyOf", new JsonArray(Bare(b, false),
            Obj(("type", "string"), ("pattern", "^[-+]?[0-9]+(\\.[0-9]*)?\\s*%$"))))));

    private static JsonObject Wrap(string description, JsonObject bare)
    {
        var wrapped = Obj(("type", "object"), ("additionalProperties", false), ("required", Arr("value")),
            ("properties", Obj(("value", bare.DeepClone()),
                ("source", Str("Where the value comes from (assumptions table)")),
                ("note", Str("A note for the assumptions table", 1000)))));
        return Obj(("description", description), ("anyOf", new JsonArray(bare, wrapped)));
    }

    private static JsonObject Section(string description, JsonObject properties, bool strict, params string[] required)
    {
        var o = Obj(("type", "object"), ("description", description), ("additionalProperties", false),
            ("properties", properties));
        if (strict && required.Length > 0) o["required"] = Arr(required);
        return o;
    }

    /// <summary>A mapping whose keys depend on its <c>form</c> (or <c>distribution</c>): each variant lists its own
    /// keys; a partial one (under extends, merged into the parent's) may give any variant's keys and needs
    /// none.</summary>
    private static JsonObject Variants(string description, string selector, bool strict,
        params (string Name, JsonObject Props, string[] Required)[] variants)
    {
        if (!strict)
        {
            var union = Obj((selector, Obj(("enum", Arr(variants.Select(v => v.Name).ToArray())))));
            foreach (var v in variants)
                foreach (var (k, n) in v.Props) union[k] ??= n!.DeepClone();
            return Obj(("type", "object"), ("description", description), ("additionalProperties", false),
                ("properties", union));
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
            ("properties", Obj((selector, Obj(("enum", Arr(variants.Select(v => v.Name).ToArray())))))),
            ("allOf", all));
    }

    private static string Describe(ScenarioField f)
    {
        string text = ScenarioFields.DefaultOf(f) is { } d ? $"{f.Label} (default {d})" : f.Label;
        return f.Help is null ? text : $"{text}: {f.Help.Replace("`", "")}";
    }

    private static JsonObject Properties(string path, string? variant, bool strict, string? skip = null)
    {
        var props = new JsonObject();
        foreach (var f in ScenarioFields.Children(path, variant))
            if (f.Key != skip) props[f.Key] ??= Node(f, strict);
        return props;
    }

    private static string[] Required(string path, string? variant = null, string? skip = null) =>
        ScenarioFields.Children(path, variant).Where(f => f.Required && f.Key != skip)
            .Select(f => f.Key).Distinct().ToArray();

    private static JsonObject Array(ScenarioField f, JsonObject items)
    {
        var a = Obj(("type", "array"), ("description", Describe(f)));
        if (f.MinItems > 0) a["minItems"] = f.MinItems;
        a["items"] = items;
        return a;
    }

    /// <summary>
    /// The schema of one field of the catalogue; list items are always complete (lists are replaced whole).
    /// </summary>
    private static JsonObject Node(ScenarioField f, bool strict)
    {
        var parameterNames = Arr(Parameters.All.Select(p => p.Name).ToArray());
        string description = Describe(f);
        switch (f.Kind)
        {
            case FieldKind.Section:
                return Section(description, Properties(f.Path, null, strict), strict, Required(f.Path));
            case FieldKind.Variants:
            {
                string selector = f.Selector!;
                var variants = ScenarioFields.Get(f.Path + "." + selector).Choices
                    .Select(v => (v, Properties(f.Path, v, strict, selector), Required(f.Path, v, selector))).ToArray();
                return Variants(description, selector, strict, variants);
            }
            case FieldKind.List:
                return Array(f, Node(ScenarioFields.Get(f.Path + "[]"), strict: true));
            case FieldKind.ParameterMap:
            {
                var map = Obj(("type", "object"), ("description", description));
                if (f.MinItems > 0) map["minProperties"] = f.MinItems;
                map["propertyNames"] = Obj(("enum", parameterNames));
                map["additionalProperties"] = Node(ScenarioFields.Get(f.Path + ".*"), strict);
                return map;
            }
            case FieldKind.NameOrSection:
                return NameOrSection(f, description);
            case FieldKind.Text when f.Pattern is { } pattern:
                return Obj(("type", "string"), ("maxLength", f.MaxLength), ("pattern", pattern),
                    ("description", description));
            case FieldKind.Text:
                return Str(description, f.MaxLength);
            case FieldKind.Path:
                return Obj(("type", "string"), ("minLength", 1), ("description", description));
            case FieldKind.Id:
                return Obj(("type", "string"), ("pattern", "^[a-z0-9][a-z0-9_-]{0,63}$"), ("description", description));
            case FieldKind.Date:
                return Obj(("type", "string"), ("pattern", "^[0-9]{4}-[0-9]{2}-[0-9]{2}$"), ("format", "date"),
                    ("description", description));
            case FieldKind.Choice:
                return Obj(("enum", Arr(f.Choices)), ("description", description));
            case FieldKind.Flag:
                return Obj(("type", "boolean"), ("description", description));
            case FieldKind.Number:
                return Num(description, f.Bounds, rate: f.Unit == ValueUnit.Rate, integer: f.Whole);
            case FieldKind.ParameterName:
                return Obj(("enum", parameterNames), ("description", description));
            case FieldKind.ParameterValue:
                return AnyNum(description, f.Bounds);
            case FieldKind.Range:
                return Obj(("type", "array"), ("description", description), ("minItems", 2), ("maxItems", 2),
                    ("items", AnyNum("End of the range", f.Bounds)));
            default:
                throw new InvalidOperationException($"no schema for {f.Kind}");
        }
    }

    /// <summary>A published name from the field's choices, or a complete mapping of one's own.</summary>
    private static JsonObject NameOrSection(ScenarioField f, string description)
    {
        var own = Obj(("type", "object"), ("additionalProperties", false), ("required", Arr(Required(f.Path))));
        if (f.Alternatives.Length > 0)
            own["anyOf"] = new JsonArray(f.Alternatives.Select(k => (JsonNode?)Obj(("required", Arr(k)))).ToArray());
        own["properties"] = Properties(f.Path, null, strict: true);
        return Obj(("description", description), ("anyOf", new JsonArray(Obj(("enum", Arr(f.Choices))), own)));
    }

    private static JsonObject Sections(bool strict)
    {
        var scenario = Obj(("type", "object"), ("additionalProperties", false),
            ("properties", Properties("", null, strict)));
        if (strict) scenario["required"] = Arr(Required(""));
        return scenario;
    }

    public static JsonObject Build() => Obj(
        ("$schema", "https://json-schema.org/draft/2020-12/schema"),
        ("title", "briefwright scenario"),
        ("description",
            "A complete scenario; a file with 'extends' is a partial one, completed by the scenario it names."),
        ("$defs", Obj(("complete", Sections(strict: true)), ("partial", Sections(strict: false)))),
        ("if", Obj(("type", "object"), ("required", Arr("extends")))),
        ("then", Obj(("$ref", "#/$defs/partial"))),
        ("else", Obj(("$ref", "#/$defs/complete"))));

    public static string Text() => Build().ToJsonString(new JsonSerializerOptions
    {
        WriteIndented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    }) + "\n";
}
