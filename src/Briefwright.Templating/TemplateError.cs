namespace Briefwright.Templating;

/// <summary>A mistake in a template, reported as <c>file:line:col: message</c>.</summary>
public sealed record TemplateError(string File, int Line, int Column, string Message)
{
    public override string ToString() => $"{File}:{Line}:{Column}: {Message}";
}

public sealed class TemplateException(IReadOnlyList<TemplateError> errors)
    : Exception(string.Join("\n", errors))
{
    public IReadOnlyList<TemplateError> Errors { get; } = errors;
}
