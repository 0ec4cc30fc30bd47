using System.Globalization;

namespace Briefwright.Charts;

/// <summary>
/// The words and number format charts are drawn with, in the brief's language: looked up by key (the keys of
/// templates/languages/*.texts that start with <c>chart.</c> or <c>parameter.</c>), English when none is set. Set
/// with <see cref="Use"/> for one brief's charts on this thread of work, like <see cref="ChartFont.Use"/>.
/// </summary>
public static class ChartWords
{
    /// <summary>A brief language's texts and decimal mark, as charts need them.</summary>
    public sealed record Language(Func<string, string?> Lookup, string Decimal);

    private static readonly AsyncLocal<Language?> current = new();

    public static void Use(Language? language) => current.Value = language;

    /// <summary>The text for <paramref name="key"/> in the brief's language (else <paramref name="english"/>), {0}… filled.</summary>
    public static string Text(string key, string english, params object[] args)
    {
        string text = current.Value?.Lookup(key) ?? english;
        for (int i = 0; i < args.Length; i++)
            text = text.Replace("{" + i.ToString(CultureInfo.InvariantCulture) + "}", Convert.ToString(args[i], CultureInfo.InvariantCulture), StringComparison.Ordinal);
        return text;
    }

    /// <summary>A number in the brief's format: <paramref name="format"/> as for <see cref="double.ToString(string)"/>, then its decimal mark.</summary>
    public static string Number(double value, string format)
    {
        string s = value.ToString(format, CultureInfo.InvariantCulture);
        return current.Value is { Decimal: not "." } l ? s.Replace(".", l.Decimal, StringComparison.Ordinal) : s;
    }

    /// <summary>The decimal mark when it is not a point (axes then get tick labels in that format), else null.</summary>
    public static string? DecimalMark => current.Value is { Decimal: not "." } l ? l.Decimal : null;
}
