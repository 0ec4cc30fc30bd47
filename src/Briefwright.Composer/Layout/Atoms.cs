using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;

namespace Briefwright.Composer.Layout;

/// <summary>One or more lines of text, drawn inside the current group's structure element (or its own tag).</summary>
public sealed class LinesAtom : Atom
{
    public required IReadOnlyList<TextLine> Lines { get; init; }
    public required double LineHeight { get; init; }
    public required double Ascent { get; init; }
    public Rgb? Color { get; init; }
    public double Indent { get; init; }
    public StructTag? OwnTag { get; init; }
    public int OutlineLevel { get; init; }
    public string? OutlineTitle { get; init; }
    public bool RuleBelow { get; init; }

    public override string Describe() => $"the text '{Start(Lines)}'";

    internal static string Start(IReadOnlyList<TextLine> lines)
    {
        string text = string.Join(" ", lines.SelectMany(l => l.Spans).Select(s => s.Text));
        return text.Length <= 40 ? text : text[..40] + "…";
    }

    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
        if (OutlineTitle is not null) surface.Outline(OutlineLevel, OutlineTitle, y);
        if (OwnTag is { } tag) surface.BeginTag(tag);
        DrawLines(surface, Lines, x + Indent, y, LineHeight, Ascent, Color ?? theme.Text, theme);
        if (OwnTag is not null) surface.EndTag();
        if (RuleBelow)
        {
            surface.BeginArtifact();
            surface.Line(x, y + Height - 2, x + theme.ContentWidth, y + Height - 2, theme.Accent, 0.8);
            surface.EndArtifact();
        }
    }

    public static void DrawLines(
        IDrawingSurface surface,
        IReadOnlyList<TextLine> lines,
        double x,
        double y,
        double lineHeight,
        double ascent,
        Rgb color,
        Theme theme)
    {
        for (int i = 0; i < lines.Count; i++)
        {
            double baseline = y + i * lineHeight + ascent;
            foreach (var span in lines[i].Spans)
            {
                if (span.Link is null)
                {
                    surface.Text(span.Text, x + span.X, baseline, span.Font, color);
                }
                else
                {
                    // The link's text goes inside its Link structure element, with the annotation.
                    surface.BeginLink(
                        new Box(x + span.X, y + i * lineHeight, span.Width, lineHeight),
                        span.Link,
                        span.Text);
                    surface.Text(span.Text, x + span.X, baseline, span.Font, theme.Accent);
                    surface.EndLink();
                    surface.BeginArtifact();
                    surface.Line(
                        x + span.X,
                        baseline + 1.2,
                        x + span.X + span.Width,
                        baseline + 1.2,
                        theme.Accent,
                        0.4);
                    surface.EndArtifact();
                }
            }
        }
    }
}

/// <summary>A list item: its label in the margin and its lines beside it; kept whole.</summary>
public sealed class ListItemAtom : Atom
{
    public required string Label { get; init; }
    public required IReadOnlyList<TextLine> Lines { get; init; }
    public required double LineHeight { get; init; }
    public required double Ascent { get; init; }
    public required double Indent { get; init; }
    public required FontSpec Font { get; init; }

    public override string Describe() => $"the list item '{LinesAtom.Start(Lines)}'";

    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
        surface.BeginTag(StructTag.LI);
        surface.BeginTag(StructTag.Lbl);
        surface.Text(Label, x + Indent - 11, y + Ascent, Font, theme.Accent);
        surface.EndTag();
        surface.BeginTag(StructTag.LBody);
        LinesAtom.DrawLines(surface, Lines, x + Indent, y, LineHeight, Ascent, theme.Text, theme);
        surface.EndTag();
        surface.EndTag();
    }
}

/// <summary>One table row: cells with wrapped text, header rows shaded.</summary>
public sealed class TableRowAtom : Atom
{
    public required IReadOnlyList<IReadOnlyList<TextLine>> Cells { get; init; }
    public required IReadOnlyList<double> ColumnX { get; init; }
    public required IReadOnlyList<double> ColumnWidth { get; init; }
    public required IReadOnlyList<CellAlign> Align { get; init; }
    public required double LineHeight { get; init; }
    public required double Ascent { get; init; }
    public required double Padding { get; init; }
    public bool IsHeader { get; init; }
    public bool Striped { get; init; }

    public override string Describe() => $"the table row '{LinesAtom.Start(Cells.SelectMany(c => c).ToList())}'";

    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
        double width = ColumnX[^1] + ColumnWidth[^1];
        surface.BeginArtifact();
        if (IsHeader) surface.FillRect(new Box(x, y, width, Height), theme.HeaderFill);
        else if (Striped) surface.FillRect(new Box(x, y, width, Height), theme.StripeFill);
        surface.Line(x, y + Height, x + width, y + Height, theme.Rule, IsHeader ? 0.8 : 0.3);
        surface.EndArtifact();
        surface.BeginTag(StructTag.TR);
        for (int c = 0; c < Cells.Count; c++)
        {
            surface.BeginTag(IsHeader ? StructTag.TH : StructTag.TD);
            var lines = Cells[c];
            for (int i = 0; i < lines.Count; i++)
            {
                double inner = ColumnWidth[c] - 2 * Padding;
                double offset = Align[c] switch
                {
                    CellAlign.Right => inner - lines[i].Width,
                    CellAlign.Center => (inner - lines[i].Width) / 2,
                    _ => 0,
                };
                foreach (var span in lines[i].Spans)
                    surface.Text(
                        span.Text,
                        x + ColumnX[c] + Padding + offset + span.X,
                        y + Padding + i * LineHeight + Ascent,
                        span.Font,
                        theme.Text);
            }
            surface.EndTag();
        }
        surface.EndTag();
    }
}

/// <summary>A vector chart scaled to the content width.</summary>
public sealed class FigureAtom : Atom
{
    public required string Id { get; init; }
    public required byte[] Pdf { get; init; }
    public int Page { get; init; } = 1;
    public required double Width { get; init; }
    public required string AltText { get; init; }

    public override string Describe() => $"figure '{Id}'";

    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
        var box = new Box(x + (theme.ContentWidth - Width) / 2, y, Width, Height);
        surface.BeginTag(StructTag.Figure, AltText, box);
        surface.Figure(Id, Pdf, Page, box);
        surface.EndTag();
    }
}

/// <summary>A shaded box holding other atoms, drawn as one piece.</summary>
public sealed class BoxAtom : Atom
{
    public required IReadOnlyList<(Atom Atom, double Y)> Content { get; init; }
    public required double Padding { get; init; }

    public override string Describe()
        => Content.Count == 0 ? "an empty box" : $"the box starting with {Content[0].Atom.Describe()}";

    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
        surface.BeginArtifact();
        surface.FillRect(new Box(x, y, theme.ContentWidth, Height), theme.BoxFill);
        surface.FillRect(new Box(x, y, 3, Height), theme.Accent);
        surface.EndArtifact();
        surface.BeginTag(StructTag.Div);
        object? group = null;
        foreach (var (atom, dy) in Content)
        {
            if (atom.Group != group)
            {
                if (group is not null) surface.EndTag();
                group = atom.Group;
                if (group is not null) surface.BeginTag(atom.GroupTag);
            }
            atom.Draw(surface, theme, x + Padding, y + dy);
        }
        if (group is not null) surface.EndTag();
        surface.EndTag();
    }
}

/// <summary>Nothing to draw: carries a page break.</summary>
public sealed class BreakAtom : Atom
{
    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
    }
}
