using Briefwright.Scenario.Diagnostics;

namespace Briefwright.Scenario.Yaml;

/// <summary>A YAML node with the position it was written at. Aliases share the anchored node, never copy it.</summary>
public abstract record YNode(SourceSpan At)
{
    public abstract string Kind { get; }
}

public sealed record YScalar(string Value, bool Quoted, SourceSpan At) : YNode(At)
{
    public override string Kind => "a scalar";

    /// <summary>A plain (unquoted) null, ~ or empty value.</summary>
    public bool IsNull =>
        !Quoted && (Value.Length == 0 || Value == "~" || Value == "null" || Value == "Null" || Value == "NULL");
}

public sealed record YSequence(IReadOnlyList<YNode> Items, SourceSpan At) : YNode(At)
{
    public override string Kind => "a list";
}

public sealed record YMapping(IReadOnlyList<KeyValuePair<YScalar, YNode>> Entries, SourceSpan At) : YNode(At)
{
    public override string Kind => "a mapping";

    public YNode? this[string key]
    {
        get
        {
            foreach (var e in Entries)
                if (e.Key.Value == key) return e.Value;
            return null;
        }
    }

    public YScalar? KeyNode(string key) => Entries.FirstOrDefault(e => e.Key.Value == key).Key;
}
