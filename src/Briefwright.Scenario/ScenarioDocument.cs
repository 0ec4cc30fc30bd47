using Briefwright.Model.Inputs;

namespace Briefwright.Scenario;

/// <summary>Title-block facts of a brief.</summary>
public sealed record BriefInfo(
    string Id,
    string Title,
    string ShortTitle,
    string Organisation,
    string? Author,
    DateOnly Date,
    string Status,
    int Edition,
    string? Question,
    string Language = LanguageTag.Default);

/// <summary>
/// A text written in the scenario, where it was written: the glyph check names it when no font carries a character.
/// </summary>
public sealed record TextField(string Path, Diagnostics.SourceSpan At, string Value);

/// <summary>The brief's language (<c>brief.language</c>): a tag such as en-GB, fr-FR, es-ES or de-DE.</summary>
public static class LanguageTag
{
    public const string Default = "en-GB";
    public const string Pattern = "^[a-z]{2,3}(-[A-Za-z0-9]{2,8})*$";
    public const string Description = "Language of the brief: a language tag such as en-GB (default), fr-FR, es-ES " +
        "or de-DE; the tool's texts and number and date formats follow it";

    /// <summary>Language subtags whose scripts run right to left, which the layout does not write yet.</summary>
    public static readonly IReadOnlySet<string> RightToLeft = new HashSet<string>(StringComparer.Ordinal)
    {
        "ar", "arc", "ckb", "dv", "fa", "he", "iw", "ks", "ps", "sd", "syr", "ug", "ur", "yi",
    };

    /// <summary>
    /// Whether <paramref name="c"/> belongs to a right-to-left script (Hebrew, Arabic, Syriac, Thaana, N'Ko, …).
    /// </summary>
    public static bool IsRightToLeft(int c) =>
        c is (>= 0x0590 and <= 0x08FF) or (>= 0xFB1D and <= 0xFDFF) or (>= 0xFE70 and <= 0xFEFF)
        or (>= 0x10800 and <= 0x10FFF) or (>= 0x1E800 and <= 0x1EFFF);
}

public enum ValueUnit
{
    Rate,
    Years,
    Age,
    Number,
    Text,
}

/// <summary>One row of the assumptions table: a parameter, its value, unit, source and note.</summary>
public sealed record Assumption(string Path, string Label, double? Value, string? Text, ValueUnit Unit, string? Source,
    string? Note);

/// <summary>
/// A validated scenario: brief facts, model inputs, provenance of every parameter, and the files it was read from.
/// </summary>
public sealed record ScenarioDocument(
    BriefInfo Brief,
    ModelInputs Inputs,
    IReadOnlyList<Assumption> Assumptions,
    IReadOnlyList<string> Files)
{
    /// <summary>
    /// SHA-256 over the text of every input file, in the order read (the scenario, what it extends, life tables).
    /// </summary>
    public string InputHash { get; init; } = "";

    /// <summary>Every text read from the scenario, with its position (titles, labels, names, sources, notes).</summary>
    public IReadOnlyList<TextField> Texts { get; init; } = [];

    /// <summary>
    /// What the scenario says apart from brief.date and brief.edition (<see cref="ScenarioContent"/>): a new edition
    /// starts when it changes.
    /// </summary>
    public string ContentHash { get; init; } = "";

    /// <summary>
    /// Where brief.edition is written, if it is (for a message that the edition asked for was already passed).
    /// </summary>
    public Diagnostics.SourceSpan? EditionAt { get; init; }

    /// <summary>
    /// Reform path, appraisal, sensitivity and uncertainty settings (defaults when the scenario gives none).
    /// </summary>
    public Model.Uncertainty.AnalysisSettings Analysis { get; init; } = null!;

    /// <summary>
    /// How each option reads inside a sentence, by option id ("raising compulsory schooling to 12 years").
    /// </summary>
    public IReadOnlyDictionary<string, string> OptionNames { get; init; } = new Dictionary<string, string>();

    /// <summary>
    /// How each appraisal rule reads inside a sentence, by schedule id ("the Green Book's declining discount rate").
    /// </summary>
    public IReadOnlyDictionary<string, string> RuleNames { get; init; } = new Dictionary<string, string>();

    /// <summary>
    /// The in-sentence name of option <paramref name="id"/> (its label, first letter lower-cased, when none is given).
    /// </summary>
    public string OptionName(string id) => OptionNames.TryGetValue(id, out var n)
        ? n
        : InSentence.FromLabel(Inputs.Options.First(o => o.Id == id).Label);

    /// <summary>The in-sentence name of the appraisal rule <paramref name="id"/>.</summary>
    public string RuleName(string id) =>
        RuleNames.TryGetValue(id, out var n) ? n : Analysis.Discounts.First(d => d.Id == id).Label;
}

/// <summary>Default in-sentence names for options and appraisal rules.</summary>
public static class InSentence
{
    /// <summary>
    /// A label as it reads inside a sentence: first letter lower-cased unless the first word looks like a name or an
    /// acronym.
    /// </summary>
    public static string FromLabel(string label)
    {
        if (label.Length < 2 || !char.IsUpper(label[0])) return label;
        int end = label.IndexOfAny(new[] { ' ', ',', ':', '(' });
        string first = end < 0 ? label : label[..end];
        return first.Skip(1).Any(char.IsUpper) ? label : char.ToLowerInvariant(label[0]) + label[1..];
    }

    /// <summary>The published rules by schedule id, and a description from the rates for any other.</summary>
    public static string ForRule(Model.Dynamics.DiscountSchedule schedule) => schedule.Id switch
    {
        "green-book" => "the UK Green Book's declining discount rate (3.5% at first)",
        "omb-3" => "the 3% discount rate of US OMB Circular A-4",
        "omb-7" => "the 7% discount rate of US OMB Circular A-4",
        _ when schedule.Steps.Count == 1 => $"a constant discount rate of {Percent(schedule.Steps[0].Rate)}",
        _ => $"a discount rate stepping from {Percent(schedule.Steps[0].Rate)} to {Percent(schedule.Steps[^1].Rate)}",
    };

    private static string Percent(double rate) => Numbers.Percent(rate, minDecimals: 1);
}
