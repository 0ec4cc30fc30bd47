using System.Text;

namespace Briefwright.Templating;

/// <summary>Writing CommonMark safely: escaping user text and building pipe tables.</summary>
public static class Md
{
    /// <summary>
    /// User text as CommonMark that reads back as the same characters and nothing else: one line (line breaks become
    /// spaces, control characters are dropped), every character that could start emphasis, code, a link, an image, an
    /// autolink, HTML, an entity, a table cell or a [[directive]] escaped, and a start that could open a heading, list,
    /// quote or rule escaped too (the text may land at the start of a line).
    /// </summary>
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text)) return "";
        var sb = new StringBuilder(text.Length + 8);
        string trimmed = text.TrimStart();
        for (int i = 0; i < trimmed.Length; i++)
        {
            char c = trimmed[i] is '\n' or '\r' or '\t' ? ' ' : trimmed[i];
            if (char.IsControl(c)) continue;
            // '!' only makes an image before '[', which is escaped; '&' only starts an entity before a letter or '#'.
            bool entity = c == '&' && i + 1 < trimmed.Length
                && (char.IsAsciiLetter(trimmed[i + 1]) || trimmed[i + 1] == '#');
            if ("\\`*_[]<>|#$".Contains(c) || entity) sb.Append('\\');
            sb.Append(c);
        }
        // Block starts: a quote (>), a list item (- x, + x, 1. x, 1) x), a rule or heading underline (---, ===), a
        // fence (~~~).
        bool SpaceOrEnd(int i) => i >= sb.Length || sb[i] == ' ';
        if (sb.Length > 0 && (sb[0] is '>' or '~' || (sb[0] is '-' or '+' or '=' && (SpaceOrEnd(1) || sb[1] == sb[0]))))
            sb.Insert(0, '\\');
        int digits = 0;
        while (digits < sb.Length && char.IsAsciiDigit(sb[digits])) digits++;
        if (digits is > 0 and < 10 && digits < sb.Length && sb[digits] is '.' or ')' && SpaceOrEnd(digits + 1))
            sb.Insert(digits, '\\');
        return sb.ToString();
    }

    /// <summary>
    /// <see cref="Escape"/> for an optional value: null stays null, so a template's <c>if</c> still sees it missing.
    /// </summary>
    public static string? Text(string? text) => text is null ? null : Escape(text);

    /// <summary>Undoes <see cref="Escape"/>.</summary>
    public static string Unescape(string text) => System.Text.RegularExpressions.Regex.Replace(text, @"\\(.)", "$1");

    /// <summary>A pipe table with a caption directive; <paramref name="rightAligned"/> marks numeric columns.</summary>
    public static string Table(string caption, string? source, IReadOnlyList<string> header,
        IEnumerable<IReadOnlyList<string>> rows, ISet<int> rightAligned)
    {
        var sb = new StringBuilder();
        sb.Append("[[table: ").Append(Escape(caption).Replace("\\|", "/"))
            .Append(source is null ? "" : " | " + Escape(source).Replace("\\|", "/"))
            .Append("]]\n\n");
        sb.Append("| ").Append(string.Join(" | ", header.Select(Escape))).Append(" |\n");
        sb.Append('|').Append(string.Join("|", header.Select((_, i) => rightAligned.Contains(i) ? "---:" : "---")))
            .Append("|\n");
        foreach (var row in rows) sb.Append("| ").Append(string.Join(" | ", row.Select(Escape))).Append(" |\n");
        return sb.ToString();
    }

    public static string Bullets(IEnumerable<string> items) => string.Concat(items.Select(i => "- " + i + "\n"));
}
