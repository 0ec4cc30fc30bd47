using Briefwright.Composer.Document;

namespace Briefwright.Composer.Layout;

/// <summary>A piece of a laid-out line: text at an x offset.</summary>
public sealed record LineSpan(string Text, double X, double Width, FontSpec Font, string? Link);

public sealed record TextLine(IReadOnlyList<LineSpan> Spans, double Width);

/// <summary>
/// Greedy line breaking of styled runs at spaces; words longer than the line are broken by character.
/// </summary>
public static class LineBreaker
{
    public static IReadOnlyList<TextLine> Break(
        IReadOnlyList<TextRun> runs,
        double size,
        double width,
        ITextMeasurer measurer)
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
            if (w > width && text.Length > 1)
                (text, w) = BreakLongWord(text, width, font, run.Link, lines, ref spans, measurer);
            spans.Add(new LineSpan(text, x + space, w, font, run.Link));
            x += space + w;
            lineHasWord = true;
        }
        if (spans.Count > 0 || lines.Count == 0) lines.Add(new TextLine(spans, x));
        return Merge(lines);
    }

    /// <summary>
    /// A word wider than the line, broken at the margin: one pass over its characters, each measured once, and each
    /// piece measured once, so the time is linear in the word's length (re-measuring ever shorter prefixes made a
    /// 20,000-character word take tens of seconds). Surrogate pairs stay whole. Returns the last piece, which starts a
    /// line.
    /// </summary>
    private static (string Last, double Width) BreakLongWord(
        string word,
        double width,
        FontSpec font,
        string? link,
        List<TextLine> lines,
        ref List<LineSpan> spans,
        ITextMeasurer measurer)
    {
        int start = 0;
        double acc = 0;
        for (int k = 0; k < word.Length;)
        {
            int len = char.IsHighSurrogate(word[k]) && k + 1 < word.Length ? 2 : 1;
            double cw = measurer.Width(word.Substring(k, len), font);
            if (acc + cw > width && k > start)
            {
                string piece = word[start..k];
                double pw = measurer.Width(piece, font);
                spans.Add(new LineSpan(piece, 0, pw, font, link));
                lines.Add(new TextLine(spans, pw));
                spans = new List<LineSpan>();
                start = k;
                acc = 0;
            }
            acc += cw;
            k += len;
        }
        string rest = word[start..];
        return (rest, measurer.Width(rest, font));
    }

    private static IEnumerable<(string Word, TextRun Run, bool SpaceBefore)> Words(IReadOnlyList<TextRun> runs)
    {
        bool pendingSpace = false;
        // Neighbouring runs of one style and link are one text: a Markdown reader splits "E*" into "E" and "*", and
        // a line must not break between them.
        var joined = new List<TextRun>();
        foreach (var run in runs)
        {
            if (joined.Count > 0 && joined[^1].Style == run.Style && joined[^1].Link == run.Link)
                joined[^1] = joined[^1] with { Text = joined[^1].Text + run.Text };
            else joined.Add(run);
        }
        foreach (var run in joined)
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
