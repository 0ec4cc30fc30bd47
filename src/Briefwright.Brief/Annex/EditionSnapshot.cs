using System.Text.Json;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Brief.Annex;

/// <summary>A row of a comparison: what changed, from what to what.</summary>
public sealed record ChangedValue(string Key, string Label, string Old, string New, string? Detail);

/// <summary>What changed between two editions (or two scenarios): assumptions and headline results.</summary>
public sealed record EditionChanges(int PreviousEdition, string PreviousDate, IReadOnlyList<ChangedValue> Assumptions,
    IReadOnlyList<ChangedValue> Results)
{
    /// <summary>
    /// Why this is a new edition beyond the rows above, by input name (<c>EditionInput</c>): <c>content</c>,
    /// <c>template</c>, <c>brief.edition</c>, <c>results</c>... Set by the build; empty from <c>diff</c>.
    /// </summary>
    public IReadOnlyList<string> Causes { get; init; } = [];

    /// <summary>The edition this one is (for the words on <c>brief.edition</c>).</summary>
    public int Edition { get; init; }

    public bool Any => Assumptions.Count > 0 || Results.Count > 0;
}

/// <summary>
/// The comparable content of one edition, read from its results JSON (so a previous edition can be compared
/// after the tool or template changed): assumptions as displayed, and headline numbers.
/// </summary>
public sealed record EditionSnapshot(
    int Edition,
    string Date,
    IReadOnlyDictionary<string, (string Label, string Value, string? Source)> Assumptions,
    IReadOnlyDictionary<string, (string Label, double Value, string Unit)> Results)
{
    /// <summary>The snapshot of a results file, its assumptions' values written in <paramref name="language"/> (English
    /// when null).</summary>
    public static EditionSnapshot FromJson(string json, BriefLanguage? language = null)
    {
        var words = new TemplateFunctions(language ?? BriefLanguage.English);
        using var doc = JsonDocument.Parse(json);
        var root = doc.RootElement;
        var assumptions = new Dictionary<string, (string, string, string?)>(StringComparer.Ordinal);
        if (root.TryGetProperty("assumptions", out var list))
            foreach (var a in list.EnumerateArray())
            {
                string unit = a.GetProperty("unit").GetString()!;
                string value = a.GetProperty("text").ValueKind == JsonValueKind.String
                    ? a.GetProperty("text").GetString()!
                    : Display(words, a.GetProperty("value").GetDouble(), unit);
                string? source = a.GetProperty("source").ValueKind == JsonValueKind.String
                    ? a.GetProperty("source").GetString()
                    : null;
                assumptions[a.GetProperty("path").GetString()!] = (a.GetProperty("label").GetString()!, value, source);
            }
        var results = new Dictionary<string, (string, double, string)>(StringComparer.Ordinal);
        foreach (var o in root.GetProperty("options").EnumerateArray())
        {
            string id = o.GetProperty("id").GetString()!, label = o.GetProperty("label").GetString()!;
            results[$"output_per_person.{id}"] =
                ($"Output per person: {label}", o.GetProperty("output_per_person").GetDouble(), "index");
            if (!o.GetProperty("is_baseline").GetBoolean())
                results[$"change.{id}"] =
                    ($"Long-run change: {label}", o.GetProperty("change_vs_baseline_pct").GetDouble(), "%");
        }
        results["optimum"] = ("Output-maximising schooling E*",
            root.GetProperty("optimum").GetProperty("schooling_years").GetDouble(), "years");
        if (root.TryGetProperty("analysis", out var analysis))
        {
            var reform = analysis.GetProperty("reform");
            results["discounted_optimum"] = ("Discounted optimum",
                reform.GetProperty("optimum").GetProperty("schooling_years").GetDouble(), "years");
            foreach (var o in reform.GetProperty("options").EnumerateArray())
            {
                var pv = o.GetProperty("present_values")[0];
                string? option = o.GetProperty("option_id").GetString();
                results[$"pv.{option}"] = ($"Present value ({pv.GetProperty("schedule_id").GetString()}): {option}",
                    pv.GetProperty("to_horizon").GetDouble(), "years of output");
            }
        }
        return new EditionSnapshot(root.GetProperty("edition").GetInt32(), root.GetProperty("date").GetString()!,
            assumptions, results);
    }

    private static string Display(TemplateFunctions words, double v, string unit) => unit switch
    {
        "rate" => words.Pct(v, 2),
        "years" or "age" => words.Num(v, v == Math.Floor(v) ? 0 : 1),
        _ => words.Sig(v, 4),
    };

    /// <summary>Changed, added and removed assumptions; headline results that moved by more than rounding, written in
    /// <paramref name="language"/> (English when null).</summary>
    public static EditionChanges Compare(EditionSnapshot old, EditionSnapshot now, BriefLanguage? language = null)
    {
        var words = new TemplateFunctions(language ?? BriefLanguage.English);
        var assumptions = new List<ChangedValue>();
        foreach (var (path, n) in now.Assumptions)
        {
            if (!old.Assumptions.TryGetValue(path, out var o))
                assumptions.Add(new ChangedValue(path, n.Label, "not set", n.Value, n.Source));
            else if (o.Value != n.Value || o.Source != n.Source)
                assumptions.Add(new ChangedValue(path, n.Label, o.Value, n.Value, n.Source));
        }
        foreach (var (path, o) in old.Assumptions)
            if (!now.Assumptions.ContainsKey(path))
                assumptions.Add(new ChangedValue(path, o.Label, o.Value, "removed", null));
        var results = new List<ChangedValue>();
        foreach (var (key, n) in now.Results)
        {
            if (!old.Results.TryGetValue(key, out var o)) continue;
            double diff = n.Value - o.Value;
            if (Math.Abs(diff) < 5e-4 * Math.Max(1, Math.Abs(o.Value))) continue;
            string F(double v) => n.Unit == "%" ? words.Change(v, 2) : words.Num(v, 2);
            results.Add(new ChangedValue(key, n.Label, F(o.Value), F(n.Value),
                (diff >= 0 ? "+" : "−") + words.Num(Math.Abs(diff), 2) + (n.Unit == "%" ? " points" : "")));
        }
        return new EditionChanges(old.Edition, old.Date, assumptions, results);
    }
}
