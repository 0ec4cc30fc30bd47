using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using Briefwright.Composer.Layout;
using Briefwright.Composer.Markdown;

namespace Briefwright.Composer.Tests;

/// <summary>
/// The math notation: parsed, laid out with sizes and baselines, drawn inside a Formula element with spoken alternative
/// text.
/// </summary>
public class MathTests
{
    /// <summary>Every character 0.5 of the font size wide, so sizes show in widths.</summary>
    private sealed class ScaledMeasurer : ITextMeasurer
    {
        public double Width(string text, FontSpec font) => text.Length * font.Size * 0.5;
        public double Ascent(FontSpec font) => font.Size * 0.8;
    }

    private static readonly ScaledMeasurer Measurer = new();

    private static MathBox Lay(string source, double size = 10)
        => MathBox.Layout(MathNotation.Parse(source), size, Measurer);

    [Fact]
    public void A_superscript_is_smaller_and_raised_and_a_subscript_smaller_and_lowered()
    {
        var box = Lay("x^{2}_{i}");
        var x = box.Glyphs.Single(g => g.Text == "x");
        var two = box.Glyphs.Single(g => g.Text == "2");
        var i = box.Glyphs.Single(g => g.Text == "i");
        Assert.Equal(10, x.Font.Size);
        Assert.Equal(7, two.Font.Size, 6);
        Assert.Equal(7, i.Font.Size, 6);
        Assert.True(two.Dy < 0, "the superscript sits above the baseline");
        Assert.True(i.Dy > 0, "the subscript sits below the baseline");
        Assert.Equal(RunStyle.Italic, x.Font.Style);
        Assert.True(two.X >= x.X + 5 - 1e-9, "scripts follow their base");
    }

    [Fact]
    public void A_fraction_puts_its_numerator_above_a_rule_and_its_denominator_below()
    {
        var box = Lay(@"\frac{a+b}{c}");
        var rule = Assert.Single(box.Rules);
        var a = box.Glyphs.Single(g => g.Text == "a");
        var c = box.Glyphs.Single(g => g.Text == "c");
        Assert.True(a.Dy < rule.Dy && c.Dy > rule.Dy);
        Assert.True(rule.Dy < 0, "the rule is on the maths axis, above the baseline");
        // The rule spans the wider part; the denominator is centred under it.
        double cCentre = c.X + 0.5 * c.Font.Size * 0.5;
        Assert.True(
            Math.Abs((rule.X1 + rule.X2) / 2 - cCentre) < 0.5,
            $"denominator centred at {cCentre}, rule at {(rule.X1 + rule.X2) / 2}");
        Assert.True(box.Ascent > 10 && box.Descent > 5, "a fraction is taller than a line of text");
    }

    [Fact]
    public void Integrals_and_sums_are_large_with_their_limits()
    {
        var integral = Lay(@"\int_{0}^{R} f");
        var sign = integral.Glyphs.Single(g => g.Text == "∫");
        Assert.True(sign.Font.Size > 15);
        var upper = integral.Glyphs.Single(g => g.Text == "R");
        var lower = integral.Glyphs.Single(g => g.Text == "0");
        Assert.True(upper.Dy < lower.Dy);
        Assert.True(upper.X > sign.X, "an integral's limits sit to the right of the sign");
        var sum = Lay(@"\sum_{i=1}^{n} x_{i}");
        var sigma = sum.Glyphs.Single(g => g.Text == "∑");
        var n = sum.Glyphs.First(g => g.Text == "n");
        Assert.True(n.Dy < sigma.Dy - 10, "a sum's upper limit sits above the sign");
    }

    [Fact]
    public void Greek_letters_hats_stars_functions_and_minus_are_written_as_meant()
    {
        var box = Lay(@"\hat{y}^{*} = \alpha \ln (1-\Omega) \cdot e^{-n}");
        string text = string.Concat(box.Glyphs.Select(g => g.Text));
        Assert.Contains("α", text);
        Assert.Contains("Ω", text);
        Assert.Contains("ln", text);
        Assert.Contains("·", text);
        Assert.Contains("\u2212", text);
        Assert.DoesNotContain("-", text);
        Assert.Equal(RunStyle.Regular, box.Glyphs.Single(g => g.Text == "ln").Font.Style);
        Assert.Equal(2, box.Rules.Count); // the hat's two strokes
        string spoken = MathNotation.Spoken(MathNotation.Parse(@"\hat{y}^{*} = \frac{s}{n}"));
        Assert.Equal("y hat star = the fraction s over n,", spoken);
    }

    [Theory]
    [InlineData(@"\frac{a}{b")]
    [InlineData(@"\unknown{x}")]
    [InlineData(@"x^")]
    [InlineData(@"a}")]
    public void A_malformed_equation_is_an_error_that_quotes_it(string source)
    {
        var e = Assert.Throws<ComposeException>(() => MathNotation.Parse(source, 12));
        Assert.Equal(12, e.Line);
        Assert.Contains("equation", e.Message);
    }

    [Fact]
    public void A_display_equation_in_the_text_is_drawn_inside_a_formula_element_with_alternative_text()
    {
        string markdown = "Before.\n\n$$\\omega(E) = p \\cdot \\frac{\\int_{a_0}^{R} l(a)\\, da}{\\int_{0}^{\\Omega} " +
            "l(a)\\, da}$$\n\nAfter *this*.\n";
        var blocks = MarkdownReader.Read(markdown, new Dictionary<string, FigureBlock>());
        var math = Assert.Single(blocks.OfType<MathBlock>());
        Assert.StartsWith("\\omega(E)", math.Source);
        var brief = new BriefDocument(
            new DocumentInfo("T", "S", "A", "S", "K", "en-GB", new DateOnly(2026, 11, 30), "E", "F"),
            blocks);
        var theme = new Theme();
        var pages = DocumentComposer.Layout(brief, theme, Measurer);
        var surface = new AltRecordingSurface();
        DocumentComposer.Draw(brief, theme, pages, surface, Measurer);
        var (alt, box) = Assert.Single(surface.Formulas);
        Assert.Contains("omega", alt);
        Assert.Contains("the integral from a sub 0 to R of", alt);
        Assert.True(box.Width > 0 && box.Height > 20);
        // Centred on the content width.
        Assert.Equal(theme.MarginLeft + theme.ContentWidth / 2, box.X + box.Width / 2, 3);
    }

    [Fact]
    public void Escaped_dollars_from_scenario_text_are_never_an_equation()
    {
        var blocks = MarkdownReader.Read("\\$\\$x\\$\\$\n", new Dictionary<string, FigureBlock>());
        Assert.Empty(blocks.OfType<MathBlock>());
    }

    private sealed class AltRecordingSurface : IDrawingSurface
    {
        private readonly RecordingSurface inner = new();
        public List<(string Alt, Box Box)> Formulas { get; } = new();
        public void BeginPage(int pageIndex, double width, double height) => inner.BeginPage(pageIndex, width, height);
        public void EndPage() => inner.EndPage();
        public void BeginTag(StructTag tag, string? altText = null, Box? bounds = null)
        {
            if (tag == StructTag.Formula) Formulas.Add((altText ?? "", bounds ?? default));
            inner.BeginTag(tag, altText, bounds);
        }

        public void EndTag() => inner.EndTag();
        public void BeginArtifact() => inner.BeginArtifact();
        public void EndArtifact() => inner.EndArtifact();
        public void Text(string text, double x, double baseline, FontSpec font, Rgb color)
            => inner.Text(text, x, baseline, font, color);
        public void FillRect(Box box, Rgb color) => inner.FillRect(box, color);
        public void Line(double x1, double y1, double x2, double y2, Rgb color, double width)
            => inner.Line(x1, y1, x2, y2, color, width);
        public void Figure(string id, byte[] pdf, int page, Box box) => inner.Figure(id, pdf, page, box);
        public void BeginLink(Box box, string url, string text) => inner.BeginLink(box, url, text);
        public void EndLink() => inner.EndLink();
        public void Image(byte[] png, Box box) => inner.Image(png, box);
        public void Outline(int level, string title, double y) => inner.Outline(level, title, y);
    }
}
