using System.Text;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;

namespace Briefwright.Composer.Layout;

/// <summary>
/// A small math notation for display equations (documented in docs/templates.md), parsed to a tree and laid out in
/// the brief's font: <c>\frac{a}{b}</c>, <c>x_{i}</c> and <c>x^{2}</c> (one character or a braced group),
/// <c>\int_{a}^{b}</c> and <c>\sum_{i}^{n}</c> with limits, Greek letters by name (<c>\alpha</c>, <c>\Omega</c>),
/// <c>\hat{y}</c>, <c>y^{*}</c>, upright functions (<c>\ln</c>, <c>\exp</c>, <c>\max</c>), <c>\text{...}</c>,
/// <c>\cdot</c>, <c>\times</c>, <c>\le</c>, <c>\ge</c>, <c>\infty</c>, <c>\,</c> (thin space), <c>( ) [ ] = + -</c>.
/// </summary>
public static class MathNotation
{
    public abstract record Node;
    public sealed record Sym(string Text, bool Italic = false, string? Spoken = null) : Node;
    public sealed record Seq(IReadOnlyList<Node> Items) : Node;
    public sealed record Script(Node Base, Node? Sub, Node? Sup) : Node;
    public sealed record Frac(Node Num, Node Den) : Node;
    public sealed record BigOp(string Symbol, string Spoken, bool LimitsBelow) : Node;
    public sealed record Hat(Node Body) : Node;
    public sealed record Space(double Em) : Node;

    private static readonly IReadOnlyDictionary<string, (string Char, string Name)> Greek =
        new Dictionary<string, (string Char, string Name)>
    {
        ["alpha"] = ("α", "alpha"), ["beta"] = ("β", "beta"), ["gamma"] = ("γ", "gamma"), ["delta"] = ("δ", "delta"),
        ["epsilon"] = ("ε", "epsilon"), ["theta"] = ("θ", "theta"), ["lambda"] = ("λ", "lambda"), ["mu"] = ("μ", "mu"),
        ["pi"] = ("π", "pi"), ["rho"] = ("ρ", "rho"), ["sigma"] = ("σ", "sigma"), ["tau"] = ("τ", "tau"),
        ["phi"] = ("φ", "phi"), ["psi"] = ("ψ", "psi"), ["omega"] = ("ω", "omega"), ["Omega"] = ("Ω", "capital omega"),
        ["Delta"] = ("Δ", "capital delta"), ["Sigma"] = ("Σ", "capital sigma"), ["Phi"] = ("Φ", "capital phi"),
    };

    private static readonly IReadOnlyDictionary<string, (string Char, string Spoken)> Symbols =
        new Dictionary<string, (string Char, string Spoken)>
    {
        ["cdot"] = ("·", " times "), ["times"] = ("×", " times "),
        ["le"] = ("≤", " at most "), ["ge"] = ("≥", " at least "),
        ["infty"] = ("∞", "infinity"), ["to"] = ("→", " to "),
        ["approx"] = ("≈", " approximately "), ["ldots"] = ("…", "..."),
    };

    private static readonly string[] Functions = { "ln", "exp", "max", "min", "log", "arg" };

    /// <summary>
    /// Parses an equation; an unknown command or an unclosed brace is a <see cref="ComposeException"/>.
    /// </summary>
    public static Node Parse(string source, int line = 0)
    {
        int i = 0;
        var node = ParseSeq(source, ref i, line, closing: null);
        return node;
    }

    private static Node ParseSeq(string s, ref int i, int line, char? closing)
    {
        var items = new List<Node>();
        while (i < s.Length)
        {
            char c = s[i];
            if (closing is not null && c == closing) { i++; return items.Count == 1 ? items[0] : new Seq(items); }
            if (c is '_' or '^')
            {
                i++;
                var arg = ParseGroup(s, ref i, line);
                var last = items.Count > 0 ? items[^1] : new Sym("");
                if (items.Count > 0) items.RemoveAt(items.Count - 1);
                items.Add(last is Script sc
                    ? (c == '_' ? sc with { Sub = arg } : sc with { Sup = arg })
                    : (c == '_' ? new Script(last, arg, null) : new Script(last, null, arg)));
                continue;
            }
            var atom = ParseAtom(s, ref i, line);
            // A minus that opens a group or follows an operator or a bracket is a sign: no operator spacing.
            if (atom is Sym { Text: "\u2212" } && (items.Count == 0 || items[^1] is Sym { Text: "(" or "[" }
                || items[^1] is Sym { Spoken: [' ', ..] }))
                atom = new Sym("\u2212", Spoken: "minus ");
            if (atom is not null) items.Add(atom);
        }
        if (closing is not null)
            throw new ComposeException($"an equation has an unclosed '{{'. Got '{Short(s)}'.", line, s);
        return new Seq(items);
    }

    private static Node ParseGroup(string s, ref int i, int line)
    {
        while (i < s.Length && s[i] == ' ') i++;
        if (i >= s.Length) throw new ComposeException($"an equation ends after '_' or '^'. Got '{Short(s)}'.", line, s);
        return ParseAtom(s, ref i, line) ?? new Sym("");
    }

    private static Node? ParseAtom(string s, ref int i, int line)
    {
        char c = s[i];
        if (c == ' ') { i++; return null; }
        if (c == '{') { i++; return ParseSeq(s, ref i, line, '}'); }
        if (c == '}')
            throw new ComposeException($"an equation has a '}}' without its '{{'. Got '{Short(s)}'.", line, s);
        if (c != '\\')
        {
            i++;
            if (char.IsHighSurrogate(c) && i < s.Length) return new Sym(s.Substring(i - 1, 2));
            if (c == '-') return new Sym("\u2212", Spoken: " minus ");
            if (c == '*') return new Sym("*", Spoken: " star");
            if (c is '=' or '+' or '<' or '>') return new Sym(c.ToString(), Spoken: $" {c} ");
            return new Sym(c.ToString(), char.IsAsciiLetter(c));
        }
        i++;
        return ParseCommand(s, ref i, line);
    }

    /// <summary>A command after its backslash: an escaped character or space, or a named command (fraction, hat,
    /// large operator, text, space, Greek letter, symbol or function name).</summary>
    private static Node ParseCommand(string s, ref int i, int line)
    {
        if (i < s.Length && !char.IsAsciiLetter(s[i]))
        {
            char e = s[i++];
            return e switch
            {
                ',' => new Space(0.17),
                ';' => new Space(0.28),
                ' ' => new Space(0.25),
                '{' or '}' or '\\' or '_' or '^' or '$' => new Sym(e.ToString()),
                _ => throw new ComposeException(
                    $"an equation has an unknown command '\\{e}'. Got '{Short(s)}'.", line, s),
            };
        }
        int start = i;
        while (i < s.Length && char.IsAsciiLetter(s[i])) i++;
        string name = s[start..i];
        switch (name)
        {
            case "frac":
                var num = ParseGroup(s, ref i, line);
                var den = ParseGroup(s, ref i, line);
                return new Frac(num, den);
            case "hat":
                return new Hat(ParseGroup(s, ref i, line));
            case "int":
                return new BigOp("∫", "the integral", false);
            case "sum":
                return new BigOp("∑", "the sum", true);
            case "text":
                while (i < s.Length && s[i] == ' ') i++;
                if (i >= s.Length || s[i] != '{')
                    throw new ComposeException($"\\text needs its text in braces. Got '{Short(s)}'.", line, s);
                int end = s.IndexOf('}', i);
                if (end < 0)
                    throw new ComposeException($"an equation has an unclosed '{{'. Got '{Short(s)}'.", line, s);
                string text = s[(i + 1)..end];
                i = end + 1;
                return new Sym(text, Spoken: " " + text + " ");
            case "quad":
                return new Space(1);
        }
        if (Greek.TryGetValue(name, out var g)) return new Sym(g.Char, Spoken: " " + g.Name + " ");
        if (Symbols.TryGetValue(name, out var sym)) return new Sym(sym.Char, Spoken: sym.Spoken);
        if (Functions.Contains(name))
            return new Seq(new Node[] { new Sym(name, Spoken: " " + name + " "), new Space(0.17) });
        throw new ComposeException($"an equation has an unknown command '\\{name}'. Got '{Short(s)}'.", line, s);
    }

    private static string Short(string s) => s.Length <= 60 ? s : s[..60] + "…";

    /// <summary>The equation read out in words, for screen readers (the Formula element's alternative text).</summary>
    public static string Spoken(Node node)
    {
        var sb = new StringBuilder();
        Speak(node, sb);
        return string.Join(" ", sb.ToString().Split(' ', StringSplitOptions.RemoveEmptyEntries));
    }

    private static void Speak(Node node, StringBuilder sb)
    {
        switch (node)
        {
            case Sym s: sb.Append(s.Spoken ?? s.Text); break;
            case Seq q: foreach (var n in q.Items) Speak(n, sb); break;
            case Space: sb.Append(' '); break;
            case Hat h: sb.Append(' '); Speak(h.Body, sb); sb.Append(" hat "); break;
            case Frac f:
                sb.Append(" the fraction "); Speak(f.Num, sb); sb.Append(" over "); Speak(f.Den, sb); sb.Append(", ");
                break;
            case BigOp b: sb.Append(' ').Append(b.Spoken).Append(' '); break;
            case Script sc when sc.Base is BigOp op:
                sb.Append(' ').Append(op.Spoken);
                if (sc.Sub is not null) { sb.Append(" from "); Speak(sc.Sub, sb); }
                if (sc.Sup is not null) { sb.Append(" to "); Speak(sc.Sup, sb); }
                sb.Append(" of ");
                break;
            case Script sc:
                Speak(sc.Base, sb);
                if (sc.Sub is not null) { sb.Append(" sub "); Speak(sc.Sub, sb); sb.Append(' '); }
                if (sc.Sup is Sym { Text: "*" }) sb.Append(" star ");
                else if (sc.Sup is not null) { sb.Append(" to the power "); Speak(sc.Sup, sb); sb.Append(", "); }
                break;
        }
    }
}

/// <summary>
/// Lays out a parsed equation: glyphs and rules relative to the baseline, with width, ascent and descent.
/// </summary>
public sealed class MathBox
{
    public readonly record struct Glyph(string Text, double X, double Dy, FontSpec Font);
    public readonly record struct Rule(double X1, double X2, double Dy, double Thickness);

    public double Width { get; private set; }
    public double Ascent { get; private set; }
    public double Descent { get; private set; }
    public List<Glyph> Glyphs { get; } = new();
    public List<Rule> Rules { get; } = new();

    private void Add(MathBox other, double dx, double dy)
    {
        foreach (var g in other.Glyphs) Glyphs.Add(g with { X = g.X + dx, Dy = g.Dy + dy });
        foreach (var r in other.Rules) Rules.Add(r with { X1 = r.X1 + dx, X2 = r.X2 + dx, Dy = r.Dy + dy });
        Ascent = Math.Max(Ascent, other.Ascent - dy);
        Descent = Math.Max(Descent, other.Descent + dy);
        Width = Math.Max(Width, dx + other.Width);
    }

    /// <summary>Lays out <paramref name="node"/> at <paramref name="size"/> points.</summary>
    public static MathBox Layout(MathNotation.Node node, double size, ITextMeasurer measurer)
    {
        var box = new MathBox();
        switch (node)
        {
            case MathNotation.Sym s:
                if (s.Text.Length > 0) box.AddSymbol(s, size, measurer);
                break;
            case MathNotation.Space sp:
                box.Width = sp.Em * size;
                break;
            case MathNotation.Seq q:
                foreach (var item in q.Items) box.Add(Layout(item, size, measurer), box.Width, 0);
                break;
            case MathNotation.Hat h:
                box.AddHat(h, size, measurer);
                break;
            case MathNotation.Frac f:
                box.AddFraction(f, size, measurer);
                break;
            case MathNotation.BigOp b:
                box.AddBigOperator(b, size, measurer);
                break;
            case MathNotation.Script sc:
                return Scripts(sc, size, measurer);
        }
        return box;
    }

    /// <summary>A symbol in italic or upright type; an operator (spoken with spaces round it) gets space on both
    /// sides.</summary>
    private void AddSymbol(MathNotation.Sym s, double size, ITextMeasurer measurer)
    {
        var font = new FontSpec(s.Italic ? RunStyle.Italic : RunStyle.Regular, size);
        bool op = s.Spoken is { } sp && sp.StartsWith(' ') && sp.EndsWith(' ') && s.Text.Length == 1
                  && !char.IsLetter(s.Text[0]);
        double pad = op ? 0.22 * size : 0;
        double w = measurer.Width(s.Text, font);
        Glyphs.Add(new Glyph(s.Text, pad, 0, font));
        Width = w + 2 * pad + (s.Italic ? 0.04 * size : 0);
        Ascent = 0.72 * size;
        Descent = 0.21 * size;
    }

    /// <summary>The body with a circumflex drawn as two rules above it.</summary>
    private void AddHat(MathNotation.Hat h, double size, ITextMeasurer measurer)
    {
        var body = Layout(h.Body, size, measurer);
        Add(body, 0, 0);
        double top = -body.Ascent - 0.12 * size, mid = body.Width / 2 + 0.06 * size, half = 0.22 * size;
        Rules.Add(new Rule(mid - half, mid, top, -0.18 * size));
        Rules.Add(new Rule(mid, mid + half, top - 0.18 * size, 0.18 * size));
        Ascent = Math.Max(Ascent, body.Ascent + 0.36 * size);
    }

    /// <summary>Numerator over denominator, a little smaller, centred about a rule on the maths axis.</summary>
    private void AddFraction(MathNotation.Frac f, double size, ITextMeasurer measurer)
    {
        double inner = size * 0.9, axis = 0.27 * size, gap = 0.18 * size, pad = 0.12 * size;
        var num = Layout(f.Num, inner, measurer);
        var den = Layout(f.Den, inner, measurer);
        double w = Math.Max(num.Width, den.Width) + 2 * pad;
        Add(num, (w - num.Width) / 2, -axis - gap - num.Descent);
        Add(den, (w - den.Width) / 2, -axis + gap + den.Ascent);
        Rules.Add(new Rule(0, w, -axis, 0));
        Width = w + 0.1 * size;
    }

    /// <summary>A large operator (sum, integral), its middle on the maths axis.</summary>
    private void AddBigOperator(MathNotation.BigOp b, double size, ITextMeasurer measurer)
    {
        double big = size * (b.LimitsBelow ? 1.5 : 2.0);
        var font = new FontSpec(RunStyle.Regular, big);
        double w = measurer.Width(b.Symbol, font);
        // The glyph spans about 0.75 of its size above its baseline and 0.2 below; its middle goes on the
        // maths axis, 0.27 of the text size above the text's baseline.
        double dy = 0.275 * big - 0.27 * size;
        Glyphs.Add(new Glyph(b.Symbol, 0.05 * size, dy, font));
        Width = w + 0.15 * size;
        Ascent = 0.75 * big - dy;
        Descent = 0.2 * big + dy;
    }

    /// <summary>A base with a subscript and superscript: beside it, or centred above and below a large operator
    /// whose limits go below.</summary>
    private static MathBox Scripts(MathNotation.Script sc, double size, ITextMeasurer measurer)
    {
        var box = new MathBox();
        var baseBox = Layout(sc.Base, size, measurer);
        box.Add(baseBox, 0, 0);
        double small = size * 0.7;
        var sub = sc.Sub is null ? null : Layout(sc.Sub, small, measurer);
        var sup = sc.Sup is null ? null : Layout(sc.Sup, small, measurer);
        if (sc.Base is MathNotation.BigOp { LimitsBelow: true })
        {
            double w = Math.Max(baseBox.Width, Math.Max(sub?.Width ?? 0, sup?.Width ?? 0));
            box = new MathBox();
            box.Add(baseBox, (w - baseBox.Width) / 2, 0);
            if (sup is not null) box.Add(sup, (w - sup.Width) / 2, -baseBox.Ascent - 0.1 * size - sup.Descent);
            if (sub is not null) box.Add(sub, (w - sub.Width) / 2, baseBox.Descent + 0.1 * size + sub.Ascent);
            box.Width = w + 0.15 * size;
            return box;
        }
        bool op = sc.Base is MathNotation.BigOp;
        double x = baseBox.Width - (op ? 0.1 * size : 0);
        double up = op ? baseBox.Ascent - 0.55 * small : Math.Max(0.42 * size, baseBox.Ascent - 0.45 * size);
        double down = op ? baseBox.Descent - 0.05 * small : 0.22 * size;
        if (sup is not null) box.Add(sup, x + (op ? 0.1 * size : 0), -up);
        if (sub is not null) box.Add(sub, x - (op ? 0.15 * size : 0), down);
        box.Width = Math.Max(box.Width, x + Math.Max(sup?.Width ?? 0, sub?.Width ?? 0) + 0.05 * size);
        return box;
    }
}

/// <summary>
/// A display equation, centred, drawn inside a Formula structure element with its spoken form as alternative text.
/// </summary>
public sealed class MathAtom : Atom
{
    public required MathBox Box { get; init; }
    public required string AltText { get; init; }
    public required string Source { get; init; }

    public override string Describe() => $"the equation '{(Source.Length <= 40 ? Source : Source[..40] + "…")}'";

    public override void Draw(IDrawingSurface surface, Theme theme, double x, double y)
    {
        double left = x + (theme.ContentWidth - Box.Width) / 2;
        double baseline = y + 3 + Box.Ascent;
        surface.BeginTag(StructTag.Formula, AltText, new Box(left, y, Box.Width, Height));
        foreach (var g in Box.Glyphs) surface.Text(g.Text, left + g.X, baseline + g.Dy, g.Font, theme.Text);
        foreach (var r in Box.Rules)
        {
            double thickness = r.Thickness == 0 ? 0.55 : 0.6;
            // A rule with a thickness other than 0 is a slanted stroke (the hat): Thickness is its rise.
            double y2 = r.Thickness == 0 ? baseline + r.Dy : baseline + r.Dy + r.Thickness;
            surface.Line(left + r.X1, baseline + r.Dy, left + r.X2, y2, theme.Text, thickness);
        }
        surface.EndTag();
    }
}
