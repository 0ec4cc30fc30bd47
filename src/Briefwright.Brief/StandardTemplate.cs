using Briefwright.Templating;

namespace Briefwright.Brief;

/// <summary>
/// The standard brief template shipped inside the tool (the same text as templates/standard-brief.md).
/// </summary>
public static class StandardTemplate
{
    public const string Name = "standard-brief.md";

    public static string Text { get; } = Load();

    private static readonly Lazy<BriefTemplate> Parsed = new(() => BriefTemplate.Parse(Text, Name));

    public static BriefTemplate Template => Parsed.Value;

    private static string Load()
    {
        using var stream = typeof(StandardTemplate).Assembly.GetManifestResourceStream("templates.standard-brief.md")
            ?? throw new InvalidOperationException("The standard template is missing from the build.");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
