using System.Globalization;

namespace Briefwright.Charts;

/// <summary>
/// The words and number format one brief's charts are drawn with, in its language: looked up by key (the keys of
/// templates/languages/*.texts that start with <c>chart.</c> or <c>parameter.</c>), each chart's English where the
/// lookup has none. Made by the caller and carried in the brief's <see cref="ChartDrawing"/>.
/// </summary>
public sealed class ChartWords(Func<string, string?> lookup, string decimalMark)
{
    /// <summary>Each chart's own English words and a decimal point.</summary>
    public static readonly ChartWords English = new(_ => null, ".");

    /// <summary>
    /// The text for <paramref name="key"/> in the brief's language (else <paramref name="english"/>), {0}… filled.
    /// </summary>
    public string Text(string key, string english, params object[] args)
    {
        string text = lookup(key) ?? english;
        for (int i = 0; i < args.Length; i++)
            text = text.Replace("{" + i.ToString(CultureInfo.InvariantCulture) + "}",
                Convert.ToString(args[i], CultureInfo.InvariantCulture), StringComparison.Ordinal);
        return text;
    }

    /// <summary>
    /// The decimal mark when it is not a point (axes then get tick labels in that format), else null.
    /// </summary>
    public string? DecimalMark { get; } = decimalMark == "." ? null : decimalMark;
}

/// <summary>
/// What one brief's charts are drawn with: their font and their words. The caller makes one per brief and gives it
/// to every chart it builds; nothing about it is kept anywhere else, so briefs drawn at the same time, in different
/// fonts and languages, draw exactly what they would draw one after the other.
/// </summary>
public sealed record ChartDrawing(ChartFont Font, ChartWords Words)
{
    /// <summary>The family name set on every text of the plot.</summary>
    public string Family => Font.Family;

    /// <summary>The text for <paramref name="key"/> (see <see cref="ChartWords.Text"/>).</summary>
    public string Text(string key, string english, params object[] args) => Words.Text(key, english, args);
}
