using Briefwright.Composer.Document;

namespace Briefwright.Composer.Layout;

/// <summary>A piece of a laid-out line: text at an x offset.</summary>
public sealed record LineSpan(string Text, double X, double Width, FontSpec Font, string? Link);

public sealed record TextLine(IReadOnlyList<LineSpan> Spans, double Width);

/// <summary>Greedy line breaking of styled runs at spaces; words longer than the line are broken by character.</summary>
public static class LineBreaker
{
    public static IReadOnlyList<TextLine> Break(IReadOnlyList<TextRun> runs, double size, double width, ITextMeasurer measurer)
    {
        var lines = new List<TextLine>();
        var spans = new List<LineSpan>();
        double x = 0;
        bool lineHasWord = false;
        var words = Words(runs).ToList();
        foreach (var (word, run, spaceBefore) in words)
        {
            var font = new FontSpec(run.Style, size);
            double space = spaceBefore && lineHasWord ? measurer.Width(" ", font) : 0;
            double w = measurer.Width(word, font);
            if (lineHasWord && x + space + w > width + 1e-6)
            {
                lines.Add(new TextLine(spans, x));
                spans = new List<LineSpan>();
                x = 0;
                space = 0;
                lineHasWord = false;
            }
            string text = word;
            while (w > width && text.Length > 1)
            {
                int fit = text.Length - 1;
                while (fit > 1 && measurer.Width(text[..fit], font) > width - x) fit--;
                spans.Add(new LineSpan(text[..fit], x, measurer.Width(text[..fit], font), font, run.Link));
                lines.Add(new TextLine(spans, x + measurer.Width(text[..fit], font)));
                spans = new List<LineSpan>();
                x = 0;
                text = text[fit..];
                w = measurer.Width(text, font);
            }
            spans.Add(new LineSpan(text, x + space, w, font, run.Link));
            x += space + w;
            lineHasWord = true;
        }
        if (spans.Count > 0 || lines.Count == 0) lines.Add(new TextLine(spans, x));
        return Merge(lines);
    }

    private static IEnumerable<(string Word, TextRun Run, bool SpaceBefore)> Words(IReadOnlyList<TextRun> runs)
    {
        bool pendingSpace = false;
        foreach (var run in runs)
        {
            var text = run.Text.Replace('\n', ' ');
            int i = 0;
            while (i < text.Length)
            {
                if (text[i] == ' ') { pendingSpace = true; i++; continue; }
                int j = i;
                while (j < text.Length && text[j] != ' ') j++;
                yield return (text[i..j], run, pendingSpace);
                pendingSpace = false;
                i = j;
            }
        }
    }

    /// <summary>Joins adjacent spans of the same font and link into one, so each line draws few strings.</summary>
    private static IReadOnlyList<TextLine> Merge(List<TextLine> lines) => lines.Select(line =>
    {
        var merged = new List<LineSpan>();
        foreach (var s in line.Spans)
        {
            if (merged.Count > 0 && merged[^1].Font == s.Font && merged[^1].Link == s.Link)
            {
                var last = merged[^1];
                double gap = s.X - (last.X + last.Width);
                string joined = gap > 0.01 ? last.Text + " " + s.Text : last.Text + s.Text;
                merged[^1] = last with { Text = joined, Width = s.X + s.Width - last.X };
            }
            else merged.Add(s);
        }
        return new TextLine(merged, line.Width);
    }).ToList();
}
