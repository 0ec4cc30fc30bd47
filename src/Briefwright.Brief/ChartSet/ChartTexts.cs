using System.Globalization;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>
/// The words of the chart definitions (captions, alternative texts, axis labels), in the brief's language: texts of
/// templates/languages/*.texts looked up by key.
/// </summary>
internal static class ChartTexts
{
    /// <summary>A text of the brief's language, by key, {0}… filled.</summary>
    public static string T(string key, params object?[] args) => BriefLanguage.Current.Format(key, args);

    /// <summary>A number with one decimal in the brief's number format.</summary>
    public static string F(double v, string f = "0.0") => TemplateFunctions.Localise(v.ToString(f, CultureInfo.InvariantCulture));

    /// <summary>A model parameter's label in the brief's language (its <c>parameter.</c> text), else <paramref name="fallback"/>.</summary>
    public static string ParameterLabel(string name, string fallback) =>
        BriefLanguage.Current.Texts.TryGetValue("parameter." + name, out var t) ? t.Text : fallback;

    /// <summary>A label inside a sentence: lower case where the language writes it so (<c>list.lower_case</c>).</summary>
    public static string InSentence(string label) => BriefLanguage.Current.Get("list.lower_case") == "yes" ? label.ToLowerInvariant() : label;
}
