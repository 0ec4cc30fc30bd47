using Briefwright.Composer.Layout;

namespace Briefwright.Composer.Drawing;

/// <summary>Keeps every drawing operation with its page, so tests can assert positions without a PDF.</summary>
public sealed class RecordingSurface : IDrawingSurface
{
    public sealed record Op(
        int Page, string Kind, string Text, double X, double Y, double Width = 0, double Height = 0);

    private readonly List<Op> ops = new();
    private int page = -1;
    private int depth;
    private int artifacts;

    public IReadOnlyList<Op> Ops => ops;
    public int PageCount => page + 1;
    public double PageHeight { get; private set; }

    public void BeginPage(int pageIndex, double width, double height)
    {
        page = pageIndex;
        PageHeight = height;
    }

    public void EndPage()
    {
        // A structure element may continue on the next page; an artifact may not.
        if (artifacts != 0)
            throw new InvalidOperationException(
                $"Artifacts must be closed at the end of a page. Got {artifacts} open.");
    }

    public void BeginTag(StructTag tag, string? altText = null, Box? bounds = null)
    {
        depth++;
        ops.Add(new Op(page, "tag", tag.ToString(), bounds?.X ?? 0, bounds?.Y ?? 0));
    }

    public void EndTag() => depth--;
    public void BeginArtifact() => artifacts++;
    public void EndArtifact() => artifacts--;

    /// <summary>Structure elements still open (0 once the document is drawn).</summary>
    public int OpenTags => depth;

    public void Text(string text, double x, double baseline, FontSpec font, Rgb color) =>
        ops.Add(new Op(page, "text", text, x, baseline, 0, font.Size));

    public void FillRect(Box box, Rgb color) => ops.Add(new Op(page, "rect", "", box.X, box.Y, box.Width, box.Height));
    public void Line(double x1, double y1, double x2, double y2, Rgb color, double width) =>
        ops.Add(new Op(page, "line", "", x1, y1, x2 - x1, y2 - y1));
    public void Figure(string id, byte[] pdf, int chartPage, Box box) =>
        ops.Add(new Op(page, "figure", id, box.X, box.Y, box.Width, box.Height));
    public void BeginLink(Box box, string url, string text)
    {
        depth++;
        ops.Add(new Op(page, "link", url, box.X, box.Y, box.Width, box.Height));
    }

    public void EndLink() => depth--;
    public void Image(byte[] png, Box box) => ops.Add(new Op(page, "image", "", box.X, box.Y, box.Width, box.Height));
    public void Outline(int level, string title, double y) => ops.Add(new Op(page, "outline", title, level, y));
}
