using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;

namespace Briefwright.Composer.Layout;

/// <summary>
/// The measure stage: turns blocks into atoms of known height for a given content width. Numbers headings
/// (1, 1.1), tables and figures; sets the keep-together rules (no single-line widows or orphans).
/// </summary>
public sealed class Planner(Theme theme, ITextMeasurer measurer)
{
    private int section, subsection, tables, figures;

    public IReadOnlyList<Atom> Plan(IEnumerable<Block> blocks)
    {
        var atoms = new List<Atom>();
        foreach (var block in blocks)
        {
            // A paragraph that leads into an equation ("… are:") stays on the page with it.
            if (block is MathBlock && atoms.Count > 0 && atoms[^1] is LinesAtom lead) lead.KeepWithNext = true;
            atoms.AddRange(PlanBlock(block, theme.ContentWidth));
        }
        return atoms;
    }

    private IEnumerable<Atom> PlanBlock(Block block, double width) => block switch
    {
        HeadingBlock h => Heading(h, width),
        ParagraphBlock p => Paragraph(p.Runs, p.Role, width),
        ListBlock l => List(l, width),
        TableBlock t => Table(t, width),
        FigureBlock f => Figure(f, width),
        BoxBlock b => new[] { Box(b, width) },
        PageBreakBlock => new Atom[] { new BreakAtom { BreakBefore = true } },
        MathBlock m => new[] { Equation(m, width) },
        _ => Array.Empty<Atom>(),
    };

    private double LineHeight(double size) => size * theme.LineFactor;

    private IEnumerable<Atom> Heading(HeadingBlock h, double width)
    {
        string number = "";
        if (h.Level == 2) { section++; subsection = 0; number = $"{section}  "; }
        else if (h.Level == 3) { subsection++; number = $"{section}.{subsection}  "; }
        double size = h.Level switch { 1 => 20, 2 => 13.5, _ => 11 };
        var font = new FontSpec(RunStyle.Bold, size);
        var lines = LineBreaker.Break(new[] { new TextRun(number + h.Text, RunStyle.Bold) }, size, width, measurer);
        double lh = size * 1.25;
        yield return new LinesAtom
        {
            Lines = lines,
            LineHeight = lh,
            Ascent = measurer.Ascent(font),
            Height = lines.Count * lh + (h.Level == 1 ? 6 : 3),
            SpaceBefore = h.Level == 1 ? 0 : h.Level == 2 ? 16 : 10,
            KeepWithNext = true,
            OwnTag = h.Level switch { 1 => StructTag.H1, 2 => StructTag.H2, _ => StructTag.H3 },
            Color = theme.Accent,
            OutlineLevel = h.Level,
            OutlineTitle = (number + h.Text).Trim(),
            RuleBelow = h.Level == 1,
        };
    }

    private IEnumerable<Atom> Paragraph(
        IReadOnlyList<TextRun> runs,
        ParagraphRole role,
        double width,
        StructTag tag = StructTag.P)
    {
        double size = role switch
        {
            ParagraphRole.Subtitle => 12.5,
            ParagraphRole.Meta => 9,
            ParagraphRole.Note => theme.CaptionSize,
            _ => theme.BodySize,
        };
        var lines = LineBreaker.Break(runs, size, width, measurer);
        double lh = LineHeight(size);
        double ascent = measurer.Ascent(new FontSpec(RunStyle.Regular, size)) + (lh - size * 1.15) / 2;
        var group = new object();
        var atoms = new List<Atom>();
        for (int i = 0; i < lines.Count; i++)
        {
            atoms.Add(new LinesAtom
            {
                Lines = new[] { lines[i] },
                LineHeight = lh,
                Ascent = ascent,
                Height = lh,
                SpaceBefore = i == 0 ? theme.ParagraphGap : 0,
                Group = group,
                GroupTag = tag,
                Color = role is ParagraphRole.Meta or ParagraphRole.Note ? theme.Muted : null,
                // Keep the first two and the last two lines together: no one-line widows or orphans.
                KeepWithNext = lines.Count <= 3 ? i < lines.Count - 1 : i == 0 || i == lines.Count - 2,
            });
        }
        return atoms;
    }

    private IEnumerable<Atom> List(ListBlock l, double width)
    {
        var group = new object();
        double size = theme.BodySize, lh = LineHeight(size), indent = 16;
        var font = new FontSpec(RunStyle.Regular, size);
        double ascent = measurer.Ascent(font) + (lh - size * 1.15) / 2;
        for (int i = 0; i < l.Items.Count; i++)
        {
            var lines = LineBreaker.Break(l.Items[i], size, width - indent, measurer);
            yield return new ListItemAtom
            {
                Label = l.Ordered ? $"{i + 1}." : "•",
                Lines = lines,
                LineHeight = lh,
                Ascent = ascent,
                Indent = indent,
                Font = font,
                Height = lines.Count * lh + 1.5,
                SpaceBefore = i == 0 ? theme.ParagraphGap : 0,
                Group = group,
                GroupTag = StructTag.L,
                KeepWithNext = l.Items.Count <= 3 ? i < l.Items.Count - 1 : i == 0 || i == l.Items.Count - 2,
            };
        }
    }

    private IEnumerable<Atom> Caption(string label, string text, double width, double spaceBefore)
    {
        var runs = new[] { new TextRun(label + " ", RunStyle.Bold), new TextRun(text) };
        var atoms = Paragraph(runs, ParagraphRole.Body, width, StructTag.Caption).ToList();
        foreach (var a in atoms) a.KeepWithNext = true;
        return atoms.Select((a, i) => i == 0 ? Clone(a, spaceBefore) : a);
    }

    private static Atom Clone(Atom a, double spaceBefore) => a is LinesAtom l
        ? new LinesAtom
        {
            Lines = l.Lines, LineHeight = l.LineHeight, Ascent = l.Ascent, Height = l.Height, SpaceBefore = spaceBefore,
            Group = l.Group, GroupTag = l.GroupTag, Color = l.Color, KeepWithNext = l.KeepWithNext, Float = l.Float,
        }
        : a;

    private IEnumerable<Atom> SourceLine(string source, double width)
    {
        var atoms = Paragraph(
            new[] { new TextRun(theme.SourceLabel, RunStyle.Italic), new TextRun(source) },
            ParagraphRole.Note,
            width).ToList();
        return atoms.Select((a, i) => i == 0 ? Clone(a, 3) : a);
    }

    private IEnumerable<Atom> Figure(FigureBlock f, double width)
    {
        figures++;
        var atoms = new List<Atom>();
        string label = theme.FigureLabel.Replace(
            "{0}", figures.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal);
        atoms.AddRange(Caption(label, f.Caption, width, 12));
        double w = Math.Min(width, f.WidthPt);
        double h = f.HeightPt * w / f.WidthPt;
        double maxH = theme.ContentHeight * 0.6;
        if (h > maxH) { w *= maxH / h; h = maxH; }
        atoms.Add(new FigureAtom {
            Id = f.Id,
            Pdf = f.Pdf,
            Page = f.Page,
            Width = w,
            Height = h,
            SpaceBefore = 4,
            AltText = f.AltText,
            KeepWithNext = f.Source is not null });
        if (f.Source is not null) atoms.AddRange(SourceLine(f.Source, width));
        // Caption, chart and source move as one float: text after them may fill a page they do not fit on.
        var float_ = new object();
        foreach (var a in atoms) a.Float = float_;
        return atoms;
    }

    private IEnumerable<Atom> Table(TableBlock t, double width)
    {
        tables++;
        var atoms = new List<Atom>();
        if (t.Caption is not null)
        {
            string label = theme.TableLabel.Replace(
                "{0}", tables.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal);
            atoms.AddRange(Caption(label, t.Caption, width, 12));
        }
        double size = theme.TableSize, lh = size * 1.3, pad = 3.5;
        var regular = new FontSpec(RunStyle.Regular, size);
        int cols = t.Header.Count;
        var widths = ColumnWidths(t, width, size, pad);
        var xs = new double[cols];
        for (int c = 1; c < cols; c++) xs[c] = xs[c - 1] + widths[c - 1];
        double ascent = measurer.Ascent(regular);
        var group = new object();
        TableRowAtom? headerAtom = null;

        TableRowAtom Row(IReadOnlyList<string> cells, bool header, int index)
        {
            var lines = cells.Select((cell, c) => LineBreaker.Break(
                new[] { new TextRun(cell, header ? RunStyle.Bold : RunStyle.Regular) },
                size,
                widths[c] - 2 * pad,
                measurer)).ToList();
            double h = lines.Max(l => l.Count) * lh + 2 * pad;
            return new TableRowAtom
            {
                Cells = lines, ColumnX = xs, ColumnWidth = widths, Align = t.Align,
                LineHeight = lh, Ascent = ascent, Padding = pad,
                IsHeader = header, Striped = index % 2 == 1, Height = h, Group = group, GroupTag = StructTag.Table,
                SpaceBefore = header ? 4 : 0, KeepWithNext = header, RepeatHeader = headerAtom,
            };
        }

        headerAtom = Row(t.Header, true, 0);
        atoms.Add(headerAtom);
        for (int r = 0; r < t.Rows.Count; r++)
        {
            var row = Row(t.Rows[r], false, r);
            row.KeepWithNext = r == t.Rows.Count - 1 && t.Source is not null;
            atoms.Add(row);
        }
        if (t.Source is not null) atoms.AddRange(SourceLine(t.Source, width));
        return atoms;
    }

    /// <summary>Cells this short (numbers, ranges such as "63 to 67", short labels) are never wrapped.</summary>
    public const int NoWrapLength = 16;

    /// <summary>
    /// Column widths sized from the content: a column is at least as wide as its widest short cell (see
    /// <see cref="NoWrapLength"/>, so numbers never wrap) and its widest word; the rest of the width goes in proportion
    /// to its longest cell. When short cells alone would overflow the table, only words are kept whole.
    /// </summary>
    private double[] ColumnWidths(TableBlock t, double width, double size, double pad)
    {
        int cols = t.Header.Count;
        var word = new double[cols];
        var whole = new double[cols];
        var want = new double[cols];
        var font = new FontSpec(RunStyle.Bold, size);
        foreach (var row in t.Rows.Prepend(t.Header))
            for (int c = 0; c < cols; c++)
            {
                string cell = c < row.Count ? row[c] : "";
                double longestWord = cell.Split(' ').Select(w => measurer.Width(w, font)).DefaultIfEmpty(0).Max();
                double full = measurer.Width(cell, font);
                word[c] = Math.Max(word[c], longestWord + 2 * pad);
                whole[c] = Math.Max(whole[c], (cell.Length <= NoWrapLength ? full : longestWord) + 2 * pad);
                want[c] = Math.Max(want[c], full + 2 * pad);
            }
        var min = whole.Sum() <= width ? whole : word;
        double totalWant = want.Sum();
        if (totalWant <= width) return want.Select(w => w * width / totalWant).ToArray();
        double spare = width - min.Sum();
        if (spare <= 0) return min.Select(m => m * width / min.Sum()).ToArray();
        double extraWant = want.Zip(min, (w, m) => w - m).Sum();
        return min.Select((m, c) => m + spare * (want[c] - m) / extraWant).ToArray();
    }

    /// <summary>
    /// Display equations are set a little larger than body text, centred, and kept with the line before them.
    /// </summary>
    private Atom Equation(MathBlock m, double width)
    {
        var node = MathNotation.Parse(m.Source, m.Line);
        var box = MathBox.Layout(node, theme.BodySize * 1.1, measurer);
        if (box.Width > width)
            throw new ComposeException($"the equation '{(m.Source.Length <= 40 ? m.Source : m.Source[..40] + "…")}' " +
                $"is {box.Width:0} pt wide and does not fit the {width:0} pt line: split it.", m.Line, m.Source);
        return new MathAtom {
            Box = box,
            AltText = MathNotation.Spoken(node),
            Source = m.Source,
            Height = box.Ascent + box.Descent + 6,
            SpaceBefore = theme.ParagraphGap };
    }

    private Atom Box(BoxBlock b, double width)
    {
        const double pad = 10;
        var inner = new List<Block>();
        if (b.Title is not null) inner.Add(new ParagraphBlock(new[] { new TextRun(b.Title, RunStyle.Bold) }));
        inner.AddRange(b.Content);
        var content = new List<(Atom, double)>();
        double y = pad - theme.ParagraphGap;
        foreach (var atom in inner.SelectMany(block => PlanBlock(block, width - 2 * pad)))
        {
            y += atom.SpaceBefore;
            content.Add((atom, y));
            y += atom.Height;
        }
        return new BoxAtom { Content = content, Padding = pad, Height = y + pad, SpaceBefore = 10 };
    }
}
