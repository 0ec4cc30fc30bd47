namespace Briefwright.Composer;

/// <summary>
/// The brief's text asks for something the composer cannot lay out. <see cref="Line"/> is the line of the filled
/// text and <see cref="Snippet"/> the offending text, so the caller can point at the template line it came from.
/// </summary>
public sealed class ComposeException(string message, int line = 0, string? snippet = null) : Exception(message)
{
    public int Line { get; } = line;
    public string? Snippet { get; } = snippet;
}
