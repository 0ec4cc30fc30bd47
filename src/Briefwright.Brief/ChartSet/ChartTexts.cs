using System.Globalization;
using Briefwright.Templating;

namespace Briefwright.Brief.ChartSet;

/// <summary>
/// The words of the chart definitions (captions, alternative texts, axis labels), in the brief's language: texts of
/// templates/languages/*.texts looked up by key, and the brief's number formats.
/// </summary>
public sealed class ChartTexts(BriefLanguage language) : TemplateFunctions(language)
{
    /// <summary>A number with one decimal in the brief's number format.</summary>
    public string F(double v, string f = "0.0") => Localise(v.ToString(f, CultureInfo.InvariantCulture));

    /// <summary>
    /// A model parameter's label in the brief's language (its <c>parameter.</c> text), else
    /// <paramref name="fallback"/>.
    /// </summary>
    public string ParameterLabel(string name, string fallback) =>
        L.Texts.TryGetValue("parameter." + name, out var t) ? t.Text : fallback;

    /// <summary>
    /// A label inside a sentence: lower case where the language writes it so (<c>list.lower_case</c>).
    /// </summary>
    public string InSentence(string label) => L.Get("list.lower_case") == "yes" ? label.ToLowerInvariant() : label;
}
