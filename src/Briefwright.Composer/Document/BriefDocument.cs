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
    string FooterNote)
{
    /// <summary>A PNG logo drawn at the top right of the first page, with its pixel size.</summary>
    public (byte[] Png, int Width, int Height)? Logo { get; init; }

    /// <summary>
    /// A marker such as "DRAFT" drawn at the top of every page (as page furniture, not content); null for none.
    /// </summary>
    public string? Marker { get; init; }

    /// <summary>The page number in the brief's language, {0} the page and {1} the count.</summary>
    public string PageLabel { get; init; } = "Page {0} of {1}";

    /// <summary>The date as the brief's language writes it; null for "30 November 2026".</summary>
    public string? DateText { get; init; }
}

public sealed record BriefDocument(DocumentInfo Info, IReadOnlyList<Block> Blocks, PaperSize Paper = PaperSize.A4)
{
    /// <summary>The page theme; null means the standard one for the paper size.</summary>
    public Layout.Theme? Theme { get; init; }

    /// <summary>The family of the theme's <see cref="Drawing.FontFaces"/> (its <see cref="RenderSession"/>); null for
    /// the bundled one.</summary>
    public string? FontFamily { get; init; }
}
