using System.Text;
using Briefwright.Charts;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Scenario;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Templating;

namespace Briefwright.Brief;

/// <summary>
/// Text the brief cannot show as written: a character no configured font carries, or a language the tool has no
/// texts for. Each message is positioned (<c>file:line:col: …</c>) at the scenario field, template line or language
/// text it came from. The command line reports it as an input error (exit 2).
/// </summary>
public sealed class BriefTextException(IReadOnlyList<string> errors) : Exception(string.Join("\n", errors))
{
    public IReadOnlyList<string> Errors { get; } = errors;
}

/// <summary>
/// Before anything is drawn: every character of the scenario's texts, the template and the brief language's texts
/// must be in every face of the brief's font (the body, headings and charts use the same family), so that nothing
/// is dropped silently from a page or a chart.
/// </summary>
public static class GlyphCheck
{
    private static readonly HashSet<(string Template, string Language, byte[]? Font)> Passed = new();

    /// <summary>Problems shown at most; the count of the rest follows.</summary>
    public const int MaxReported = 20;

    /// <summary>The language the scenario asks for, or a positioned error when the tool has no texts for it.</summary>
    public static BriefLanguage LanguageOf(ScenarioDocument scenario)
    {
        string tag = scenario.Brief.Language;
        if (BriefLanguage.ForTag(tag) is { } language) return language;
        var at = scenario.Texts.FirstOrDefault(t => t.Path == "brief.language")?.At
            ?? new SourceSpan(scenario.Files.FirstOrDefault() ?? "scenario", 1, 1);
        var d = new Diagnostic(at, "brief.language",
            "must be a language the tool has texts for " +
            $"({string.Join(", ", BriefLanguage.BuiltIn.Keys.Order(StringComparer.Ordinal))}); a language is added " +
            "with one file, templates/languages/<code>.texts (see docs/templates.md)",
            $"'{tag}'");
        throw new BriefTextException([d.Message]);
    }

    /// <summary>Throws <see cref="BriefTextException"/> naming every text with a character the fonts lack.</summary>
    public static void Check(ScenarioDocument scenario, BriefTemplate template, BriefLanguage language,
        (byte[] Regular, byte[] Bold, byte[] Italic, byte[] BoldItalic)? fonts)
    {
        var sets = Faces(fonts).Select(x => (x.Item1, Set: FontSubsetter.Characters(x.Item2)))
            .Where(x => x.Set is not null).ToList();
        if (sets.Count == 0) return; // the font library is unavailable: nothing to check against
        string fontName = fonts is null ? "the bundled font (Liberation Sans)" : "the theme's fonts";
        var problems = new List<string>();

        string? Missing(string text, out int index)
        {
            index = 0;
            foreach (var rune in text.EnumerateRunes())
            {
                int c = rune.Value;
                if (c >= 0x20 && c != 0x7F && !(c is >= 0x80 and < 0xA0))
                {
                    var lacking = sets.Where(s => !s.Set!.Contains(c)).Select(s => s.Item1).ToList();
                    if (lacking.Count > 0)
                        return $"U+{c:X4} '{rune}' is in no face of {fontName} that the brief may draw it in " +
                            $"({string.Join(", ", lacking)})";
                }
                index += rune.Utf16SequenceLength;
            }
            return null;
        }

        foreach (var field in scenario.Texts)
            if (Missing(field.Value, out int i) is { } why)
                problems.Add(new Diagnostic(field.At, field.Path,
                    $"cannot be shown: {why}; use another character or a theme font that has it",
                    $"{BindQuote(field.Value)} (character {i + 1})").Message);

        // The template and the language's texts are the same for every brief of a batch: checked once per font.
        var once = (template.Hash, language.Code, fonts?.Regular);
        bool known;
        lock (Passed) known = Passed.Contains(once);
        if (!known)
        {
            int before = problems.Count;
            foreach (var (text, line, column) in TemplateTexts(template.Text))
                if (Missing(text, out int i) is { } why)
                {
                    var (l, c) = Advance(text, i, line, column);
                    problems.Add(
                        $"{template.Path}:{l}:{c}: template text cannot be shown: {why}. Got {BindQuote(text)}.");
                }

            foreach (var (key, value) in language.Texts.OrderBy(t => t.Value.Line))
                if (Missing(value.Text, out _) is { } why)
                    problems.Add($"{language.Source}:{value.Line}:1: {key}: cannot be shown: {why}.");
            if (problems.Count == before)
                lock (Passed)
                    if (Passed.Count < 64) Passed.Add(once);
        }

        if (problems.Count == 0) return;
        throw new BriefTextException(Capped(problems));
    }

    /// <summary>The faces a brief may draw text in, by name, with their font bytes.</summary>
    private static (string Face, byte[] Bytes)[] Faces(
        (byte[] Regular, byte[] Bold, byte[] Italic, byte[] BoldItalic)? fonts) =>
        fonts is { } f
            ? new[] { ("regular", f.Regular), ("bold", f.Bold), ("italic", f.Italic), ("bold italic", f.BoldItalic) }
            : new[] { RunStyle.Regular, RunStyle.Bold, RunStyle.Italic, RunStyle.BoldItalic }
                .Select(s => (Face: s == RunStyle.BoldItalic ? "bold italic" : s.ToString().ToLowerInvariant(),
                    Bytes: BundledFonts.Bytes(s))).ToArray();

    /// <summary>The first <see cref="MaxReported"/> problems, and a line counting the rest.</summary>
    private static List<string> Capped(List<string> problems) =>
        problems.Count <= MaxReported
            ? problems
            : problems.Take(MaxReported)
                .Append($"… and {problems.Count - MaxReported} more texts with characters the font lacks.").ToList();

    /// <summary>
    /// Every character the brief's charts may draw that comes from the scenario's labels or the language's chart words.
    /// </summary>
    public static IEnumerable<int> ChartCharacters(ScenarioDocument scenario, BriefLanguage language)
    {
        // Charts show the scenario's labels (options, appraisal rules); titles, sources and notes never reach them.
        var texts = scenario.Texts.Where(t => t.Path.EndsWith(".label", StringComparison.Ordinal)).Select(t => t.Value)
            .Concat(language.Texts
                .Where(t => t.Key.StartsWith("chart.", StringComparison.Ordinal)
                    || t.Key.StartsWith("parameter.", StringComparison.Ordinal)
                    || t.Key.StartsWith("number.", StringComparison.Ordinal)
                    || t.Key.StartsWith("unit.", StringComparison.Ordinal))
                .Select(t => t.Value.Text));
        var set = new HashSet<int>();
        foreach (string text in texts)
            foreach (var rune in text.EnumerateRunes()) set.Add(rune.Value);
        return set;
    }

    private static string BindQuote(string value) => Scenario.Binding.BindContext.Quote(value);

    /// <summary>
    /// The template's text that reaches the brief: everything outside <c>{{ }}</c>, and quoted strings inside.
    /// </summary>
    private static IEnumerable<(string Text, int Line, int Column)> TemplateTexts(string template)
    {
        int line = 1, column = 1, startLine = 1, startColumn = 1;
        bool inCode = false, inString = false, inComment = false;
        var current = new StringBuilder();
        for (int i = 0; i < template.Length; i++)
        {
            char ch = template[i];
            bool closes = ch == '}' && i + 1 < template.Length && template[i + 1] == '}';
            if (inComment && (ch == '\n' || closes)) inComment = false;
            if (inComment) { }
            else if (inCode && !inString && ch == '#') inComment = true;
            else if (!inCode && ch == '{' && i + 1 < template.Length && template[i + 1] == '{')
            {
                if (current.Length > 0) yield return (current.ToString(), startLine, startColumn);
                current.Clear();
                inCode = true;
            }
            else if (inCode && !inString && closes)
            {
                inCode = false;
                i++;
                column++;
                startLine = line;
                startColumn = column + 1;
            }
            else if (inCode && ch == '"')
            {
                if (inString && current.Length > 0) yield return (current.ToString(), startLine, startColumn);
                current.Clear();
                inString = !inString;
                startLine = line;
                startColumn = column + 1;
            }
            else if (!inCode || inString)
            {
                if (current.Length == 0 && !inString) { startLine = line; startColumn = column; }
                current.Append(ch);
            }
            if (ch == '\n') { line++; column = 1; } else column++;
        }
        if (current.Length > 0) yield return (current.ToString(), startLine, startColumn);
    }

    private static (int Line, int Column) Advance(string text, int index, int line, int column)
    {
        for (int i = 0; i < index; i++)
            if (text[i] == '\n') { line++; column = 1; } else column++;
        return (line, column);
    }
}
