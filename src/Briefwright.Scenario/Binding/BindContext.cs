using System.Globalization;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario.Binding;

/// <summary>
/// Reads typed values out of the YAML tree, collecting every problem instead of stopping at the first.
/// A parameter may be written bare (<c>0.02</c>, <c>2%</c>) or as <c>{ value, source, note }</c>; the latter's
/// provenance goes into the assumptions table.
/// </summary>
public sealed class BindContext
{
    private const int MaxNumberLength = 32;
    private readonly List<Diagnostic> problems = new();
    private readonly List<Assumption> assumptions = new();
    private readonly List<TextField> texts = new();

    public IReadOnlyList<Diagnostic> Problems => problems;
    public IReadOnlyList<Assumption> Assumptions => assumptions;
    public IReadOnlyList<TextField> Texts => texts;

    public void Report(SourceSpan at, string path, string rule, string? got) =>
        problems.Add(new Diagnostic(at, path, rule, got));

    public void Add(Assumption assumption) => assumptions.Add(assumption);

    public static string Join(string path, string key) => path.Length == 0 ? key : $"{path}.{key}";

    public static string Show(YNode node) => node switch
    {
        YScalar s when s.IsNull => "nothing",
        YScalar s => s.Value.Length > 40 ? $"'{Printable(s.Value[..40])}…'" : $"'{Printable(s.Value)}'",
        _ => node.Kind,
    };

    /// <summary>Text as a message quotes it: at most 80 characters, control characters written as escapes.</summary>
    public static string Quote(string value) =>
        value.Length > 80 ? $"'{Printable(value[..80])}…'" : $"'{Printable(value)}'";

    /// <summary>Control characters (a newline in an id, say) as escapes, so a message stays on one line.</summary>
    public static string Printable(string value)
    {
        if (!value.Any(char.IsControl)) return value;
        var sb = new System.Text.StringBuilder(value.Length + 8);
        foreach (char c in value)
            sb.Append(c switch
            {
                '\n' => "\\n",
                '\r' => "\\r",
                '\t' => "\\t",
                _ when char.IsControl(c) => $"\\u{(int)c:X4}",
                _ => c.ToString(),
            });
        return sb.ToString();
    }

    /// <summary>
    /// Reports every key not in <paramref name="known"/>, with the closest known key as a suggestion.
    /// </summary>
    public void CheckKeys(YMapping map, string path, params string[] known)
    {
        foreach (var (key, _) in map.Entries)
        {
            if (known.Contains(key.Value)) continue;
            string? guess = Suggestions.Closest(key.Value, known);
            string rule = guess is null
                ? $"unknown key (expected one of: {string.Join(", ", known)})"
                : $"unknown key (did you mean '{guess}'?)";
            Report(key.At, Join(path, key.Value), rule, $"'{key.Value}'");
        }
    }

    /// <summary>
    /// Reports every key that <paramref name="field"/>'s mapping (of <paramref name="variant"/>) may not hold.
    /// </summary>
    public void CheckFields(YMapping map, string path, ScenarioField field, string? variant = null) =>
        CheckKeys(map, path, ScenarioFields.Keys(field.Path, variant));

    public YMapping? Mapping(YMapping parent, ScenarioField field, string path) =>
        Mapping(parent, field.Key, path, field.Required);

    public YSequence? Sequence(YMapping parent, ScenarioField field, string path, bool? required = null) =>
        Sequence(parent, field.Key, path, required ?? field.Required);

    public string? Text(YMapping parent, ScenarioField field, string path) =>
        Text(parent, field.Key, path, field.Required, field.MaxLength);

    public string? Choice(YMapping parent, ScenarioField field, string path) =>
        Choice(parent, field.Key, path, field.Required, field.Choices);

    public bool? Flag(YMapping parent, ScenarioField field, string path) => Flag(parent, field.Key, path);

    /// <summary>
    /// <paramref name="field"/>'s number with its unit, bounds, default and (when the field has one) assumptions row;
    /// <paramref name="fallback"/> replaces a default that depends on other fields, <paramref name="unit"/> and
    /// <paramref name="bounds"/> the field's own for a value in a parameter's unit.
    /// </summary>
    public double? Number(YMapping parent, ScenarioField field, string path, double? fallback = null,
        string? fallbackSource = null, ValueUnit? unit = null, Bounds? bounds = null) =>
        Number(parent, field.Key, path, unit ?? field.Unit, bounds ?? field.Bounds,
            field.Assumption ? field.Label : null, fallback ?? field.Default, fallbackSource);

    public YMapping? Mapping(YMapping parent, string key, string path, bool required)
    {
        var node = parent[key];
        string p = Join(path, key);
        if (node is null || node is YScalar { IsNull: true })
        {
            if (required) Report(node?.At ?? parent.At, p, "required section is missing", null);
            return null;
        }
        if (node is YMapping m) return m;
        Report(node.At, p, "must be a mapping of keys to values", node.Kind);
        return null;
    }

    public YSequence? Sequence(YMapping parent, string key, string path, bool required)
    {
        var node = parent[key];
        string p = Join(path, key);
        if (node is null || node is YScalar { IsNull: true })
        {
            if (required) Report(node?.At ?? parent.At, p, "required list is missing", null);
            return null;
        }
        if (node is YSequence s) return s;
        Report(node.At, p, "must be a list", node.Kind);
        return null;
    }

    public string? Text(YMapping parent, string key, string path, bool required, int maxLength = 400)
    {
        var node = parent[key];
        string p = Join(path, key);
        if (node is null || node is YScalar { IsNull: true })
        {
            if (required) Report(node?.At ?? parent.At, p, "required field is missing", null);
            return null;
        }
        if (node is not YScalar s)
        {
            Report(node.At, p, "must be text", node.Kind);
            return null;
        }
        if (s.Value.Length > maxLength)
        {
            Report(s.At, p, $"must be at most {maxLength} characters", $"{s.Value.Length} characters");
            return null;
        }
        if (RightToLeftAt(s.Value) is int rtl)
        {
            int character = s.Value.IndexOf(char.ConvertFromUtf32(rtl), StringComparison.Ordinal) + 1;
            Report(s.At, p,
                "uses a right-to-left script, which briefs cannot be written in yet (the layout writes left to " +
                "right only)", $"{Quote(s.Value)} (U+{rtl:X4} at character {character})");
            return null;
        }
        texts.Add(new TextField(p, s.At, s.Value));
        return s.Value;
    }

    private static int? RightToLeftAt(string value)
    {
        foreach (var rune in value.EnumerateRunes())
            if (LanguageTag.IsRightToLeft(rune.Value)) return rune.Value;
        return null;
    }

    public string? Choice(YMapping parent, string key, string path, bool required, params string[] allowed)
    {
        string? value = Text(parent, key, path, required);
        if (value is null || allowed.Contains(value)) return value;
        string? guess = Suggestions.Closest(value, allowed);
        string rule = $"must be one of {string.Join(", ", allowed)}"
            + (guess is null ? "" : $" (did you mean '{guess}'?)");
        Report(parent[key]!.At, Join(path, key), rule, $"'{value}'");
        return null;
    }

    public bool? Flag(YMapping parent, string key, string path)
    {
        if (parent[key] is not YScalar s || s.IsNull) return null;
        if (s.Value is "true" or "True" or "yes") return true;
        if (s.Value is "false" or "False" or "no") return false;
        Report(s.At, Join(path, key), "must be true or false", Show(s));
        return null;
    }

    /// <summary>
    /// A number in <paramref name="bounds"/>. Rates accept a percent sign (2% = 0.02). Adds an assumptions row
    /// when <paramref name="label"/> is given.
    /// </summary>
    public double? Number(YMapping parent, string key, string path, ValueUnit unit, Bounds bounds, string? label = null,
        double? fallback = null, string? fallbackSource = null)
    {
        var node = parent[key];
        string p = Join(path, key);
        string? source = null, note = null;
        if (node is YMapping wrapped)
        {
            CheckKeys(wrapped, p, "value", "source", "note");
            source = Text(wrapped, "source", p, required: false);
            note = Text(wrapped, "note", p, required: false, maxLength: 1000);
            node = wrapped["value"];
            p = Join(p, "value");
            if (node is null)
            {
                Report(wrapped.At, p, "required field is missing", null);
                return null;
            }
        }
        if (node is null || node is YScalar { IsNull: true })
        {
            if (fallback is null)
            {
                Report(node?.At ?? parent.At, p, "required field is missing", null);
                return null;
            }
            if (label is not null)
                assumptions.Add(new Assumption(Join(path, key), label, fallback, null, unit,
                    fallbackSource ?? "default", null));
            return fallback;
        }
        if (node is not YScalar s)
        {
            Report(node.At, p, "must be a number", node.Kind);
            return null;
        }
        double? value = ParseNumber(s, p, unit);
        if (value is not { } v) return null;
        if (!bounds.Contains(v))
        {
            Report(s.At, p, bounds.Rule(unit == ValueUnit.Rate && s.Value.TrimEnd().EndsWith('%')), Show(s));
            return null;
        }
        if (label is not null) assumptions.Add(new Assumption(Join(path, key), label, v, null, unit, source, note));
        return v;
    }

    private double? ParseNumber(YScalar s, string path, ValueUnit unit)
    {
        string text = s.Value.Trim();
        if (text.Length > MaxNumberLength)
        {
            Report(s.At, path, $"must be a number of at most {MaxNumberLength} characters",
                $"{text.Length} characters");
            return null;
        }
        bool percent = text.EndsWith('%');
        if (percent)
        {
            if (unit != ValueUnit.Rate)
            {
                Report(s.At, path, "must be a plain number; a percent sign is only allowed for rates", Show(s));
                return null;
            }
            text = text[..^1].TrimEnd();
        }
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || s.Quoted)
        {
            Report(s.At, path, unit == ValueUnit.Rate ? "must be a number or a percentage" : "must be a number",
                Show(s));
            return null;
        }
        if (!double.IsFinite(v))
        {
            Report(s.At, path, "must be a finite number", Show(s));
            return null;
        }
        return percent ? FromPercent(text, v) : v;
    }

    /// <summary>
    /// A percentage as the double nearest to its decimal value over 100 ("0.9" → 0.009, not 0.9/100.0 =
    /// 0.009000000000000001): the decimal point is moved in decimal arithmetic and the result parsed once.
    /// </summary>
    private static double FromPercent(string text, double parsed) =>
        decimal.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out decimal d)
            && (d != 0 || parsed == 0)
            ? double.Parse((d / 100m).ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture)
            : parsed / 100.0;
}
