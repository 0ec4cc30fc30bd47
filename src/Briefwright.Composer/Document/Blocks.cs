namespace Briefwright.Composer.Document;

public enum RunStyle
{
    Regular,
    Bold,
    Italic,
    BoldItalic,
}

/// <summary>A stretch of text in one style, optionally a link.</summary>
public sealed record TextRun(string Text, RunStyle Style = RunStyle.Regular, string? Link = null);

/// <summary>A block of the brief, in reading order.</summary>
public abstract record Block;

/// <summary>Level 1 is the document title (not numbered); levels 2 and 3 are numbered sections.</summary>
public sealed record HeadingBlock(int Level, string Text) : Block;

public sealed record ParagraphBlock(IReadOnlyList<TextRun> Runs, ParagraphRole Role = ParagraphRole.Body) : Block;

public enum ParagraphRole
{
    Body,
    Subtitle,
    Meta,
    Note,
}

public sealed record ListBlock(IReadOnlyList<IReadOnlyList<TextRun>> Items, bool Ordered) : Block;

public enum CellAlign
{
    Left,
    Right,
    Center,
}

public sealed record TableBlock(
    IReadOnlyList<string> Header,
    IReadOnlyList<IReadOnlyList<string>> Rows,
    IReadOnlyList<CellAlign> Align,
    string? Caption,
    string? Source) : Block;

/// <summary>A vector chart: a one-page PDF drawn to <see cref="WidthPt"/> × <see cref="HeightPt"/> points.</summary>
public sealed record FigureBlock(
    string Id, byte[] Pdf, int Page, double WidthPt, double HeightPt, string Caption, string? Source,
    string AltText) : Block;

/// <summary>A shaded box (key findings): a title and blocks inside; kept on one page.</summary>
public sealed record BoxBlock(string? Title, IReadOnlyList<Block> Content) : Block;

public sealed record PageBreakBlock : Block;

/// <summary>
/// A display equation written in the math notation (<see cref="Layout.MathNotation"/>); <see cref="Line"/> is its line
/// in the text.
/// </summary>
public sealed record MathBlock(string Source, int Line = 0) : Block;
