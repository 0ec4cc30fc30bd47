namespace Briefwright.Brief;

/// <summary>A finished brief: the PDF, its results data, the filled template and the file stem they share.</summary>
public sealed record BuiltBrief(string FileStem, byte[] Pdf, string ResultsJson, string Markdown, int PageCount);
