using System.Security.Cryptography;
using System.Text;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario;

/// <summary>
/// What a scenario says, apart from when it is issued: a hash of the merged tree (after <c>extends</c>) without
/// <c>brief.date</c> and <c>brief.edition</c>, keys in order, and of every life table's text. Comments, layout, key
/// order, a file split differently with <c>extends</c>, a new date or a new edition number leave it unchanged; any
/// value (an assumption, a source, a note, the title, an option) changes it. The edition planner starts a new edition
/// on it.
/// </summary>
public static class ScenarioContent
{
    public static string Hash(YMapping tree, IEnumerable<string> lifeTables)
    {
        var text = new StringBuilder();
        Write(tree, "", text);
        foreach (var t in lifeTables) text.Append("\ntable ").Append(t.Length).Append(' ').Append(t);
        return Sha256Hex.Of(text.ToString());
    }

    /// <summary>Where <c>brief.edition</c> is written (after <c>extends</c>), if it is.</summary>
    public static SourceSpan? EditionAt(YMapping tree) =>
        tree["brief"] is YMapping b && b["edition"] is { } e ? e.At : null;

    private static void Write(YNode node, string path, StringBuilder text)
    {
        switch (node)
        {
            case YScalar s:
                text.Append(s.Quoted ? 'q' : 'p').Append(s.Value.Length).Append(':').Append(s.Value);
                break;
            case YSequence l:
                text.Append('[').Append(l.Items.Count);
                foreach (var item in l.Items)
                {
                    text.Append(',');
                    Write(item, path + "[]", text);
                }
                text.Append(']');
                break;
            case YMapping m:
                text.Append('{');
                foreach (var (key, value) in m.Entries.OrderBy(e => e.Key.Value, StringComparer.Ordinal))
                {
                    string at = path.Length == 0 ? key.Value : path + "." + key.Value;
                    if (at is "brief.date" or "brief.edition") continue;
                    text.Append(key.Value.Length).Append(':').Append(key.Value).Append('=');
                    Write(value, at, text);
                    text.Append(';');
                }
                text.Append('}');
                break;
        }
    }
}
