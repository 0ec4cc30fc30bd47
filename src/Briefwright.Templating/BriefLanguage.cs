using System.Globalization;
using System.Text;

namespace Briefwright.Templating;

/// <summary>One text of a language file, with the line it was written on (for messages that point at it).</summary>
public sealed record LanguageText(string Text, int Line);

/// <summary>
/// A brief language: every word the tool writes (headings, captions, table headers, caveats, page furniture, the
/// standard brief's sentences) and its number and date format, read from one file of texts
/// (<c>templates/languages/&lt;code&gt;.texts</c>, <c>key = text</c> per line). The number and date formats are carried
/// in that file rather than taken from .NET's culture data: the native executable runs with invariant globalisation,
/// and turning culture data on would tie the tool to the host's ICU library (see README, "Languages").
/// </summary>
public sealed class BriefLanguage
{
    private static readonly Lazy<IReadOnlyDictionary<string, BriefLanguage>> builtIn = new(LoadBuiltIn);

    private readonly IReadOnlyDictionary<string, LanguageText> texts;

    private BriefLanguage(string code, string source, IReadOnlyDictionary<string, LanguageText> texts)
    {
        Code = code;
        Source = source;
        this.texts = texts;
        Tag = Get("language.tag");
        Decimal = Get("number.decimal");
        Group = Get("number.group");
        PercentSign = Get("number.percent");
        MinimumGroupingDigits = int.Parse(Get("number.min_group_digits"), CultureInfo.InvariantCulture);
        Months = Get("date.months").Split('|');
        DatePattern = Get("date.pattern");
    }

    /// <summary>The language code the file is named after ("fr").</summary>
    public string Code { get; }

    /// <summary>The file the texts were read from, for messages.</summary>
    public string Source { get; }

    /// <summary>The language tag written into the PDF ("fr-FR").</summary>
    public string Tag { get; }

    public string Decimal { get; }
    public string Group { get; }

    /// <summary>What follows a number to make it a percentage: "%" or a (narrow) no-break space and "%".</summary>
    public string PercentSign { get; }

    /// <summary>Digits before the thousands separator is used: 1 groups 1,234; 2 writes 1234 but 12.345.</summary>
    public int MinimumGroupingDigits { get; }

    public IReadOnlyList<string> Months { get; }
    public string DatePattern { get; }

    /// <summary>Every text by key, with its line.</summary>
    public IReadOnlyDictionary<string, LanguageText> Texts => texts;

    /// <summary>English, the default.</summary>
    public static BriefLanguage English => builtIn.Value["en"];

    /// <summary>The languages shipped with the tool, by code.</summary>
    public static IReadOnlyDictionary<string, BriefLanguage> BuiltIn => builtIn.Value;

    /// <summary>
    /// The language for a tag such as "fr-FR" or "de": by its language subtag; null when none is shipped.
    /// </summary>
    public static BriefLanguage? ForTag(string tag)
    {
        string code = tag.Split('-')[0].ToLowerInvariant();
        if (!BuiltIn.TryGetValue(code, out var language)) return null;
        return tag.Contains('-') && !string.Equals(tag, language.Tag, StringComparison.OrdinalIgnoreCase)
            ? language.WithTag(tag)
            : language;
    }

    /// <summary>The same texts under another region's tag ("fr-CH" with the French texts).</summary>
    public BriefLanguage WithTag(string tag)
    {
        var copy = new Dictionary<string, LanguageText>(texts)
        {
            ["language.tag"] = new LanguageText(tag, texts["language.tag"].Line),
        };
        return new BriefLanguage(Code, Source, copy);
    }

    /// <summary>The text for <paramref name="key"/>.</summary>
    public string Get(string key) =>
        texts.TryGetValue(key, out var t) ? t.Text
        : throw new InvalidOperationException($"{Source}: the text '{key}' is missing; every language file needs " +
            "every key of templates/languages/en.texts.");

    /// <summary>The text for <paramref name="key"/> with {0}, {1}, … replaced by <paramref name="args"/>.</summary>
    public string Format(string key, params object?[] args)
    {
        string text = Get(key);
        if (args.Length == 0) return text;
        var sb = new StringBuilder(text.Length + 32);
        for (int i = 0; i < text.Length; i++)
        {
            if (text[i] == '{' && i + 2 < text.Length && char.IsAsciiDigit(text[i + 1]))
            {
                int close = text.IndexOf('}', i);
                if (close > 0 && int.TryParse(text.AsSpan(i + 1, close - i - 1), NumberStyles.None,
                        CultureInfo.InvariantCulture, out int n) && n < args.Length)
                {
                    sb.Append(Show(args[n]));
                    i = close;
                    continue;
                }
            }
            sb.Append(text[i]);
        }
        return sb.ToString();
    }

    private static string Show(object? value) => value switch
    {
        null => "",
        string s => s,
        IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
        _ => value.ToString() ?? "",
    };

    /// <summary>A date written in this language: "30 November 2026", "30 novembre 2026", "30. November 2026".</summary>
    public string Date(DateOnly date) => DatePattern
        .Replace("{d}", date.Day.ToString(CultureInfo.InvariantCulture), StringComparison.Ordinal)
        .Replace("{month}", Months[date.Month - 1], StringComparison.Ordinal)
        .Replace("{yyyy}", date.Year.ToString("0000", CultureInfo.InvariantCulture), StringComparison.Ordinal);

    /// <summary>
    /// Reads a language file: <c>key = text</c> per line; <c>#</c> starts a comment line; <c>\u202F</c>-style escapes.
    /// </summary>
    public static BriefLanguage Parse(string code, string text, string source)
    {
        var texts = new Dictionary<string, LanguageText>(StringComparer.Ordinal);
        var lines = text.Replace("\r\n", "\n").Split('\n');
        for (int i = 0; i < lines.Length; i++)
        {
            string line = lines[i];
            if (line.TrimStart().StartsWith('#') || line.Trim().Length == 0) continue;
            int eq = line.IndexOf(" = ", StringComparison.Ordinal);
            if (eq <= 0)
                throw new FormatException($"{source}:{i + 1}:1: a line of texts must read 'key = text'. Got '{line}'.");
            string key = line[..eq].Trim();
            if (!texts.TryAdd(key, new LanguageText(Unescape(line[(eq + 3)..]), i + 1)))
                throw new FormatException($"{source}:{i + 1}:1: the key '{key}' is given twice.");
        }
        return new BriefLanguage(code, source, texts);
    }

    private static string Unescape(string value)
    {
        if (!value.Contains('\\')) return value;
        var sb = new StringBuilder(value.Length);
        for (int i = 0; i < value.Length; i++)
        {
            if (value[i] == '\\' && i + 5 < value.Length && value[i + 1] == 'u'
                && int.TryParse(value.AsSpan(i + 2, 4), NumberStyles.HexNumber, CultureInfo.InvariantCulture,
                    out int code))
            {
                sb.Append((char)code);
                i += 5;
            }
            else if (value[i] == '\\' && i + 1 < value.Length && value[i + 1] == 's')
            {
                sb.Append(' '); // a space kept at the start or end of a text
                i += 1;
            }
            else sb.Append(value[i]);
        }
        return sb.ToString();
    }

    private static IReadOnlyDictionary<string, BriefLanguage> LoadBuiltIn()
    {
        var assembly = typeof(BriefLanguage).Assembly;
        var result = new Dictionary<string, BriefLanguage>(StringComparer.Ordinal);
        foreach (string name in assembly.GetManifestResourceNames()
            .Where(n => n.StartsWith("languages.", StringComparison.Ordinal))
            .Order(StringComparer.Ordinal))
        {
            using var stream = assembly.GetManifestResourceStream(name)!;
            using var reader = new StreamReader(stream);
            string code = name["languages.".Length..^".texts".Length];
            result[code] = Parse(code, reader.ReadToEnd(), $"templates/languages/{code}.texts");
        }
        if (!result.TryGetValue("en", out var english))
            throw new InvalidOperationException("The English texts are missing from the build.");
        foreach (var language in result.Values)
        {
            var missing = english.texts.Keys.Where(k => !language.texts.ContainsKey(k)).ToList();
            if (missing.Count > 0)
                throw new InvalidOperationException($"{language.Source}: texts missing: {string.Join(", ", missing)}.");
        }
        return result;
    }
}
