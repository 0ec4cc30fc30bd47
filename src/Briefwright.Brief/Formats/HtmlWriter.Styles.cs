using System.Globalization;
using Briefwright.Composer.Document;
using Briefwright.Composer.Layout;

namespace Briefwright.Brief.Formats;

/// <summary>The web page's style sheet: the theme's colours and font, screen and print rules.</summary>
public sealed partial class HtmlWriter
{
    private static string Hex(Rgb c) => $"#{c.R:X2}{c.G:X2}{c.B:X2}";

    /// <summary>The theme's colours as CSS custom properties (<c>--accent</c>, <c>--text</c>...).</summary>
    private static string Variables(Theme t) =>
        $"--accent: {Hex(t.Accent)}; --text: {Hex(t.Text)}; --muted: {Hex(t.Muted)}; --rule: {Hex(t.Rule)}; " +
        $"--box: {Hex(t.BoxFill)}; --header: {Hex(t.HeaderFill)}; --stripe: {Hex(t.StripeFill)};";

    private static string Css(double value) => value.ToString(CultureInfo.InvariantCulture);

    // The declarations of the longer rules of the style sheet below.
    private const string MastheadRule = "display: flex; flex-wrap: wrap; align-items: center; gap: .25rem 1rem; " +
        "border-bottom: 2px solid var(--accent); padding-bottom: .5rem;";
    private const string TitleRule = "color: var(--accent); font-size: 1.9rem; line-height: 1.2; " +
        "margin: 1.25rem 0 .75rem; padding-bottom: .4rem; border-bottom: 1px solid var(--rule);";
    private const string CaptionRule =
        "text-align: left; font-size: .875rem; font-weight: bold; color: var(--text); padding-bottom: .4rem;";

    /// <summary>
    /// The theme's look: its colours, the brief's type sizes, a readable measure on screen, and pages in print.
    /// </summary>
    private static string Styles(Theme t, string? family, PaperSize paper)
    {
        string fonts = (family is null ? "" : $"\"{family.Replace("\"", "", StringComparison.Ordinal)}\", ")
            + "\"Liberation Sans\", Arial, Helvetica, sans-serif";
        string page = paper == PaperSize.Letter ? "letter" : "A4";
        return $$"""
:root { {{Variables(t)}} }
html { font-family: {{fonts}}; color: var(--text); background: #fff; line-height: {{Css(t.LineFactor)}}; }
body { max-width: 46rem; margin: 0 auto; padding: 1rem 1.25rem 3rem; font-size: 1rem; }
a { color: var(--accent); }
.skip { position: absolute; left: -9999px; }
.skip:focus { left: 1rem; top: 1rem; background: #fff; padding: .25rem .5rem; }
.masthead { {{MastheadRule}} }
.masthead .logo { order: 2; margin-left: auto; max-height: 3rem; width: auto; }
.masthead p { margin: 0; }
.org { font-weight: bold; color: var(--accent); }
.stamp { color: var(--muted); font-size: .875rem; }
.marker { font-weight: bold; color: #A4161A; letter-spacing: .1em; }
nav { font-size: .875rem; margin: 1rem 0; }
.toc-title { font-weight: bold; margin: 0; }
nav ol { margin: .25rem 0; padding-left: 1.5rem; }
h1 { {{TitleRule}} }
h2 { color: var(--accent); font-size: 1.35rem; margin: 2rem 0 .5rem; }
h3 { color: var(--accent); font-size: 1.1rem; margin: 1.5rem 0 .4rem; }
.num { display: inline-block; min-width: 1.6em; }
.box { background: var(--box); border-left: 4px solid var(--accent); padding: .5rem 1rem; margin: 1rem 0; }
.box .box-title { margin: .25rem 0; font-size: 1.1rem; }
figure { margin: 1.5rem 0; }
figcaption, caption { {{CaptionRule}} }
.label { color: var(--accent); }
figure svg { display: block; width: 100%; height: auto; max-width: 40rem; }
.source { font-size: .8rem; color: var(--muted); margin: .3rem 0 1rem; }
.table-wrap { overflow-x: auto; margin: 1.5rem 0 0; }
.table-wrap:focus { outline: 2px solid var(--accent); }
table { border-collapse: collapse; width: 100%; font-size: .875rem; }
th, td { padding: .3rem .5rem; border-bottom: 1px solid var(--rule); vertical-align: top; text-align: left; }
thead th { background: var(--header); border-bottom: 2px solid var(--accent); }
tbody th { font-weight: normal; }
tbody tr:nth-child(even) { background: var(--stripe); }
.r { text-align: right; font-variant-numeric: tabular-nums; }
.c { text-align: center; }
footer { margin-top: 3rem; border-top: 1px solid var(--rule); font-size: .8rem; color: var(--muted); }
code { font-size: .75rem; word-break: break-all; }
@media print {
  @page { size: {{page}}; margin: 18mm 16mm; }
  html { font-size: 10pt; }
  body { max-width: none; padding: 0; }
  .skip, nav { display: none; }
  a { color: inherit; text-decoration: none; }
  h1, h2, h3 { break-after: avoid; }
  figure, .box, tr { break-inside: avoid; }
  thead { display: table-header-group; }
  .table-wrap { overflow: visible; }
  .page-break { break-before: page; }
  tbody tr:nth-child(even), thead th, .box { print-color-adjust: exact; -webkit-print-color-adjust: exact; }
}

""";
    }
}
