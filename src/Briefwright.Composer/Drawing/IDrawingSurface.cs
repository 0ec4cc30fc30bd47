using Briefwright.Composer.Layout;

namespace Briefwright.Composer.Drawing;

/// <summary>Structure tags for tagged PDF (a subset of the standard structure types).</summary>
public enum StructTag
{
    H1,
    H2,
    H3,
    P,
    L,
    LI,
    Lbl,
    LBody,
    Table,
    TR,
    /// <summary>A column header cell (in a header row).</summary>
    TH,
    /// <summary>A row header cell (first cell of a body row in a table with row headers).</summary>
    THRow,
    TD,
    Figure,
    /// <summary>A typeset equation; like a figure it needs alternative text and a bounding box.</summary>
    Formula,
    Caption,
    Div,
}

/// <summary>
/// What layout draws on. Coordinates are points from the top-left of the page. The PDF implementation writes
/// a tagged PDF; the recording implementation keeps a list of operations for layout tests.
/// </summary>
public interface IDrawingSurface
{
    void BeginPage(int pageIndex, double width, double height);

    void EndPage();

    /// <summary>Opens a structure element; closed by <see cref="EndTag"/>.</summary>
    void BeginTag(StructTag tag, string? altText = null, Box? bounds = null);

    void EndTag();

    /// <summary>
    /// Marks what follows as decoration (running header, rules, shading) until <see cref="EndArtifact"/>.
    /// </summary>
    void BeginArtifact();

    void EndArtifact();

    /// <summary>Draws text with its baseline at <paramref name="baseline"/>.</summary>
    void Text(string text, double x, double baseline, FontSpec font, Rgb color);

    void FillRect(Box box, Rgb color);

    void Line(double x1, double y1, double x2, double y2, Rgb color, double width);

    /// <summary>
    /// Places page <paramref name="page"/> (1-based) of a vector PDF scaled into <paramref name="box"/>.
    /// </summary>
    void Figure(string id, byte[] pdf, int page, Box box);

    /// <summary>
    /// Opens a link over <paramref name="box"/>: the text drawn until <see cref="EndLink"/> is the link's content;
    /// <paramref name="text"/> is its visible wording, used for the annotation's text alternative.
    /// </summary>
    void BeginLink(Box box, string url, string text);

    void EndLink();

    /// <summary>Places a PNG image (a logo) scaled into <paramref name="box"/>.</summary>
    void Image(byte[] png, Box box);

    /// <summary>Records a heading for the document outline.</summary>
    void Outline(int level, string title, double y);
}

public readonly record struct Box(double X, double Y, double Width, double Height);
