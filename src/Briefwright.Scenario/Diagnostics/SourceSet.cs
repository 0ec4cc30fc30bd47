namespace Briefwright.Scenario.Diagnostics;

/// <summary>The text of every file read while loading, so a diagnostic can show its line with a caret.</summary>
public sealed class SourceSet
{
    private readonly Dictionary<string, string[]> lines = new(StringComparer.Ordinal);
    private readonly List<string> texts = new();

    public void Add(string file, string text)
    {
        lines[file] = text.Split('\n');
        texts.Add(text);
    }

    /// <summary>SHA-256 (hex) over every text added, in order, each prefixed by its length.</summary>
    public string Hash()
    {
        return Sha256Hex.OfAll(texts.Select(System.Text.Encoding.UTF8.GetBytes), lengthPrefixed: true);
    }

    public string? Line(string file, int line) =>
        lines.TryGetValue(file, out var l) && line >= 1 && line <= l.Length ? l[line - 1].TrimEnd('\r') : null;

    /// <summary>The message, then the source line, then a caret under the column.</summary>
    public string Render(Diagnostic d)
    {
        string? line = Line(d.At.File, d.At.Line);
        if (line is null) return d.Message;
        if (line.Length > 160) line = line[..160] + "…";
        string pad = new(' ', Math.Max(0, Math.Min(d.At.Column - 1, line.Length)));
        return $"{d.Message}\n    {line}\n    {pad}^";
    }
}
