using System.Text;

namespace Briefwright.Templating;

/// <summary>Writing CommonMark safely: escaping user text and building pipe tables.</summary>
public static class Md
{
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text)) return "";
        var sb = new StringBuilder(text.Length + 8);
        foreach (char c in text.Replace('\n', ' ').Replace('\r', ' '))
        {
            if ("\\`*_[]<>|#".Contains(c)) sb.Append('\\');
            sb.Append(c);
        }
        return sb.ToString();
    }

    /// <summary>Undoes <see cref="Escape"/>.</summary>
    public static string Unescape(string text) => System.Text.RegularExpressions.Regex.Replace(text, @"\\(.)", "$1");

    /// <summary>A pipe table with a caption directive; <paramref name="rightAligned"/> marks numeric columns.</summary>
    public static string Table(string caption, string? source, IReadOnlyList<string> header, IEnumerable<IReadOnlyList<string>> rows, ISet<int> rightAligned)
    {
        var sb = new StringBuilder();
        sb.Append("[[table: ").Append(Escape(caption).Replace("\\|", "/")).Append(source is null ? "" : " | " + Escape(source).Replace("\\|", "/")).Append("]]\n\n");
        sb.Append("| ").Append(string.Join(" | ", header.Select(Escape))).Append(" |\n");
        sb.Append('|').Append(string.Join("|", header.Select((_, i) => rightAligned.Contains(i) ? "---:" : "---"))).Append("|\n");
        foreach (var row in rows) sb.Append("| ").Append(string.Join(" | ", row.Select(Escape))).Append(" |\n");
        return sb.ToString();
    }

    public static string Bullets(IEnumerable<string> items) => string.Concat(items.Select(i => "- " + i + "\n"));
}
