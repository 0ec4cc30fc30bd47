using Briefwright.Composer.Layout;

namespace Briefwright.Composer.Drawing;

/// <summary>
/// Draws through to another surface as decoration only: structure tags, links and outline entries are dropped.
/// Used for a table's header row repeated at the top of a continued page, which a screen reader has already read
/// once; the caller wraps the drawing in one artifact.
/// </summary>
public sealed class ArtifactSurface(IDrawingSurface inner) : IDrawingSurface
{
    public void BeginPage(int pageIndex, double width, double height) => inner.BeginPage(pageIndex, width, height);

    public void EndPage() => inner.EndPage();

    public void BeginTag(StructTag tag, string? altText = null, Box? bounds = null)
    {
    }

    public void EndTag()
    {
    }

    public void BeginArtifact()
    {
    }

    public void EndArtifact()
    {
    }

    public void Text(string text, double x, double baseline, FontSpec font, Rgb color) =>
        inner.Text(text, x, baseline, font, color);

    public void FillRect(Box box, Rgb color) => inner.FillRect(box, color);

    public void Line(double x1, double y1, double x2, double y2, Rgb color, double width) =>
        inner.Line(x1, y1, x2, y2, color, width);

    public void Figure(string id, byte[] pdf, int page, Box box) => inner.Figure(id, pdf, page, box);

    public void BeginLink(Box box, string url, string text)
    {
    }

    public void EndLink()
    {
    }

    public void Image(byte[] png, Box box) => inner.Image(png, box);

    public void Outline(int level, string title, double y)
    {
    }
}
