namespace Briefwright.Scenario.Diagnostics;

/// <summary>One problem with the input: where, which field, which rule, and what was found.</summary>
public sealed record Diagnostic(SourceSpan At, string Path, string Rule, string? Got)
{
    /// <summary><c>file:line:col: path.to.field: rule. Got value.</c></summary>
    public string Message
    {
        get
        {
            string head = string.IsNullOrEmpty(Path) ? $"{At}: {Rule}." : $"{At}: {Path}: {Rule}.";
            return Got is null ? head : $"{head} Got {Got}.";
        }
    }

    public override string ToString() => Message;
}
