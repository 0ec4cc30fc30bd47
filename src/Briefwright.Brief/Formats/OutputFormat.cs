using Briefwright.Charts;
using Briefwright.Composer.Document;


namespace Briefwright.Brief.Formats;

/// <summary>The files a build can write for one brief. The PDF is the brief of record and is always written.</summary>
[Flags]
public enum OutputFormat
{
    Pdf = 1,
    Html = 2,
    Xlsx = 4,
    Docx = 8,
}

/// <summary>
/// The names of the formats on the command line and in the project settings, and the default selection.
/// </summary>
public static class OutputFormats
{
    /// <summary>What a build writes unless told otherwise: the PDF (with its data annex).</summary>
    public const OutputFormat Default = OutputFormat.Pdf;

    public const OutputFormat All = OutputFormat.Pdf | OutputFormat.Html | OutputFormat.Xlsx | OutputFormat.Docx;

    /// <summary>Every name, in the order the summary lists them.</summary>
    public static readonly IReadOnlyList<(string Name, OutputFormat Format, string Meaning)> Names =
    [
        ("pdf", OutputFormat.Pdf, "the tagged PDF brief (always written)"),
        ("html", OutputFormat.Html, "one self-contained, accessible web page"),
        ("xlsx", OutputFormat.Xlsx, "a spreadsheet workbook with a sheet per results table"),
        ("docx", OutputFormat.Docx, "an editable document for clearance rounds"),
    ];

    /// <summary>
    /// Reads a list of names (pdf, html, xlsx, docx); the PDF is always included. Null with the wrong name when one is
    /// unknown.
    /// </summary>
    public static OutputFormat? Parse(IEnumerable<string> names, out string? unknown)
    {
        var result = OutputFormat.Pdf;
        unknown = null;
        foreach (string raw in names)
        {
            string name = raw.Trim().ToLowerInvariant();
            if (name.Length == 0) continue;
            var match = Names.FirstOrDefault(n => n.Name == name);
            if (match.Name is null)
            {
                unknown = raw.Trim();
                return null;
            }
            result |= match.Format;
        }
        return result;
    }

    /// <summary>The selection written as names, such as "pdf, html, xlsx".</summary>
    public static string Describe(OutputFormat formats, string separator = ", ") =>
        string.Join(separator, Names.Where(n => formats.HasFlag(n.Format)).Select(n => n.Name));
}

/// <summary>
/// Everything a writer needs, from one built brief: the blocks the PDF was laid out from (so every number is the
/// PDF's), the charts with their SVG and PNG copies, the solved scenario and its results data.
/// </summary>
public sealed record BriefContent(
    BriefDocument Document,
    IReadOnlyList<RenderedChart> Charts,
    SolvedScenario Solved,
    string ResultsJson,
    string OrganisationName)
{
    public Composer.Layout.Theme Theme => Document.Theme ?? Composer.Layout.Theme.For(Document.Paper);

    /// <summary>The brief's language (its scenario's <c>brief.language</c>).</summary>
    public Templating.BriefLanguage Language => GlyphCheck.LanguageOf(Solved.Scenario);
}

/// <summary>A writer of one output format: returns the file's bytes; the command line writes them.</summary>
public interface IBriefWriter
{
    /// <summary>
    /// The file name's ending after the brief's stem: <c>html</c> gives <c>&lt;id&gt;-&lt;date&gt;.html</c>.
    /// </summary>
    string Suffix { get; }

    /// <summary>The file's bytes; the same content gives the same bytes.</summary>
    byte[] Write(BriefContent content);
}

/// <summary>The writers of the formats beside the PDF, in a fixed order.</summary>
public static class OutputWriters
{
    public static IReadOnlyList<IBriefWriter> For(OutputFormat formats)
    {
        var writers = new List<IBriefWriter>();
        if (formats.HasFlag(OutputFormat.Html)) writers.Add(new HtmlWriter());
        if (formats.HasFlag(OutputFormat.Xlsx)) writers.Add(new WorkbookWriter());
        if (formats.HasFlag(OutputFormat.Docx)) writers.Add(new DocxWriter());
        return writers;
    }
}
