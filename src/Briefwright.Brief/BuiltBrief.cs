using Briefwright.Brief.Annex;

namespace Briefwright.Brief;

/// <summary>
/// A finished brief: the PDF, its results data, the filled template, the annex files and what changed since the
/// previous edition.
/// </summary>
public sealed record BuiltBrief(string FileStem, byte[] Pdf, string ResultsJson, string Markdown, int PageCount,
    IReadOnlyList<AnnexFile> Annex, EditionChanges? Changes)
{
    /// <summary>
    /// The other formats asked for (web page, workbook, editable document), named <c>&lt;stem&gt;.&lt;Suffix&gt;</c>.
    /// </summary>
    public IReadOnlyList<AnnexFile> Formats { get; init; } = [];
}
