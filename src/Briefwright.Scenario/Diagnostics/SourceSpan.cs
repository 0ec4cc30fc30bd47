namespace Briefwright.Scenario.Diagnostics;

/// <summary>A position in an input file: 1-based line and column.</summary>
public readonly record struct SourceSpan(string File, int Line, int Column)
{
    public override string ToString() => $"{File}:{Line}:{Column}";
}
