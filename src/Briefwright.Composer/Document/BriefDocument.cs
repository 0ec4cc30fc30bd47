namespace Briefwright.Composer.Document;

public enum PaperSize
{
    A4,
    Letter,
}

/// <summary>Facts that go into the page header and footer and the PDF metadata.</summary>
public sealed record DocumentInfo(
    string Title,
    string ShortTitle,
    string Author,
    string Subject,
    string Keywords,
    string Language,
    DateOnly Date,
    string Edition,
    string FooterNote);

public sealed record BriefDocument(DocumentInfo Info, IReadOnlyList<Block> Blocks, PaperSize Paper = PaperSize.A4);
